#pragma once
// The outline of a DEM (its raster edges, densified) in a sheet CRS: for location diagrams and
// insets, and for how far a frame may grow and still show terrain. Opens the raster: call it
// while reading or preparing, never while drawing.

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::sheet {

// `dem_crs` stands in when the raster states none. Empty when the raster has no geotransform
// or no CRS; edge pieces outside the sheet projection's domain are left out. Throws
// Error(input) when GDAL cannot open the raster.
std::vector<Point> dem_footprint(const std::string& dem, const std::optional<std::string>& dem_crs,
                                 const std::string& sheet_crs);

}  // namespace sheetmill::sheet
