// Hillshade against GDAL's own implementation (GDALDEMProcessing, a dependency used here as an
// outside reference, as tests/REFERENCES.md asks). Without -compute_edges GDAL writes 0 on the
// outer ring and next to nodata, so only cells where GDAL has a value are compared. Criterion
// from the relief issue: at most 1 DN apart, at least 99.9 % identical (GDAL computes in
// double with an approximate reciprocal square root; we compute in float, exactly rounded).
#include <catch2/catch.hpp>
#include <cmath>
#include <cstdlib>

#include "dem_fixtures.hpp"
#include "gdal_oracle.hpp"
#include "sheetmill/terrain/dem_source.hpp"
#include "sheetmill/terrain/shade.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;

namespace {

struct Agreement {
  std::size_t compared = 0, identical = 0;
  int max_diff = 0;
};

Agreement compare_interior(const std::vector<std::uint8_t>& ours,
                           const std::vector<std::uint8_t>& ref, int w, int h) {
  Agreement a;
  for (int r = 1; r + 1 < h; ++r) {
    for (int c = 1; c + 1 < w; ++c) {
      std::size_t i = static_cast<std::size_t>(r) * w + c;
      if (ref[i] == 0) continue;  // GDAL's nodata (cells touching a hole)
      ++a.compared;
      int d = std::abs(int(ours[i]) - int(ref[i]));
      a.identical += d == 0;
      a.max_diff = std::max(a.max_diff, d);
    }
  }
  return a;
}

struct OracleCase {
  ShadeParams params;
  std::vector<std::string> gdal_args;
};

const std::vector<OracleCase>& oracle_cases() {
  static const std::vector<OracleCase> cases = {
      {{ShadeMethod::horn, 315, 45, 1}, {"-alg", "Horn", "-az", "315", "-alt", "45"}},
      {{ShadeMethod::horn, 200, 30, 3}, {"-alg", "Horn", "-az", "200", "-alt", "30", "-z", "3"}},
      {{ShadeMethod::zevenbergen_thorne, 315, 45, 1},
       {"-alg", "ZevenbergenThorne", "-az", "315", "-alt", "45"}},
      {{ShadeMethod::zevenbergen_thorne, 90, 60, 2},
       {"-alg", "ZevenbergenThorne", "-az", "90", "-alt", "60", "-z", "2"}},
      {{ShadeMethod::multidirectional, 315, 45, 1}, {"-multidirectional", "-alt", "45"}},
      {{ShadeMethod::multidirectional, 315, 35, 2.5},
       {"-multidirectional", "-alt", "35", "-z", "2.5"}},
  };
  return cases;
}

void check_against_gdal(const std::string& path, std::size_t min_compared) {
  DemSource src(path);
  Dem dem = src.read_all();
  for (const auto& k : oracle_cases()) {
    auto ours = hillshade(dem, k.params);
    auto ref = fixture::gdal_hillshade(path, k.gdal_args);
    REQUIRE(ref.size() == ours.size());
    Agreement a = compare_interior(ours, ref, dem.width(), dem.height());
    INFO(path << ": " << shade_method_name(k.params.method) << " az " << k.params.azimuth_deg
              << " alt " << k.params.altitude_deg << " z " << k.params.exaggeration << ": "
              << a.identical << " of " << a.compared << " identical, max diff " << a.max_diff);
    CHECK(a.compared >= min_compared);
    CHECK(a.max_diff <= 1);
    CHECK(static_cast<double>(a.identical) >= 0.999 * static_cast<double>(a.compared));
  }
}

double synthetic_hills(double e, double n) {
  return 600 + 280 * std::sin(e / 700.0) * std::cos(n / 520.0) + 45 * std::sin((e + n) / 130.0) +
         12 * std::cos(e / 47.0 - n / 61.0);
}

}  // namespace

TEST_CASE("hillshade matches GDAL on the real Olinda DEM", "[terrain]") {
  auto path = sheetmill::test::open_data("r-cran-stars",
                                         "usr/lib/R/site-library/stars/tif/olinda_dem_utm25s.tif");
  if (!std::filesystem::exists(path)) {
    WARN("skipped: " << path << " absent (run scripts/fetch-test-data)");
    return;
  }
  check_against_gdal(path.string(), 100 * 100);
}

TEST_CASE("hillshade matches GDAL on synthetic hills, with and without holes", "[terrain]") {
  sheetmill::test::TempDir tmp("shade-oracle");
  auto g = fixture::make_grid(420, 310, 440000, 6650000, 25.0, fixture::wkt_of(32633));
  Dem dem = fixture::sample_dem(g, synthetic_hills);
  fixture::write_geotiff(tmp / "hills.tif", g, dem.z);
  check_against_gdal((tmp / "hills.tif").string(), 400 * 300);

  // Two rectangular holes and scattered missing cells.
  for (int r = 40; r < 90; ++r)
    for (int c = 100; c < 170; ++c) dem.z[r * g.width + c] = NAN;
  for (int r = 200; r < 310; ++r)
    for (int c = 0; c < 60; ++c) dem.z[r * g.width + c] = NAN;
  for (int i = 0; i < 300; ++i) dem.z[(i * 7919) % dem.z.size()] = NAN;
  fixture::write_geotiff(tmp / "holes.tif", g, dem.z);
  check_against_gdal((tmp / "holes.tif").string(), 100000);
}

TEST_CASE("cells next to holes and at the edge are shaded, holes stay 0", "[terrain]") {
  auto g = fixture::make_grid(60, 40, 440000, 6650000, 25.0, fixture::wkt_of(32633));
  Dem dem = fixture::sample_dem(g, synthetic_hills);
  for (int r = 10; r < 20; ++r)
    for (int c = 20; c < 30; ++c) dem.z[r * g.width + c] = NAN;
  auto bytes = hillshade(dem, {});
  for (int r = 0; r < g.height; ++r) {
    for (int c = 0; c < g.width; ++c) {
      bool hole = std::isnan(dem.at(c, r));
      INFO("cell " << c << "," << r);
      if (hole)
        CHECK(bytes[r * g.width + c] == 0);
      else
        CHECK(bytes[r * g.width + c] >= 1);
    }
  }
}
