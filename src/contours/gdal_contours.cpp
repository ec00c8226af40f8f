#include "sheetmill/contours/gdal_contours.hpp"

#include <gdal_alg.h>
#include <gdal_priv.h>
#include <ogrsf_frmts.h>

#include <algorithm>
#include <cmath>
#include <map>
#include <optional>
#include <string>
#include <thread>
#include <tuple>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"

namespace sheetmill::contours::detail {

namespace {

// Below this many rows one thread does it all (the join is not worth it).
constexpr int kMinRowsToSplit = 256;

}  // namespace

std::vector<RawContour> contour_rows(const terrain::Dem& dem, int row0, int row1, double step,
                                     double base) {
  gdal_init();
  GdalErrorScope errors;
  GDALDriver* mem = GetGDALDriverManager()->GetDriverByName("MEM");
  GDALDriver* vmem = GetGDALDriverManager()->GetDriverByName("Memory");
  if (!mem || !vmem) throw_internal_error("GDAL's MEM and Memory drivers are not available");
  const int w = dem.width(), h = row1 - row0;
  DatasetPtr raster(mem->Create("", w, h, 0, GDT_Float32, nullptr));
  char pointer[64] = {0};
  const float* first = dem.z.data() + static_cast<std::size_t>(row0) * w;
  CPLPrintPointer(pointer, const_cast<float*>(first), sizeof(pointer) - 1);
  std::string data_option = std::string("DATAPOINTER=") + pointer;
  const char* band_options[] = {data_option.c_str(), nullptr};
  if (!raster || raster->AddBand(GDT_Float32, const_cast<char**>(band_options)) != CE_None) {
    throw_internal_error("cannot wrap the DEM in a GDAL band: " + errors.last_failure());
  }
  double gt[6];
  std::copy(dem.grid.geotransform, dem.grid.geotransform + 6, gt);
  gt[3] += row0 * gt[5];
  raster->SetGeoTransform(gt);

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
  std::string level_base = "LEVEL_BASE=" + CPLString().Printf("%.17g", base);
  const char* options[] = {interval.c_str(), level_base.c_str(), "ID_FIELD=0",
                           "ELEV_FIELD=1",   "NODATA=nan",       nullptr};
  if (GDALContourGenerateEx(raster->GetRasterBand(1), layer, const_cast<char**>(options), nullptr,
                            nullptr) != CE_None) {
    throw_internal_error("GDAL's contour generator failed: " + errors.last_failure());
  }
  std::vector<RawContour> out;
  out.reserve(static_cast<std::size_t>(layer->GetFeatureCount()));
  std::vector<OGRRawPoint> raw;
  layer->ResetReading();
  for (auto& feature : *layer) {
    const OGRGeometry* geom = feature->GetGeometryRef();
    if (!geom || wkbFlatten(geom->getGeometryType()) != wkbLineString) continue;
    const OGRLineString* ls = geom->toLineString();
    int n = ls->getNumPoints();
    if (n < 2) continue;
    raw.resize(n);
    ls->getPoints(raw.data());
    RawContour c;
    c.elevation_m = feature->GetFieldAsDouble(1);
    c.points.resize(n);
    for (int i = 0; i < n; ++i) c.points[i] = {raw[i].x, raw[i].y};
    out.push_back(std::move(c));
  }
  return out;
}

namespace {

bool is_closed(const Polyline& p) {
  return p.size() >= 4 && p.front().x == p.back().x && p.front().y == p.back().y;
}

}  // namespace

std::vector<RawContour> join_at_seam(std::vector<RawContour> upper, std::vector<RawContour> lower,
                                     const double gt[6], int seam) {
  const double cell = std::abs(gt[5]);
  const double seam_y = gt[3] + (seam + 0.5) * gt[5];  // centres of the seam row
  const double tol = 1e-6 * cell;
  // Cuts the extension beyond the seam off both ends: the vertices strictly past the seam row
  // (GDAL's edge extension); a cut end then lies on the seam row.
  auto trim = [&](RawContour& c, double side) {  // side: +1 upper band (past = below)
    if (is_closed(c.points)) return;
    auto past = [&](Point p) { return side * (seam_y - p.y) > tol; };
    while (c.points.size() >= 2 && past(c.points.back())) c.points.pop_back();
    std::size_t k = 0;
    while (k + 1 < c.points.size() && past(c.points[k])) ++k;
    c.points.erase(c.points.begin(), c.points.begin() + static_cast<long>(k));
  };
  struct Piece {
    RawContour c;
    bool used = false;
  };
  std::vector<Piece> pieces;
  for (auto& c : upper) {
    trim(c, +1);
    if (c.points.size() >= 2) pieces.push_back({std::move(c)});
  }
  for (auto& c : lower) {
    trim(c, -1);
    if (c.points.size() >= 2) pieces.push_back({std::move(c)});
  }
  // Ends on the seam, keyed by level and x (both bands interpolate the same two seam-row
  // values, so x agrees exactly; y may differ in the last bit through the band origin).
  using Key = std::pair<double, double>;
  std::multimap<Key, std::pair<std::size_t, bool>> ends;  // piece, at its back?
  auto on_seam = [&](Point p) { return std::abs(p.y - seam_y) <= tol; };
  for (std::size_t i = 0; i < pieces.size(); ++i) {
    const Polyline& p = pieces[i].c.points;
    if (is_closed(p)) continue;
    if (on_seam(p.front())) ends.insert({{pieces[i].c.elevation_m, p.front().x}, {i, false}});
    if (on_seam(p.back())) ends.insert({{pieces[i].c.elevation_m, p.back().x}, {i, true}});
  }
  // The other end sharing this end's key (never the same piece end).
  auto partner = [&](std::size_t piece, bool back) -> std::optional<std::pair<std::size_t, bool>> {
    const Polyline& p = pieces[piece].c.points;
    Point at = back ? p.back() : p.front();
    if (!on_seam(at)) return std::nullopt;
    auto [lo, hi] = ends.equal_range({pieces[piece].c.elevation_m, at.x});
    for (auto it = lo; it != hi; ++it) {
      if ((it->second.first != piece || it->second.second != back) &&
          !pieces[it->second.first].used)
        return it->second;
    }
    return std::nullopt;
  };
  std::vector<RawContour> out;
  // Walk a chain from piece `start`, leaving through its back end.
  auto walk = [&](std::size_t start, bool reversed) {
    RawContour chain;
    chain.elevation_m = pieces[start].c.elevation_m;
    chain.points = pieces[start].c.points;
    if (reversed) std::reverse(chain.points.begin(), chain.points.end());
    pieces[start].used = true;
    bool at_back = !reversed;  // the end of `start` the chain leaves by
    std::size_t cur = start;
    for (;;) {
      auto next = partner(cur, at_back);
      if (!next) break;
      auto [j, j_back] = *next;
      Polyline q = pieces[j].c.points;
      if (j_back) std::reverse(q.begin(), q.end());  // enter j at its back: walk it backwards
      chain.points.insert(chain.points.end(), q.begin() + 1, q.end());
      pieces[j].used = true;
      cur = j;
      at_back = !j_back;
    }
    Point a = chain.points.front(), b = chain.points.back();
    if (chain.points.size() >= 3 && std::abs(a.x - b.x) <= tol && std::abs(a.y - b.y) <= tol)
      chain.points.back() = a;  // a loop that crossed the seam: closed exactly
    out.push_back(std::move(chain));
  };
  // Chains with a free end first (started there), then what is left: loops across the seam.
  for (std::size_t i = 0; i < pieces.size(); ++i) {
    if (pieces[i].used) continue;
    if (!partner(i, false)) {
      walk(i, false);
    } else if (!partner(i, true)) {
      walk(i, true);
    }
  }
  for (std::size_t i = 0; i < pieces.size(); ++i) {
    if (!pieces[i].used) walk(i, false);
  }
  return out;
}

std::vector<RawContour> gdal_contours(const terrain::Dem& dem, double step, double base) {
  const int h = dem.height();
  if (h < kMinRowsToSplit || std::thread::hardware_concurrency() < 2) {
    return contour_rows(dem, 0, h, step, base);
  }
  const int seam = h / 2;
  std::vector<RawContour> upper, lower;
  std::exception_ptr failed;
  std::thread other([&] {
    try {
      lower = contour_rows(dem, seam, h, step, base);
    } catch (...) {
      failed = std::current_exception();
    }
  });
  try {
    upper = contour_rows(dem, 0, seam + 1, step, base);
  } catch (...) {
    other.join();
    throw;
  }
  other.join();
  if (failed) std::rethrow_exception(failed);
  return join_at_seam(std::move(upper), std::move(lower), dem.grid.geotransform, seam);
}

}  // namespace sheetmill::contours::detail
