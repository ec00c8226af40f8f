#include "sheetmill/contours/generate.hpp"

#include <gdal_alg.h>
#include <gdal_priv.h>
#include <ogrsf_frmts.h>

#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

#include "contours/dem_sampling.hpp"
#include "contours/orient.hpp"
#include "sheetmill/contours/prepare.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::contours {

namespace {

// More levels than this across one sheet is a mistake (an interval in the wrong unit).
constexpr double kMaxLevels = 5000;

// Splits a half-interval line into the stretches where the slope stays gentle.
void append_gentle_pieces(const ContourLine& line, const detail::DemSampler& dem,
                          const ContourParams& params, std::vector<ContourLine>& out) {
  double max_tan = std::tan(params.supplementary_max_slope_deg * kDegToRad);
  double min_len = params.supplementary_min_mm * params.scale_denominator / 1000.0;
  const Polyline& p = line.ground;
  std::vector<char> gentle(p.size());
  bool all = true;
  for (std::size_t i = 0; i < p.size(); ++i) {
    auto g = dem.gradient(p[i]);
    gentle[i] = g && length(*g) <= max_tan;
    all = all && gentle[i];
  }
  if (all) {
    out.push_back(line);
    return;
  }
  // For a closed line start at a steep vertex so that no gentle run is split at the seam.
  std::size_t n = p.size(), start = 0;
  if (line.closed) start = std::find(gentle.begin(), gentle.end(), 0) - gentle.begin();
  std::size_t count = line.closed ? n + 1 : n;
  ContourLine piece = line;
  piece.closed = false;
  piece.ground.clear();
  auto flush = [&] {
    ContourLine candidate = piece;
    if (candidate.ground.size() >= 2 && line_length(candidate) >= min_len) out.push_back(candidate);
    piece.ground.clear();
  };
  for (std::size_t k = 0; k < count; ++k) {
    std::size_t i = (start + k) % n;
    if (gentle[i]) {
      piece.ground.push_back(p[i]);
    } else {
      flush();
    }
  }
  flush();
}

}  // namespace

void validate(const ContourParams& params) {
  if (!(params.interval_m > 0) || !std::isfinite(params.interval_m)) {
    throw_input_error(SourceLocation{"", 0, 0, "contours.interval"},
                      "contour interval must be a number greater than 0, got " +
                          std::to_string(params.interval_m));
  }
  if (params.index_every < 1) {
    throw_input_error(SourceLocation{"", 0, 0, "contours.index_every"},
                      "index contour spacing must be a whole number >= 1");
  }
  if (!(params.scale_denominator > 0)) {
    throw_input_error(SourceLocation{"", 0, 0, "scale"}, "scale denominator must be > 0");
  }
  if (!std::isfinite(params.base_m)) {
    throw_input_error(SourceLocation{"", 0, 0, "contours.base"}, "contour base must be a number");
  }
}

long level_number(double elevation_m, const ContourParams& params) {
  return std::lround((elevation_m - params.base_m) / params.interval_m);
}

std::pair<double, double> elevation_range(const terrain::Dem& dem) {
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  long n = static_cast<long>(dem.width()) * dem.height();
  for (long i = 0; i < n; ++i) {
    float v = dem.z[static_cast<std::size_t>(i)];
    if (std::isnan(v)) continue;
    lo = std::min(lo, static_cast<double>(v));
    hi = std::max(hi, static_cast<double>(v));
  }
  if (lo > hi) return {std::nan(""), std::nan("")};
  return {lo, hi};
}

double propose_interval_m(double scale_denominator, double relief_m) {
  double lo = scale_denominator / 5000, hi = scale_denominator / 2500;
  double ideal = std::clamp(relief_m / 40, lo, hi);
  // Round to the nearest of 1, 2, 2.5, 5 x 10^k (in ratio, not difference).
  double best = 1, best_err = std::numeric_limits<double>::infinity();
  int k0 = static_cast<int>(std::floor(std::log10(ideal)));
  for (int k = k0 - 1; k <= k0 + 1; ++k) {
    for (double m : {1.0, 2.0, 2.5, 5.0}) {
      double v = m * std::pow(10.0, k);
      double err = std::abs(std::log(v / ideal));
      if (err < best_err) best = v, best_err = err;
    }
  }
  return best;
}

