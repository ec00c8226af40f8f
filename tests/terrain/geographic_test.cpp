// DEMs in geographic coordinates: the horizontal scale must come from the latitude (no user
// scale factor). The surface is defined analytically in UTM 33N (EPSG:32633) and sampled on a
// lon/lat grid near 60 N, where a degree of longitude is half a degree of latitude on the
// ground, so a wrong scale would be obvious. Expected shading: Lambert's cosine from the
// analytic gradient (Horn 1981, see shade_plane_test.cpp). Near the central meridian (15 E)
// grid north and true north differ by under 0.05 deg and the UTM scale factor is 0.9996, both
// far below 1 DN. Tolerance 2 DN, from the relief issue.
#include <catch2/catch.hpp>
#include <cmath>

#include "dem_fixtures.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/terrain/dem_source.hpp"
#include "sheetmill/terrain/shade.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;

namespace {
constexpr double kE0 = 500000, kN0 = 6650000;
double hill(double e, double n) {
  return 300 + 200 * std::sin((e - kE0) / 900.0) * std::cos((n - kN0) / 700.0);
}
void hill_gradient(double e, double n, double& p, double& q) {
  p = 200 / 900.0 * std::cos((e - kE0) / 900.0) * std::cos((n - kN0) / 700.0);
  q = -200 / 700.0 * std::sin((e - kE0) / 900.0) * std::sin((n - kN0) / 700.0);
}
int expected_byte(double p, double q, double az_deg, double alt_deg) {
  double az = az_deg * kDegToRad, alt = alt_deg * kDegToRad;
  double illum = (std::sin(alt) - (p * std::sin(az) + q * std::cos(az)) * std::cos(alt)) /
                 std::sqrt(1 + p * p + q * q);
  return static_cast<int>(std::floor(1 + 254 * std::max(illum, 0.0) + 0.5));
}

// Lon/lat grid (EPSG:4326, lon-lat order) with the hill sampled at cell centres.
std::filesystem::path geographic_hill(const sheetmill::test::TempDir& tmp, RasterGrid& g) {
  g = fixture::make_grid(400, 500, 14.96, 60.0, 0.0002, fixture::wkt_of(4326));
  g.geotransform[5] = -0.0001;  // ~11 m both ways at 60 N
  OGRSpatialReference geo, utm;
  geo.importFromEPSG(4326);
  utm.importFromEPSG(32633);
  geo.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  utm.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  CoordinateTransformPtr ct(OGRCreateCoordinateTransformation(&geo, &utm));
  std::vector<float> z(static_cast<std::size_t>(g.width) * g.height);
  for (int r = 0; r < g.height; ++r) {
    for (int c = 0; c < g.width; ++c) {
      double x = g.geotransform[0] + (c + 0.5) * g.geotransform[1];
      double y = g.geotransform[3] + (r + 0.5) * g.geotransform[5];
      REQUIRE(ct->Transform(1, &x, &y));
      z[static_cast<std::size_t>(r) * g.width + c] = static_cast<float>(hill(x, y));
    }
  }
  auto path = tmp / "geo.tif";
  fixture::write_geotiff(path, g, z);
  return path;
}
}  // namespace

TEST_CASE("a geographic DEM shades like the same surface in a projected CRS", "[terrain]") {
  sheetmill::test::TempDir tmp("geo");
  RasterGrid g;
  auto path = geographic_hill(tmp, g);
  Dem dem = DemSource(path.string()).read_all();
  // Ground cell sizes at 60 N on WGS 84 (from the radii of curvature): about 11.2 m east-west
  // for 0.0002 deg and 11.2 m north-south for 0.0001 deg (values from memory: 1 deg of
  // longitude is ~55.8 km at 60 N, 1 deg of latitude ~111.4 km).
  CHECK(dem.cell_x_m == Approx(11.16).epsilon(0.01));
  CHECK(dem.cell_y_m == Approx(11.14).epsilon(0.01));
  OGRSpatialReference geo, utm;
  geo.importFromEPSG(4326);
  utm.importFromEPSG(32633);
  geo.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  utm.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  CoordinateTransformPtr ct(OGRCreateCoordinateTransformation(&geo, &utm));
  for (auto light : {std::pair{315.0, 45.0}, std::pair{135.0, 30.0}}) {
    auto bytes = hillshade(dem, {ShadeMethod::horn, light.first, light.second, 1});
    int worst = 0;
    for (int r = 1; r + 1 < g.height; r += 3) {
      for (int c = 1; c + 1 < g.width; c += 3) {
        double x = g.geotransform[0] + (c + 0.5) * g.geotransform[1];
        double y = g.geotransform[3] + (r + 0.5) * g.geotransform[5];
        REQUIRE(ct->Transform(1, &x, &y));
        double p, q;
        hill_gradient(x, y, p, q);
        worst = std::max(worst, std::abs(bytes[r * g.width + c] -
                                         expected_byte(p, q, light.first, light.second)));
      }
    }
    INFO("light " << light.first << "/" << light.second);
    CHECK(worst <= 2);
  }
}

TEST_CASE("a geographic DEM warped to a UTM sheet grid shades like the UTM surface", "[terrain]") {
  sheetmill::test::TempDir tmp("geo");
  RasterGrid g;
  auto path = geographic_hill(tmp, g);
  // A 30 m UTM grid well inside the geographic one.
  auto target = fixture::make_grid(60, 60, 499800, 6651300, 30.0, fixture::wkt_of(32633));
  Dem warped = read_dem_window(path.string(), target);
  REQUIRE(warped.valid_count() == 3600);
  CHECK(warped.cell_x_m == Approx(30.0));
  Dem direct = fixture::sample_dem(target, hill);
  auto a = hillshade(warped, {});
  auto b = hillshade(direct, {});
  int worst = 0;
  for (std::size_t i = 0; i < a.size(); ++i) worst = std::max(worst, std::abs(a[i] - b[i]));
  CHECK(worst <= 2);
}
