#include "sheetmill/terrain/dem_source.hpp"

#include <cpl_conv.h>
#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <limits>

#include "sheetmill/config/bounds.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "terrain/dem_georef.hpp"

namespace sheetmill::terrain {

namespace {
DatasetPtr open_for_rows(const std::string& path) {
  // Uncompressed GeoTIFF cells are then copied straight from a memory map instead of through
  // the block cache (about half the system time); other formats ignore it. The GeoTIFF driver
  // reads the option when opening; the setter is thread-local and respects a user's setting.
  CPLConfigOptionSetter vmem("GTIFF_VIRTUAL_MEM_IO", "IF_ENOUGH_RAM", true);
  return open_raster(path);
}
}  // namespace

DemSource::DemSource(const std::string& path, const DemReadOptions& options)
    : path_(path), ds_(open_for_rows(path)) {
  if (ds_->GetRasterCount() < 1) throw_input_error(path, "the raster has no bands");
  grid_.width = ds_->GetRasterXSize();
  grid_.height = ds_->GetRasterYSize();
  if (static_cast<double>(grid_.width) * grid_.height > config::bounds::max_relief_raster_cells) {
    throw_input_error(
        path, fmt::format("the DEM is {} x {} cells; a relief raster is written in "
                          "the DEM's own grid, at most {:g} cells: cut a window "
                          "(gdal_translate -projwin) or resample it "
                          "(gdal_translate -outsize) first",
                          grid_.width, grid_.height, config::bounds::max_relief_raster_cells));
  }
  if (ds_->GetGeoTransform(grid_.geotransform) != CE_None) {
    throw_input_error(path, "the DEM has no geotransform (it is not georeferenced)");
  }
  const double* gt = grid_.geotransform;
  if (gt[2] != 0 || gt[4] != 0 || gt[1] <= 0 || gt[5] >= 0) {
    throw_input_error(path, "the DEM's grid is rotated or flipped; warp it north-up first");
  }
  srs_ = detail::dem_crs(*ds_, options, path);
  grid_.crs_wkt = crs_wkt(srs_);
  scale_ = detail::ground_scale(srs_);
  GDALRasterBand* band = ds_->GetRasterBand(1);
  double z_factor = detail::metres_per_z_unit(*band, srs_, options, path);
  int ok = 0;
  double scale = band->GetScale(&ok);
  if (!ok) scale = 1;
  double offset = band->GetOffset(&ok);
  if (!ok) offset = 0;
  mul_ = scale * z_factor;
  add_ = offset * z_factor;
  int has = 0;
  nodata_ = band->GetNoDataValue(&has);
  has_nodata_ = has != 0;
}

Dem DemSource::read_rows(int row0, int rows) const {
  Dem dem;
  read_rows_into(row0, rows, dem);
  return dem;
}

void DemSource::read_rows_into(int row0, int rows, Dem& dem) const {
  int r0 = std::clamp(row0, 0, grid_.height);
  int r1 = std::clamp(row0 + rows, 0, grid_.height);
  dem.grid = grid_;
  dem.grid.height = r1 - r0;
  dem.grid.geotransform[3] = grid_.geotransform[3] + r0 * grid_.geotransform[5];
  dem.z.resize(static_cast<std::size_t>(grid_.width) * dem.grid.height);
  if (!dem.z.empty()) {
    GdalErrorScope errors;
    GDALRasterBand* band = ds_->GetRasterBand(1);
    if (band->RasterIO(GF_Read, 0, r0, grid_.width, r1 - r0, dem.z.data(), grid_.width, r1 - r0,
                       GDT_Float32, 0, 0, nullptr) != CE_None) {
      throw_input_error(
          path_,
          "reading the DEM failed" +
              (errors.last_failure().empty() ? std::string() : " (" + errors.last_failure() + ")"));
    }
  }
  // Holes become NaN and values become metres. Branch-free loops, one per case, so the
  // compiler vectorises them: this pass touches every cell of the window.
  const float nan = std::numeric_limits<float>::quiet_NaN();
  const float nd = static_cast<float>(nodata_);
  const bool mark_holes = has_nodata_ && !std::isnan(nodata_);  // NaN nodata is NaN already
  if (mark_holes) {
    for (float& v : dem.z) v = v == nd ? nan : v;
  }
  if (mul_ != 1.0 || add_ != 0.0) {
    const double mul = mul_, add = add_;
    for (float& v : dem.z) v = static_cast<float>(v * mul + add);  // NaN stays NaN
  }
  detail::set_ground_cell_size(dem, scale_);
}

double DemSource::native_cell_m() const {
  Dem probe;
  probe.grid = grid_;
  detail::set_ground_cell_size(probe, scale_);
  return std::sqrt(probe.cell_x_m * probe.cell_y_m);
}

}  // namespace sheetmill::terrain
