#pragma once
// Height points taken from the finished DEM: summits (local maxima, named) and survey control
// points (benchmarks along roads, trig points on hill tops). Every point stands on a cell centre,
// so its DEM height is the cell's value exactly, whatever interpolation a reader uses.

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/names.hpp"

namespace sheetmill::demo {

// Up to `count` summits: cells highest within radius_m around them, highest first.
std::vector<Summit> find_summits(const FloatGrid& dem, int count, double radius_m,
                                 NameMaker& names);

// Benchmarks every ~spacing_m along the roads and trig points on the summits. elevation_m is
// the DEM value rounded to 0.01 m plus a deterministic residual of at most 0.04 m (a stand-in
// for the difference between a levelled height and a DEM).
std::vector<ControlPoint> make_control_points(const FloatGrid& dem, const std::vector<Road>& roads,
                                              const std::vector<Summit>& summits, double spacing_m,
                                              std::uint64_t seed);

// The centre of the cell containing p.
Point snap_to_cell_centre(const GridSpec& spec, Point p);

}  // namespace sheetmill::demo
