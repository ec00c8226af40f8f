#pragma once
// Writing the demo area's files with GDAL. Every function creates its file anew and throws
// sheetmill::Error (input: the folder cannot be written; internal: GDAL refused a valid value)
// naming the file; nothing is left half-written in a way the caller cannot detect, because the
// whole area is generated in a scratch folder that is renamed only when complete.

#include <filesystem>
#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"

namespace sheetmill::demo {

// Float32 GeoTIFF in EPSG:32632, tiled 256 x 256, DEFLATE with the floating-point predictor,
// nodata -9999. Same grid values -> same bytes.
void write_dem_geotiff(const std::filesystem::path& path, const FloatGrid& dem);

// features.gpkg with the layers and fields documented in docs/demo-area.md.
void write_features_gpkg(const std::filesystem::path& path, const DemoFeatures& features);

// tiles.gpkg, layer `sheets`.
void write_tiles_gpkg(const std::filesystem::path& path, const std::vector<SheetTile>& sheets);

}  // namespace sheetmill::demo
