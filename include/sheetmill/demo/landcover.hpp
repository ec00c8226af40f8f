#pragma once
// Land cover from terrain, water and settlement: woods on steep ground, in large noise-shaped
// blocks and along streams; orchards near villages and hamlets on gentle slopes; marsh on flat
// wet ground (a high topographic wetness index, Beven & Kirkby 1979: ln(a / tan b)), the lake
// shore, the lowest floodplain and filled hollows; scrub on the steepest faces and in gaps of
// woods.
//
// Each kind has a smooth score on a 25 m grid (soft ramps of slope, wetness, distances and
// noise, blurred); a kind holds where its score is positive and beats every other. The
// outlines are the zero contours of those fields at sub-cell precision (marching squares with
// linear interpolation, see isolines.hpp), smoothed by Chaikin corner cutting; pieces under one
// hectare are dropped.

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/scenario.hpp"

namespace sheetmill::demo {

// wet: cells (on the DEM grid) depression filling raised by more than a few decimetres.
std::vector<LandcoverArea> classify_landcover(const Scenario& s, const FloatGrid& dem,
                                              const std::vector<char>& wet,
                                              const std::vector<Place>& places,
                                              const std::vector<WaterLine>& water);

}  // namespace sheetmill::demo
