// Reading a sheet's window of a DEM: GDAL's warper, in memory, into exactly the target grid.
#include <cpl_string.h>
#include <gdal_alg.h>
#include <gdalwarper.h>

#include <cmath>
#include <limits>
#include <string>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/terrain/dem.hpp"
#include "terrain/dem_georef.hpp"

namespace sheetmill::terrain {

std::size_t Dem::valid_count() const {
  std::size_t n = 0;
  for (float v : z) n += !std::isnan(v);
  return n;
}

namespace {

GDALResampleAlg resampling_of(const std::string& name) {
  if (name == "bilinear") return GRA_Bilinear;
  if (name == "cubic") return GRA_Cubic;
  if (name == "cubicspline") return GRA_CubicSpline;
  if (name == "near" || name == "nearest") return GRA_NearestNeighbour;
  if (name == "lanczos") return GRA_Lanczos;
  throw_input_error(name, "resampling: expected one of bilinear, cubic, cubicspline, near");
}

bool has_georeferencing(GDALDataset& ds) {
  double gt[6];
  return ds.GetGeoTransform(gt) == CE_None || ds.GetGCPCount() > 0;
}

// The overview of `ds` to warp from: the coarsest one still at least as fine as the target
// (as a warp tool does by default), so a sheet cut from a fine DEM reads few cells. -1 = full.
int overview_level_for(GDALDataset& ds, const RasterGrid& target, const OGRSpatialReference& src,
                       const OGRSpatialReference& dst) {
  GDALRasterBand* band = ds.GetRasterBand(1);
  if (band->GetOverviewCount() == 0) return -1;
  double gt[6];
  if (ds.GetGeoTransform(gt) != CE_None) return -1;
  // Compare sizes on the ground in the target CRS at the target's centre.
  CoordinateTransformPtr ct(OGRCreateCoordinateTransformation(&dst, &src));
  if (!ct) return -1;
  Box b = target.bounds();
  double xs[2] = {b.centre().x, b.centre().x + target.cell_x()};
  double ys[2] = {b.centre().y, b.centre().y};
  if (!ct->Transform(2, xs, ys)) return -1;
  double target_in_src = std::hypot(xs[1] - xs[0], ys[1] - ys[0]);
  double src_cell = std::abs(gt[1]);
  int best = -1;
  for (int i = 0; i < band->GetOverviewCount(); ++i) {
    GDALRasterBand* ov = band->GetOverview(i);
    if (!ov || ov->GetXSize() == 0) continue;
    double ov_cell = src_cell * ds.GetRasterXSize() / ov->GetXSize();
    if (ov_cell <= target_in_src * 1.0001) best = i;
  }
  return best;
}

}  // namespace

Dem read_dem_window(const std::string& path, const RasterGrid& target,
                    const DemReadOptions& options) {
  if (target.width <= 0 || target.height <= 0) {
    throw_internal_error("read_dem_window: empty target grid");
  }
  DatasetPtr src = open_raster(path);
  if (src->GetRasterCount() < 1) throw_input_error(path, "the raster has no bands");
  if (!has_georeferencing(*src)) {
    throw_input_error(path, "the DEM has no georeferencing (no geotransform or control points)");
  }
  OGRSpatialReference src_srs = detail::dem_crs(*src, options, path);
  OGRSpatialReference dst_srs;
  if (target.crs_wkt.empty() || dst_srs.importFromWkt(target.crs_wkt.c_str()) != OGRERR_NONE) {
    throw_internal_error("read_dem_window: target grid has no valid CRS");
  }
  dst_srs.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  GDALRasterBand* src_band = src->GetRasterBand(1);
  const double z_factor = detail::metres_per_z_unit(*src_band, src_srs, options, path);
  int has_scale = 0, has_offset = 0;
  const double band_scale = src_band->GetScale(&has_scale);
  const double band_offset = src_band->GetOffset(&has_offset);
  int has_nodata = 0;
  const double src_nodata = src_band->GetNoDataValue(&has_nodata);

  Dem dem;
  dem.grid = target;
  const std::size_t n = static_cast<std::size_t>(target.width) * target.height;
  dem.z.assign(n, std::numeric_limits<float>::quiet_NaN());

  // The destination is a MEM dataset wrapping dem.z, so the warper writes straight into it.
  GDALDriver* mem = GetGDALDriverManager()->GetDriverByName("MEM");
  DatasetPtr dst(mem->Create("", target.width, target.height, 0, GDT_Float32, nullptr));
  if (!dst) throw_internal_error("read_dem_window: cannot create an in-memory grid");
  char ptr_opt[64];
  std::snprintf(ptr_opt, sizeof ptr_opt, "DATAPOINTER=%p", static_cast<void*>(dem.z.data()));
  const char* band_opts[] = {ptr_opt, nullptr};
  dst->AddBand(GDT_Float32, const_cast<char**>(band_opts));
  dst->SetGeoTransform(const_cast<double*>(target.geotransform));
  dst->SetSpatialRef(&dst_srs);
  dst->GetRasterBand(1)->SetNoDataValue(std::numeric_limits<double>::quiet_NaN());

  // Read from an overview when the target is much coarser than the DEM.
  DatasetPtr overview;
  GDALDataset* warp_src = src.get();
  int ovr = overview_level_for(*src, target, src_srs, dst_srs);
  if (ovr >= 0) {
    // The core's generic OVERVIEW_LEVEL open option presents one overview as a dataset.
    std::string level = "OVERVIEW_LEVEL=" + std::to_string(ovr);
    const char* open_opts[] = {level.c_str(), nullptr};
    GdalErrorScope quiet;
    overview.reset(
        GDALDataset::Open(path.c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY, nullptr, open_opts));
    if (overview) warp_src = overview.get();
  }

  GdalErrorScope errors;
  CPLStringList tr_opts;
  tr_opts.SetNameValue("SRC_SRS", crs_wkt(src_srs).c_str());
  void* gen = GDALCreateGenImgProjTransformer2(warp_src, dst.get(), tr_opts.List());
  if (!gen) {
    throw_input_error(
        path,
        "cannot transform the DEM's CRS to the sheet's" +
            (errors.last_failure().empty() ? std::string() : " (" + errors.last_failure() + ")"));
  }
  // An approximate transformer within 1/8 cell, as warping tools use by default.
  void* approx = GDALCreateApproxTransformer(GDALGenImgProjTransform, gen, 0.125);
  GDALApproxTransformerOwnsSubtransformer(approx, TRUE);

  GDALWarpOptions* wo = GDALCreateWarpOptions();
  wo->hSrcDS = warp_src;
  wo->hDstDS = dst.get();
  wo->nBandCount = 1;
  wo->panSrcBands = static_cast<int*>(CPLMalloc(sizeof(int)));
  wo->panDstBands = static_cast<int*>(CPLMalloc(sizeof(int)));
  wo->panSrcBands[0] = 1;
  wo->panDstBands[0] = 1;
  wo->eResampleAlg = resampling_of(options.resampling);
  wo->eWorkingDataType = GDT_Float32;
  wo->dfWarpMemoryLimit = 128.0 * 1024 * 1024;  // per chunk; the target itself is separate
  wo->pfnTransformer = GDALApproxTransform;
  wo->pTransformerArg = approx;
  if (has_nodata) {
    wo->padfSrcNoDataReal = static_cast<double*>(CPLMalloc(sizeof(double)));
    wo->padfSrcNoDataReal[0] = src_nodata;
  }
  wo->padfDstNoDataReal = static_cast<double*>(CPLMalloc(sizeof(double)));
  wo->padfDstNoDataReal[0] = std::numeric_limits<double>::quiet_NaN();
  wo->papszWarpOptions = CSLSetNameValue(wo->papszWarpOptions, "INIT_DEST", "NO_DATA");
  wo->papszWarpOptions = CSLSetNameValue(wo->papszWarpOptions, "NUM_THREADS", "ALL_CPUS");

  CPLErr err = CE_Failure;
  {
    GDALWarpOperation op;
    if (op.Initialize(wo) == CE_None) {
      err = op.ChunkAndWarpMulti(0, 0, target.width, target.height);
    }
  }
  GDALDestroyApproxTransformer(approx);
  wo->pTransformerArg = nullptr;
  GDALDestroyWarpOptions(wo);
  dst.reset();
  if (err != CE_None) {
    throw_input_error(path, "reading the DEM failed" + (errors.last_failure().empty()
                                                            ? std::string()
                                                            : " (" + errors.last_failure() + ")"));
  }

  const double mul = (has_scale ? band_scale : 1.0) * z_factor;
  const double add = (has_offset ? band_offset : 0.0) * z_factor;
  if (mul != 1.0 || add != 0.0) {
    for (float& v : dem.z) v = static_cast<float>(v * mul + add);
  }
  detail::set_ground_cell_size(dem, dst_srs);

  std::size_t valid = dem.valid_count();
  if (!options.warn_coverage) return dem;
  if (valid == 0) {
    log::warn("{}: the DEM has no data under this window; relief is left out", path);
  } else if (valid < n) {
    log::warn("{}: the DEM covers {:.1f} % of this window; relief is missing elsewhere", path,
              100.0 * static_cast<double>(valid) / static_cast<double>(n));
  }
  return dem;
}

double vertical_unit_m(const std::string& path, const DemReadOptions& options) {
  DatasetPtr src = open_raster(path);
  if (src->GetRasterCount() < 1) throw_input_error(path, "the raster has no bands");
  OGRSpatialReference srs;
  if (const OGRSpatialReference* own = src->GetSpatialRef()) srs = *own;
  return detail::metres_per_z_unit(*src->GetRasterBand(1), srs, options, path);
}

double native_cell_m(const std::string& path, const DemReadOptions& options) {
  DatasetPtr src = open_raster(path);
  OGRSpatialReference srs = detail::dem_crs(*src, options, path);
  Dem probe;
  probe.grid.width = src->GetRasterXSize();
  probe.grid.height = src->GetRasterYSize();
  if (src->GetGeoTransform(probe.grid.geotransform) != CE_None) {
    throw_input_error(path, "the DEM has no geotransform");
  }
  // Rotated grids: the cell's side lengths, not the geotransform's diagonal terms.
  double* gt = probe.grid.geotransform;
  double sx = std::hypot(gt[1], gt[4]);
  double sy = std::hypot(gt[2], gt[5]);
  gt[1] = sx;
  gt[5] = -sy;
  gt[2] = gt[4] = 0;
  detail::set_ground_cell_size(probe, srs);
  return std::sqrt(probe.cell_x_m * probe.cell_y_m);
}

}  // namespace sheetmill::terrain
