// Depression contours only where the enclosed ground is lower: analytic pits and knolls (whole,
// cut by the DEM edge, around a nodata hole), and on real DEMs every loop checked against the DEM
// cells it encloses (OGR's point-in-polygon as the oracle for "inside").
#include <ogr_geometry.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <filesystem>
#include <limits>

#include "contours/synthetic_dem.hpp"
#include "sheetmill/contours/generate.hpp"
#include "sheetmill/terrain/dem_source.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::contours;

namespace {

// A Gaussian bump (h > 0, a knoll) or bowl (h < 0, a pit) of 1/e radius s on a plane at 102.5 m
// (half way between two 5 m levels, so the plane itself is no contour).
auto bump(Point c, double h, double s) {
  return [=](double x, double y) {
    double r = distance({x, y}, c);
    return 102.5 + h * std::exp(-r * r / (s * s));
  };
}

ContourParams params_5m() {
  ContourParams p;
  p.interval_m = 5;
  return p;
}

// The lowest and highest DEM cell centres inside a closed line (OGR's Contains), NaN cells left
// out; {+inf, -inf} when none.
std::pair<double, double> enclosed_range(const ContourLine& l, const terrain::Dem& dem) {
  OGRLinearRing ring;
  for (const auto& p : l.ground) ring.addPoint(p.x, p.y);
  ring.closeRings();
  OGRPolygon poly;
  poly.addRing(&ring);
  OGREnvelope env;
  poly.getEnvelope(&env);
  const double* gt = dem.grid.geotransform;
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (int r = 0; r < dem.height(); ++r) {
    double y = gt[3] + (r + 0.5) * gt[5];
    if (y < env.MinY || y > env.MaxY) continue;
    for (int c = 0; c < dem.width(); ++c) {
      double x = gt[0] + (c + 0.5) * gt[1];
      if (x < env.MinX || x > env.MaxX) continue;
      OGRPoint pt(x, y);
      if (!poly.Contains(&pt) || std::isnan(dem.at(c, r))) continue;
      lo = std::min(lo, static_cast<double>(dem.at(c, r)));
      hi = std::max(hi, static_cast<double>(dem.at(c, r)));
    }
  }
  return {lo, hi};
}

long count_depressions(const std::vector<ContourLine>& lines) {
  long n = 0;
  for (const auto& l : lines) n += l.depression;
  return n;
}

}  // namespace

TEST_CASE("an analytic pit gets depression contours, a knoll does not", "[contours][depression]") {
  // 200 x 200 cells of 10 m; a bowl 40 m deep and a knoll 40 m high, s = 300 m, in the middle:
  // every closed line around the bowl encloses lower ground (analytic), around the knoll higher.
  for (double h : {-40.0, 40.0}) {
    INFO("bump of " << h << " m");
    auto dem = synthetic::make_dem(200, 200, 10, 0, 2000, bump({1000, 1000}, h, 300));
    auto lines = generate_raw(dem, params_5m());
    long closed = 0;
    for (const auto& l : lines) {
      REQUIRE(l.closed);
      ++closed;
      CHECK(l.depression == (h < 0));
    }
    CHECK(closed == 8);  // levels 65 ... 100 or 105 ... 140 (|h| = 40, 5 m apart)
  }
}

TEST_CASE("a pit and a knoll cut by the DEM edge get no ticks", "[contours][depression]") {
  // The same bumps centred on the west edge: every line runs off the grid, the ground beyond it
  // is unknown, so none may be a depression.
  for (double h : {-40.0, 40.0}) {
    INFO("bump of " << h << " m");
    auto dem = synthetic::make_dem(200, 200, 10, 0, 2000, bump({0, 1000}, h, 300));
    auto lines = generate_raw(dem, params_5m());
    REQUIRE(lines.size() >= 6);
    CHECK(count_depressions(lines) == 0);
  }
}

TEST_CASE("lines around a nodata hole get no ticks", "[contours][depression]") {
  // A bowl whose bottom (r < 150 m) is nodata: the loops around the hole enclose unknown
  // ground, so none is a depression, though the ground they enclose, where known, is lower.
  auto dem = synthetic::make_dem(200, 200, 10, 0, 2000, bump({1000, 1000}, -40, 300));
  const double* gt = dem.grid.geotransform;
  for (int r = 0; r < 200; ++r)
    for (int c = 0; c < 200; ++c)
      if (distance({gt[0] + (c + 0.5) * 10, gt[3] - (r + 0.5) * 10}, {1000, 1000}) < 150)
        dem.z[static_cast<std::size_t>(r) * 200 + c] = std::numeric_limits<float>::quiet_NaN();
  auto lines = generate_raw(dem, params_5m());
  long loops = 0;
  for (const auto& l : lines) loops += l.closed;
  REQUIRE(loops >= 3);  // the upper levels close around the hole
  CHECK(count_depressions(lines) == 0);
}

TEST_CASE("real DEMs: every ticked loop encloses ground below its level",
          "[contours][depression]") {
  // The Olinda DEM (r-cran-stars): each closed line is checked against
  // the DEM cells inside it: a depression must enclose a cell below its level, a hill loop a
  // cell above it.
  std::vector<std::filesystem::path> dems = {
      test::open_data("r-cran-stars", "usr/lib/R/site-library/stars/tif/olinda_dem_utm25s.tif")};
  for (const auto& path : dems) {
    if (!std::filesystem::exists(path)) {
      WARN(path << " absent (run scripts/fetch-test-data): skipped");
      continue;
    }
    terrain::Dem dem = terrain::DemSource(path.string()).read_all();
    ContourParams p;
    p.interval_m = 5;
    p.base_m = 2.5;  // levels between the DEM's whole-metre values: no ties
    auto lines = generate_raw(dem, p);
    long ticked = 0, hills = 0;
    for (const auto& l : lines) {
      if (!l.closed) {
        CHECK_FALSE(l.depression);
        continue;
      }
      auto [lo, hi] = enclosed_range(l, dem);
      INFO(path.filename() << ": loop at " << l.elevation_m << " m, inside " << lo << " .. " << hi);
      if (l.depression) {
        ++ticked;
        CHECK(lo < l.elevation_m);
      } else if (l.uphill_known) {
        ++hills;
        CHECK(hi > l.elevation_m);
      }
    }
    WARN(path.filename() << ": " << ticked << " depression loops, " << hills << " hill loops");
    CHECK(ticked > 0);
    CHECK(hills > 0);
  }
}
