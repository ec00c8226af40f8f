#pragma once
// Relief rasters in the DEM's own grid, written as tiled (256 x 256), compressed GeoTIFF with the
// DEM's georeferencing. The DEM is processed in bands of rows (each read with one row of margin
// above and below, so bands join exactly), so memory is bounded by a band, not by the raster.
// Output appears whole or not at all (written to a temporary file, renamed on success).
//
//   hillshade: Byte, 0 = nodata, 1 + 254 * illumination (see shade.hpp)
//   slope:     Float32 degrees or percent; holes are 0 and masked by a per-dataset mask (no
//              nodata value: 0 is also the slope of flat ground)
//   tint:      Byte RGB with a per-dataset mask for holes, or RGBA with alpha 0 in holes

#include <functional>
#include <string>

#include "sheetmill/terrain/dem.hpp"
#include "sheetmill/terrain/relief.hpp"
#include "sheetmill/terrain/shade.hpp"
#include "sheetmill/terrain/slope.hpp"

namespace sheetmill::terrain {

struct ProductOptions {
  DemReadOptions read;
  // Called with the fraction done (0..1) after each band of rows; may be empty.
  std::function<void(double)> progress;
  int band_rows = 512;  // rows per band (a multiple of the 256-row output tiles)
  // "zstd" (level 1: fastest, GDAL/libtiff 4.0.10 and later) or "deflate" (level 6: read by
  // every TIFF reader).
  std::string compression = "zstd";
};

void write_hillshade_raster(const std::string& dem_path, const std::string& out_path,
                            const ShadeParams& params, const ProductOptions& options = {});
void write_slope_raster(const std::string& dem_path, const std::string& out_path,
                        const SlopeParams& params, const ProductOptions& options = {});
// Tinted (and, when params.shade, shaded) relief; params.tint must be set with a ramp.
void write_tint_raster(const std::string& dem_path, const std::string& out_path,
                       const ReliefParams& params, bool rgba, const ProductOptions& options = {});

}  // namespace sheetmill::terrain
