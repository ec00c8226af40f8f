#include "sheetmill/sheet/sheet_crs.hpp"

#include <catch2/catch.hpp>
#include <cmath>

#include "sheetmill/core/error.hpp"

using namespace sheetmill;
using namespace sheetmill::sheet;

// Snyder, J.P. (1987) Map Projections: A Working Manual, USGS PP 1395, ellipsoidal transverse
// Mercator worked example: Clarke 1866, lon0 = 75 W, k0 = 0.9996, point 40.5 N 73.5 W:
// x = 127 106.5 m, y = 4 484 124.4 m, k = 0.9997989.
TEST_CASE("Snyder's transverse Mercator example", "[sheet]") {
  auto crs = SheetCrs::resolve(
      "+proj=tmerc +ellps=clrk66 +lon_0=-75 +lat_0=0 +k_0=0.9996 +x_0=0 +y_0=0 +units=m "
      "+type=crs");
  Point g = crs.to_ground({-73.5, 40.5});
  CHECK(g.x == Approx(127106.5).margin(0.1));
  CHECK(g.y == Approx(4484124.4).margin(0.1));
  auto f = crs.factors_at({-73.5, 40.5});
  CHECK(f.scale_factor == Approx(0.9997989).margin(1e-7));
  // Convergence, first order (common practice): (lon - lon0) sin(lat) = 1.5 sin 40.5 = 0.974 deg;
  // the higher-order terms add well under 0.002 deg this close to the central meridian.
  CHECK(f.grid_convergence_deg == Approx(1.5 * std::sin(40.5 * M_PI / 180)).margin(0.002));
  Point back = crs.to_lonlat(g);
  CHECK(back.x == Approx(-73.5).margin(1e-9));
  CHECK(back.y == Approx(40.5).margin(1e-9));
}

TEST_CASE("UTM sheet CRS from an EPSG code", "[sheet]") {
  auto crs = SheetCrs::resolve("EPSG:32633");
  CHECK(crs.epsg() == 32633);
  CHECK(crs.name() == "WGS 84 / UTM zone 33N");
  CHECK(crs.projection_name() == "Transverse Mercator");
  CHECK(crs.datum_name().find("World Geodetic System 1984") != std::string::npos);
  // West of the central meridian (15 E) in the north: grid north lies west of true north.
  auto f = crs.factors_at({13.0, 47.0});
  CHECK(f.grid_convergence_deg < 0);
  CHECK(f.grid_convergence_deg == Approx(-2.0 * std::sin(47 * M_PI / 180)).margin(0.003));
  // On the central meridian k = k0 = 0.9996 (UTM's definition).
  CHECK(crs.factors_at({15.0, 47.0}).scale_factor == Approx(0.9996).margin(1e-9));
}

TEST_CASE("a geographic CRS is not a sheet CRS", "[sheet]") {
  CHECK_THROWS_AS(SheetCrs::resolve("EPSG:4326"), Error);
  CHECK_THROWS_AS(SheetCrs::resolve("EPSG:999999"), Error);
}
