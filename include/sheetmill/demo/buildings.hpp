#pragma once
// Buildings as small rotated rectangles with their long side to the street: houses lining the
// roads and streets of each village and hamlet, a church set back from a street near each
// village centre, works by the railway (reached by a short track, added to settled.tracks),
// and farmsteads (house and barns) at the end of their tracks. None stands on water (lines or
// ponds), on a road or track, on another building, or on ground steeper than 20 %; every one
// is within 30 m of a road or track.

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/hydrography.hpp"
#include "sheetmill/demo/scenario.hpp"
#include "sheetmill/demo/settlements.hpp"

namespace sheetmill::demo {

std::vector<Building> place_buildings(const Scenario& s, const FloatGrid& dem,
                                      const Hydrography& water, const std::vector<WaterArea>& ponds,
                                      Settlements& settled);

}  // namespace sheetmill::demo
