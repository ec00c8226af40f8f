// Reading a sheet's window of a DEM: GDAL's warper, in memory, into exactly the target grid.
#include <cpl_string.h>
#include <gdal_alg.h>
#include <gdal_utils.h>
#include <gdalwarper.h>

#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/terrain/dem.hpp"
#include "sheetmill/terrain/resampling.hpp"
#include "terrain/cubic_upsample.hpp"
#include "terrain/dem_georef.hpp"

namespace sheetmill::terrain {

std::size_t Dem::valid_count() const {
  std::size_t n = 0;
  for (float v : z) n += !std::isnan(v);
  return n;
}

namespace {

// GDAL's kernel for a resampling name. "auto" (and the other names of Resampling) go through
// choose_resampling() with the target's ground cell against the DEM's own.
GDALResampleAlg resampling_of(const std::string& name, GDALDataset& src,
                              const OGRSpatialReference& src_srs, const RasterGrid& target,
                              const OGRSpatialReference& dst_srs, const std::string& path) {
  if (name == "cubicspline") return GRA_CubicSpline;
  if (name == "near" || name == "nearest") return GRA_NearestNeighbour;
  if (name == "lanczos") return GRA_Lanczos;
  Resampling asked = parse_resampling(name);
  if (asked == Resampling::automatic) {
    Dem probe;
    probe.grid = target;
    detail::set_ground_cell_size(probe, dst_srs);
    const double print_cell_m = std::sqrt(probe.cell_x_m * probe.cell_y_m);
    const double dem_cell_m = detail::native_cell_m(src, src_srs, path);
    asked = choose_resampling(asked, print_cell_m, dem_cell_m);
    log::debug("{}: {} resampling ({:.3g} m print cells, {:.3g} m DEM cells)", path,
               resampling_name(asked), print_cell_m, dem_cell_m);
  }
  switch (asked) {
    case Resampling::cubic:
      return GRA_Cubic;  // Keys (1981) cubic convolution with a = -0.5
    case Resampling::average:
      return GRA_Average;
    default:
      return GRA_Bilinear;
  }
}

bool has_georeferencing(GDALDataset& ds) {
  double gt[6];
  return ds.GetGeoTransform(gt) == CE_None || ds.GetGCPCount() > 0;
}

// The target's cell size in the source's units, measured at the target's centre; 0 when it
// cannot be told (no geotransform, no transformation).
double target_cell_in_source(GDALDataset& ds, const RasterGrid& target,
                             const OGRSpatialReference& src, const OGRSpatialReference& dst) {
  double gt[6];
  if (ds.GetGeoTransform(gt) != CE_None) return 0;
  CoordinateTransformPtr ct(OGRCreateCoordinateTransformation(&dst, &src));
  if (!ct) return 0;
  Box b = target.bounds();
  double xs[2] = {b.centre().x, b.centre().x + target.cell_x()};
  double ys[2] = {b.centre().y, b.centre().y};
  if (!ct->Transform(2, xs, ys)) return 0;
  return std::hypot(xs[1] - xs[0], ys[1] - ys[0]);
}

// The overview of `ds` to warp from: the coarsest one still at least as fine as the target
// (as a warp tool does by default), so a sheet cut from a fine DEM reads few cells. -1 = full.
int overview_level_for(GDALDataset& ds, double target_in_src) {
  GDALRasterBand* band = ds.GetRasterBand(1);
  double gt[6];
  if (band->GetOverviewCount() == 0 || ds.GetGeoTransform(gt) != CE_None) return -1;
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

// The most DEM cells one sheet's window reads at full resolution: 1 GB of Float32.
constexpr double kMaxFullReadCells = 2.5e8;

// Without a fitting overview, a DEM so much finer than the sheet that its window would exceed
// kMaxFullReadCells is read through a virtual copy with fewer, larger cells, still no coarser
// than the target: GDAL then reads a smaller buffer (GDALRasterIO decimating by nearest
// neighbour) instead of every cell, so the work follows the sheet, not the DEM (a
// 10^6 x 10^6 cell DEM reads in seconds). Null when a full read stays within the bound.
DatasetPtr decimated_view(GDALDataset& ds, const RasterGrid& target, double target_in_src,
                          const std::string& path) {
  double gt[6];
  if (!(target_in_src > 0) || ds.GetGeoTransform(gt) != CE_None) return nullptr;
  double ratio = target_in_src / std::max(std::abs(gt[1]), std::abs(gt[5]));
  double cells = ratio * ratio * static_cast<double>(target.width) * target.height;
  double factor = std::floor(ratio);
  if (!(cells > kMaxFullReadCells) || !(factor >= 2)) return nullptr;
  int width = std::max(1, static_cast<int>(ds.GetRasterXSize() / factor));
  int height = std::max(1, static_cast<int>(ds.GetRasterYSize() / factor));
  CPLStringList args;
  for (const char* a : {"-of", "VRT", "-r", "nearest", "-outsize"}) args.AddString(a);
  args.AddString(std::to_string(width).c_str());
  args.AddString(std::to_string(height).c_str());
  GDALTranslateOptions* opts = GDALTranslateOptionsNew(args.List(), nullptr);
  GdalErrorScope errors;
  DatasetPtr view(GDALDataset::FromHandle(GDALTranslate("", &ds, opts, nullptr)));
  GDALTranslateOptionsFree(opts);
  if (view) {
    log::info(
        "{}: no overview as coarse as the sheet; reading every {:g}th cell ({} x {}); "
        "overviews (gdaladdo) give a smoother relief",
        path, factor, width, height);
  }
  return view;
}

}  // namespace

namespace {

Dem read_window(GDALDataset& src_ds, const std::string& path, const RasterGrid& target,
                const DemReadOptions& options) {
  if (target.width <= 0 || target.height <= 0) {
    throw_internal_error("read_dem_window: empty target grid");
  }
  GDALDataset* src = &src_ds;
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

  // Read from an overview, or a decimated view, when the target is much coarser than the DEM.
  DatasetPtr overview;
  GDALDataset* warp_src = src;
  const double target_in_src = target_cell_in_source(*src, target, src_srs, dst_srs);
  int ovr = overview_level_for(*src, target_in_src);
  if (ovr >= 0) {
    // The core's generic OVERVIEW_LEVEL open option presents one overview as a dataset.
    std::string level = "OVERVIEW_LEVEL=" + std::to_string(ovr);
    const char* open_opts[] = {level.c_str(), nullptr};
    GdalErrorScope quiet;
    overview.reset(
        GDALDataset::Open(path.c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY, nullptr, open_opts));
    if (overview) warp_src = overview.get();
  }
  if (!overview) {
    overview = decimated_view(*src, target, target_in_src, path);
    if (overview) warp_src = overview.get();
  }

  const GDALResampleAlg alg =
      resampling_of(options.resampling, *src, src_srs, target, dst_srs, path);
  // The common relief case (cubic upsampling in the DEM's own CRS) without the warper; the
  // same values (cubic_upsample.hpp), about ten times faster on a sheet.
  const bool done = alg == GRA_Cubic && warp_src == src &&
                    detail::cubic_upsample_same_crs(
                        *src, src_srs, dst_srs, target,
                        has_nodata ? std::optional<double>(src_nodata) : std::nullopt, dem.z);
  if (!done) {
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
    wo->eResampleAlg = alg;
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
      throw_input_error(
          path,
          "reading the DEM failed" +
              (errors.last_failure().empty() ? std::string() : " (" + errors.last_failure() + ")"));
    }
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

}  // namespace

Dem read_dem_window(const std::string& path, const RasterGrid& target,
                    const DemReadOptions& options) {
  if (target.width <= 0 || target.height <= 0) {
    throw_internal_error("read_dem_window: empty target grid");
  }
  DatasetPtr src = open_raster(path);
  return read_window(*src, path, target, options);
}

struct DemReader::Impl {
  DatasetPtr dataset;
};

DemReader::DemReader(const std::string& path) : path_(path), impl_(std::make_unique<Impl>()) {
  impl_->dataset = open_raster(path);
}
DemReader::~DemReader() = default;

Dem DemReader::read(const RasterGrid& target, const DemReadOptions& options) const {
  if (target.width <= 0 || target.height <= 0) {
    throw_internal_error("DemReader::read: empty target grid");
  }
  return read_window(*impl_->dataset, path_, target, options);
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
  return detail::native_cell_m(*src, srs, path);
}

}  // namespace sheetmill::terrain
