#pragma once
// Cutting channels and valleys into the DEM along water lines, and the final guarantee that
// every water line runs downhill in the DEM.
//
// carve_channel lowers cells (never raises them) to a trough around the line: a flat floor at
// the bed height, a low bank, then valley sides rising at side_slope, out to reach_m. Bed
// heights are per vertex and interpolated along each segment; they must not rise downstream.

#include <functional>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/demo/grid.hpp"

namespace sheetmill::demo {

struct ChannelProfile {
  double floor_half_width_m = 4;
  double bank_height_m = 1;
  double bank_width_m = 2;
  double side_slope = 0.3;  // rise per metre beyond the bank
  double reach_m = 100;     // cells farther than this from the line are left alone
};

void carve_channel(FloatGrid& dem, const Polyline& line, const std::vector<double>& bed_m,
                   const ChannelProfile& profile);

// Lowers the cells under any vertex that stands higher (bilinear) than the vertex before it,
// until no vertex of any line does; cells for which frozen(col, row) is true are never changed.
// Returns the number of cells lowered.
int enforce_downhill(FloatGrid& dem, const std::vector<Polyline>& lines,
                     const std::function<bool(int, int)>& frozen);

}  // namespace sheetmill::demo
