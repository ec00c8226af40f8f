#pragma once
// Internal to the contours stage (public for its tests): GDAL's contour generator (marching
// squares) over a DEM held in memory, run on both cores. The DEM is cut into two bands of rows that
// share their seam row; each band is contoured in its own thread and the pieces are joined again at
// the seam.

#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::contours::detail {

struct RawContour {
  double elevation_m = 0;
  Polyline points;  // closed lines repeat their first point at the end, as GDAL writes them
};

// Every level base + k * step across the DEM (NaN cells are holes). Throws Error(internal) when
// GDAL fails.
std::vector<RawContour> gdal_contours(const terrain::Dem& dem, double step, double base);

// GDAL's generator over rows [row0, row1) of `dem` alone, in one thread, without copying the
// values.
std::vector<RawContour> contour_rows(const terrain::Dem& dem, int row0, int row1, double step,
                                     double base);

// The joining step on its own (for tests): `upper` comes from rows [0, seam], `lower` from rows
// [seam, height) of a grid with this geotransform. GDAL carries each line on to the band's
// outer edge, half a cell beyond the last row of cell centres; at the seam that extension is
// cut off and the two ends, which lie on the seam row at the same crossing, are joined.
std::vector<RawContour> join_at_seam(std::vector<RawContour> upper, std::vector<RawContour> lower,
                                     const double geotransform[6], int seam);

}  // namespace sheetmill::contours::detail
