#pragma once
// The invented Harrowmere Valley: the large-scale layout of the demo area, fixed by the seed
// before any cell is computed. Coordinates are EPSG:32632 metres; the area is always
// E 470000-490000, N 5190000-5205000 (other stages' projects rely on that origin).
//
// The river flows from the east edge to the west edge along a broad valley in the south half,
// through a lake (Harrowmere); a south-facing escarpment bounds a limestone plateau in the north.
// The valley, river and escarpment are functions of easting, so every northing line crosses
// each of them once.

#include <cstdint>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/demo/grid.hpp"

namespace sheetmill::demo {

inline constexpr double kAreaWest = 470000;
inline constexpr double kAreaSouth = 5190000;
inline constexpr double kAreaWidthM = 20000;
inline constexpr double kAreaHeightM = 15000;
inline constexpr int kEpsg = 32632;

struct Scenario {
  std::uint64_t seed = 0;
  GridSpec dem;  // the output grid (4000 x 3000 at 5 m for size scale 1)

  // Phases and amplitudes drawn from the seed.
  double valley_phase[2] = {0, 0};
  double meander_phase[2] = {0, 0};
  double floodplain_phase = 0;
  double escarpment_phase[3] = {0, 0, 0};

  // The lake: an irregular oval on the valley axis; the river enters at its east end.
  Point lake_centre;
  double lake_semi_axis_m[2] = {950, 360};  // east-west, north-south
  Polyline lake_ring;                       // shore, closed implicitly
  float lake_level_m = 0;

  // Local easting/northing in metres from the area's south-west corner.
  static double u_of(double x) { return x - kAreaWest; }
  static double v_of(double y) { return y - kAreaSouth; }

  double valley_axis_y(double x) const;
  double floodplain_half_width_m(double x) const;
  double river_y(double x) const;
  // River bed height; strictly decreasing downstream (westward).
  double river_bed_m(double x) const;
  double escarpment_y(double x) const;
  double escarpment_width_m(double x) const;
  // 0 on the lake shore, < 0 inside, about (r/R - 1) outside: a cheap distance-like measure.
  double lake_shape(Point p) const;
};

// The layout for a seed; size_scale 1 gives the full 4000 x 3000 grid at 5 m, smaller values a
// coarser grid over the same ground (for fast tests).
Scenario make_scenario(std::uint64_t seed, double size_scale);

}  // namespace sheetmill::demo
