#pragma once
// How a DEM is resampled into a sheet's print grid before its gradient is taken.
//
// A hillshade shows the gradient, so the resampled surface must have a continuous gradient when
// the print grid is finer than the DEM: bilinear interpolation is only C0 (its gradient jumps at
// every source-cell edge, and each DEM cell prints as a flat-shaded square). Cubic convolution
// (Keys 1981, a = -0.5; GDAL's "cubic") is C1 and interpolating, so the relief stays smooth and
// still passes through the DEM's samples that the contours and spot heights are drawn from.
// When a print cell spans several DEM cells the DEM is averaged over the print cell instead
// (a box filter, GDAL's "average"), so detail finer than a print cell does not alias.

#include <string>

namespace sheetmill::terrain {

enum class Resampling {
  automatic,  // cubic when upsampling, average from kAverageFromCells DEM cells per print cell
  cubic,      // Keys (1981) cubic convolution, a = -0.5
  bilinear,
  average,  // area-weighted mean of the DEM cells under each print cell
};

// A print cell at least this many DEM cells wide is averaged by `automatic`. Below it a box
// average covers at most 2 x 2 DEM cells and prints blockier than cubic convolution does.
inline constexpr double kAverageFromCells = 2.0;

// "auto", "cubic", "bilinear", "average"; throws Error(input) otherwise.
Resampling parse_resampling(const std::string& name);
const char* resampling_name(Resampling r);

// The kernel to use for a print cell of `print_cell_m` over a DEM of `dem_cell_m` (both ground
// metres): `asked` itself unless it is automatic.
Resampling choose_resampling(Resampling asked, double print_cell_m, double dem_cell_m);

}  // namespace sheetmill::terrain
