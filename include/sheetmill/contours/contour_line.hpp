#pragma once
// Contour lines as values: one level, one polyline in ground metres of the sheet CRS, and the
// flags the drawing and the output layer need. Every line the stage returns is oriented so that
// the HIGHER ground lies to its LEFT (ground coordinates, y up); closed lines repeat no point
// (the closing segment is implied). Elevations are in the DEM's vertical unit (metres unless
// the project says otherwise); the `_m` names keep the project's convention.

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/map_frame.hpp"

namespace sheetmill::contours {

struct ContourLine {
  double elevation_m = 0;
  bool index = false;          // every index_every-th level counted from the base
  bool supplementary = false;  // half-interval line in gentle ground
  bool depression = false;     // closed line around lower ground
  bool closed = false;
  bool uphill_known = true;  // false for supplied lines read without a DEM
  bool depth = false;        // below the sea level: a depth contour (never a depression)
  bool coastline = false;    // at the sea level itself
  double depth_m = 0;        // depth below the sea level, for depth lines (same unit)
  Polyline ground;           // >= 2 points; higher ground on the left (when uphill_known)
};

struct ContourParams {
  double interval_m = 10;
  double base_m = 0;
  int index_every = 5;               // common practice: every fifth line
  double scale_denominator = 25000;  // sets the print sizes below in ground metres
  double smoothing_mm = 0.25;        // generalisation tolerance on paper
  double min_loop_mm = 1.5;          // closed loops shorter than this on paper are dropped
  bool supplementary = false;        // half-interval lines where the ground is gentle
  double supplementary_max_slope_deg = 3;
  double supplementary_min_mm = 10;  // shorter supplementary pieces are dropped
  // The sea (or water surface) level: lines below it are depth contours, the line at it is the
  // coastline. Unset: no sea.
  std::optional<double> sea_level_m;
};

// Sets the depth and coastline flags of `line` from params.sea_level_m (and clears depression
// on depth lines: a hollow of the sea floor is shown by its depths, not by ticks).
void mark_depth(ContourLine& line, const ContourParams& params);

// Throws Error(input) naming the key when the parameters cannot make contours
// (interval <= 0, index_every < 1, scale <= 0).
void validate(const ContourParams& params);

// The level number of `elevation_m` counted from the base in whole intervals (rounded).
long level_number(double elevation_m, const ContourParams& params);

}  // namespace sheetmill::contours