std::vector<ContourLine> generate_raw(const terrain::Dem& dem, const ContourParams& params) {
  validate(params);
  const std::string src;
  if (dem.z.size() != static_cast<std::size_t>(dem.width()) * dem.height() || dem.width() < 2 ||
      dem.height() < 2) {
    throw_input_error(src, "the DEM needs at least 2 x 2 cells to be contoured");
  }
  auto [lo, hi] = elevation_range(dem);
  if (std::isnan(lo)) throw_input_error(src, "the DEM has no data cells: nothing to contour");
  if (!(hi > lo)) {
    throw_input_error(src, "the DEM has no relief (every cell is " + std::to_string(lo) +
                               "): nothing to contour");
  }
  double step = params.supplementary ? params.interval_m / 2 : params.interval_m;
  if ((hi - lo) / step > kMaxLevels) {
    throw_input_error(SourceLocation{src, 0, 0, "contours.interval"},
                      "an interval of " + std::to_string(params.interval_m) + " gives more than " +
                          std::to_string(static_cast<long>(kMaxLevels)) + " levels across " +
                          std::to_string(hi - lo) + " of relief; choose a larger interval");
  }

  gdal_init();
  GdalErrorScope errors;
  GDALDriver* mem = GetGDALDriverManager()->GetDriverByName("MEM");
  GDALDriver* vmem = GetGDALDriverManager()->GetDriverByName("Memory");
  if (!mem || !vmem) throw_internal_error("GDAL's MEM and Memory drivers are not available");

  // Wrap the caller's values without copying: a MEM band over the same memory.
  DatasetPtr raster(mem->Create("", dem.width(), dem.height(), 0, GDT_Float32, nullptr));
  char pointer[64] = {0};
  CPLPrintPointer(pointer, const_cast<float*>(dem.z.data()), sizeof(pointer) - 1);
  std::string data_option = std::string("DATAPOINTER=") + pointer;
  const char* band_options[] = {data_option.c_str(), nullptr};
  if (!raster || raster->AddBand(GDT_Float32, const_cast<char**>(band_options)) != CE_None) {
    throw_internal_error("cannot wrap the DEM in a GDAL band: " + errors.last_failure());
  }
  double gt[6];
  std::copy(dem.grid.geotransform, dem.grid.geotransform + 6, gt);
  raster->SetGeoTransform(gt);
  GDALRasterBand* band = raster->GetRasterBand(1);

  DatasetPtr vector(vmem->Create("", 0, 0, 0, GDT_Unknown, nullptr));
  OGRLayer* layer = vector ? vector->CreateLayer("contours", nullptr, wkbLineString) : nullptr;
  if (!layer) throw_internal_error("cannot create an in-memory contour layer");
  OGRFieldDefn id_field("id", OFTInteger);
  OGRFieldDefn elev_field("elev", OFTReal);
  layer->CreateField(&id_field);
  layer->CreateField(&elev_field);

  // NaN cells are nodata to GDAL's generator only when a nodata value is set; any NaN works as
  // the marker because the generator tests for NaN itself.
  std::string interval = "LEVEL_INTERVAL=" + CPLString().Printf("%.17g", step);
  std::string base = "LEVEL_BASE=" + CPLString().Printf("%.17g", params.base_m);
  const char* options[] = {interval.c_str(), base.c_str(), "ID_FIELD=0",
                           "ELEV_FIELD=1",   "NODATA=nan", nullptr};
  if (GDALContourGenerateEx(band, layer, const_cast<char**>(options), nullptr, nullptr) !=
      CE_None) {
    throw_internal_error("GDAL's contour generator failed: " + errors.last_failure());
  }

  detail::DemSampler sampler(dem);
  std::vector<ContourLine> lines;
  lines.reserve(static_cast<std::size_t>(layer->GetFeatureCount()));
  std::vector<ContourLine> supplementary;
  layer->ResetReading();
  std::vector<OGRRawPoint> raw;
  for (auto& feature : *layer) {
    const OGRGeometry* geom = feature->GetGeometryRef();
    if (!geom || wkbFlatten(geom->getGeometryType()) != wkbLineString) continue;
    const OGRLineString* ls = geom->toLineString();
    int n = ls->getNumPoints();
    if (n < 2) continue;
    raw.resize(n);
    ls->getPoints(raw.data());
    ContourLine line;
    line.elevation_m = feature->GetFieldAsDouble(1);
    line.ground.resize(n);
    for (int i = 0; i < n; ++i) line.ground[i] = {raw[i].x, raw[i].y};
    if (n >= 4 && raw[0].x == raw[n - 1].x && raw[0].y == raw[n - 1].y) {
      line.closed = true;
      line.ground.pop_back();
    }
    detail::orient_uphill_left(line, sampler);
    if (line.closed) line.depression = line.uphill_known && detail::signed_area(line.ground) < 0;
    long k = std::lround((line.elevation_m - params.base_m) / step);
    if (params.supplementary && (k % 2 != 0)) {
      line.supplementary = true;
      append_gentle_pieces(line, sampler, params, supplementary);
      continue;
    }
    long level = params.supplementary ? k / 2 : k;
    line.index = level % params.index_every == 0;
    lines.push_back(std::move(line));
  }
  for (auto& s : supplementary) lines.push_back(std::move(s));
  return lines;
}

std::vector<ContourLine> generate(const terrain::Dem& dem, const ContourParams& params) {
  auto lines = generate_raw(dem, params);
  detail::DemSampler sampler(dem);
  prepare_for_print(lines, params, sampler.cell_m());
  return lines;
}

}  // namespace sheetmill::contours
