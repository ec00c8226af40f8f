#pragma once
// Buildings as small rotated rectangles: houses lining the roads of each village and hamlet,
// a church near each village centre, works by the railway, and farmsteads (house and barns).
// None stands on water, on a road, on another building, or on ground steeper than 20 %.

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/hydrography.hpp"
#include "sheetmill/demo/scenario.hpp"
#include "sheetmill/demo/settlements.hpp"

namespace sheetmill::demo {

std::vector<Building> place_buildings(const Scenario& s, const FloatGrid& dem,
                                      const Hydrography& water, const Settlements& settled);

}  // namespace sheetmill::demo
