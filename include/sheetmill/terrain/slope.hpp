#pragma once
// Slope of a Dem: the steepest gradient at each cell, from Horn's (1981) or Zevenbergen and
// Thorne's (1987) gradient, in degrees (0..90) or percent (100 * rise / run). NaN where the
// Dem has no data; edges and hole borders are computed from what exists (see shade.hpp).
// Elevations are not exaggerated: slope is a physical quantity.

#include <string>
#include <vector>

#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::terrain {

enum class SlopeUnits { degrees, percent };

struct SlopeParams {
  SlopeUnits units = SlopeUnits::degrees;
  bool zevenbergen_thorne = false;  // else Horn
};

// "degrees" or "percent"; throws Error(input) otherwise.
SlopeUnits parse_slope_units(const std::string& name);

std::vector<float> slope(const Dem& dem, const SlopeParams& params);
// Rows [row0, row1) into out (width * (row1 - row0) values). Single-threaded.
void slope_rows(const Dem& dem, const SlopeParams& params, int row0, int row1, float* out);

}  // namespace sheetmill::terrain
