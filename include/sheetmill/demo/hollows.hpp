#pragma once
// Closed depressions the DEM keeps on purpose: sinkholes (dolines) on the limestone plateau and
// farm ponds. Both lower cells only, stay clear of every water line (so no stream depends on
// what they drain), and are placed after depression filling so they survive it.

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/scenario.hpp"

namespace sheetmill::demo {

struct Sinkhole {
  Point centre;
  double radius_m = 0;
  double depth_m = 0;
};

// Up to `count` bowls 16-24 m deep and 55-80 m in radius, at least 250 m from water lines.
std::vector<Sinkhole> dig_sinkholes(const Scenario& s, FloatGrid& dem,
                                    const std::vector<Polyline>& water_lines, int count);

// A pond next to some farms: cells inside its ring are set to one level just below the
// lowest of them, so the pond's surface is flat. Returns the ponds made.
std::vector<WaterArea> dig_ponds(const Scenario& s, FloatGrid& dem,
                                 const std::vector<Place>& places,
                                 const std::vector<Polyline>& keep_clear, int count);

}  // namespace sheetmill::demo
