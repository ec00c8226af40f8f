#pragma once
// Land cover from terrain and settlement: woods on steep slopes and in large noise-shaped
// blocks, orchards around villages and hamlets, marsh on the floodplain, the lake shore and in
// filled hollows, scrub on the steepest faces and at wood edges. Classified on a 25 m grid,
// traced into polygons with GDAL's polygonizer, simplified (topology kept) and stripped of
// pieces under one hectare.

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/scenario.hpp"

namespace sheetmill::demo {

// wet: cells (on the DEM grid) depression filling raised by more than a few decimetres.
std::vector<LandcoverArea> classify_landcover(const Scenario& s, const FloatGrid& dem,
                                              const std::vector<char>& wet,
                                              const std::vector<Place>& places);

}  // namespace sheetmill::demo
