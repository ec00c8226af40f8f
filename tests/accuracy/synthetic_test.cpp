// A synthetic DEM with known errors: a plane (bilinear sampling is exact on a plane, so the DEM
// height at any point is the plane's) and check points whose surveyed heights are the plane minus
// Gaussian errors of stated sigma (std::mt19937_64, fixed seeds). The reported figures must come
// back within sampling tolerance:
//
//   RMSE of N draws of N(0, sigma): its standard error is about sigma / sqrt(2N) (the sample SD's
//   large-sample standard error, common statistical practice); we allow 4 of them.
//   Mean: standard error sigma / sqrt(N); we allow 4.
//   NMAS interval: twice the 90th percentile of |e|, which for N(0, sigma) is 1.6449 sigma
//   (normal quantile 0.95), so the interval is 3.2898 sigma (as NSSDA Appendix 3-D relates NMAS
//   to RMSE_z, from memory). The quantile's standard error is sqrt(p (1 - p) / N) / f(q), with
//   f(q) = 2 phi(1.6449) / sigma = 0.2063 / sigma the density of |e| there: 0.0325 sigma at
//   N = 2000, twice that for the interval; we allow 4.
#include <catch2/catch.hpp>
#include <cmath>
#include <random>

#include "fixtures.hpp"
#include "sheetmill/accuracy/assess.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::accuracy;
namespace st = sheetmill::test;
using Catch::Detail::Approx;

namespace {

constexpr int kN = 2000;
constexpr double kSigma = 0.5;
// DEM: 200 x 200 cells of 10 m from (400 000, 5 200 000), UTM 32N.
constexpr double kX0 = 400000, kY0 = 5200000, kCell = 10;

struct Synthetic {
  std::vector<fixture::PointRecord> points;
  std::vector<double> errors;  // the errors put in (DEM minus surveyed)
};

Synthetic make_points(std::uint64_t seed, double bias_m, const fixture::Plane& plane) {
  std::mt19937_64 rng(seed);
  std::uniform_real_distribution<double> along(5, 1995);  // inside the 2 km square
  std::normal_distribution<double> noise(0, kSigma);
  Synthetic s;
  for (int i = 0; i < kN; ++i) {
    Point p{kX0 + along(rng), kY0 - along(rng)};
    double e = bias_m + noise(rng);
    s.errors.push_back(e);
    s.points.push_back({"P" + std::to_string(i), p, plane.at(p) - e, ""});
  }
  return s;
}

}  // namespace

TEST_CASE("Gaussian errors of sigma 0.5 m come back as RMSE, accuracy and NMAS interval",
          "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  fixture::write_plane_dem(dir / "dem.tif", plane, 200, 200, kX0, kY0, kCell, 32632);
  Synthetic s = make_points(42, 0, plane);
  fixture::write_points(dir / "points.gpkg", s.points, 32632);
  CheckPointSource src;
  src.path = (dir / "points.gpkg").string();
  Assessment a = assess_vertical((dir / "dem.tif").string(), src);
  REQUIRE(a.used == kN);
  // Each residual is exactly the error put in (float32 DEM cells of ~250 m: 3e-5 m steps).
  for (int i = 0; i < kN; ++i) CHECK(a.residuals[i].error_m == Approx(s.errors[i]).margin(1e-3));
  const double se_rmse = kSigma / std::sqrt(2.0 * kN);
  CHECK(a.all.rmse_m == Approx(kSigma).margin(4 * se_rmse));
  CHECK(a.all.sd_m == Approx(kSigma).margin(4 * se_rmse));
  CHECK(a.all.nssda_95_m == Approx(1.96 * kSigma).margin(1.96 * 4 * se_rmse));
  CHECK(a.all.mean_m == Approx(0).margin(4 * kSigma / std::sqrt(double(kN))));
  CHECK(a.all.nmas_interval_m == Approx(3.2898 * kSigma).margin(4 * 2 * 0.0325 * kSigma));
  // Gaussian draws: 3 SD is exceeded by 0.27 % of them, about 5 of 2000; well under 1 %.
  CHECK(a.outlier_ids.size() < kN / 100);
}

TEST_CASE("a bias added to the errors is recovered as the mean", "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  fixture::write_plane_dem(dir / "dem.tif", plane, 200, 200, kX0, kY0, kCell, 32632);
  const double bias = 0.3;
  Synthetic s = make_points(7, bias, plane);
  fixture::write_points(dir / "points.gpkg", s.points, 32632);
  CheckPointSource src;
  src.path = (dir / "points.gpkg").string();
  Assessment a = assess_vertical((dir / "dem.tif").string(), src);
  const double se_mean = kSigma / std::sqrt(double(kN));
  CHECK(a.all.mean_m == Approx(bias).margin(4 * se_mean));
  CHECK(a.all.sd_m == Approx(kSigma).margin(4 * kSigma / std::sqrt(2.0 * kN)));
  // RMSE^2 = bias^2 + sigma^2 for a biased normal: sqrt(0.09 + 0.25) = 0.583095.
  CHECK(a.all.rmse_m == Approx(std::sqrt(bias * bias + kSigma * kSigma)).margin(0.03));
}

TEST_CASE("points in another CRS and in feet give the same residuals", "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  fixture::write_plane_dem(dir / "dem.tif", plane, 200, 200, kX0, kY0, kCell, 32632);
  Synthetic s = make_points(3, 0, plane);
  s.points.resize(200);
  fixture::write_points(dir / "utm.gpkg", s.points, 32632);
  // The same points in WGS 84 longitude/latitude (PROJ through OGR as the oracle), heights in
  // international feet (0.3048 m).
  gdal_init();
  OGRSpatialReference utm, wgs;
  utm.importFromEPSG(32632);
  wgs.importFromEPSG(4326);
  utm.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  wgs.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  CoordinateTransformPtr ct(OGRCreateCoordinateTransformation(&utm, &wgs));
  REQUIRE(ct);
  auto geo = s.points;
  for (auto& p : geo) {
    REQUIRE(ct->Transform(1, &p.xy.x, &p.xy.y));
    p.height = *p.height / 0.3048;
  }
  fixture::write_points(dir / "geo.gpkg", geo, 4326);
  CheckPointSource a_src, b_src;
  a_src.path = (dir / "utm.gpkg").string();
  b_src.path = (dir / "geo.gpkg").string();
  b_src.height_unit_m = 0.3048;
  Assessment a = assess_vertical((dir / "dem.tif").string(), a_src);
  Assessment b = assess_vertical((dir / "dem.tif").string(), b_src);
  REQUIRE(a.used == b.used);
  for (std::size_t i = 0; i < a.residuals.size(); ++i) {
    // Round trip through PROJ: well under a millimetre; heights the same to float precision.
    CHECK(b.residuals[i].xy.x == Approx(a.residuals[i].xy.x).margin(1e-3));
    CHECK(b.residuals[i].error_m == Approx(a.residuals[i].error_m).margin(1e-4));
  }
  CHECK(b.all.rmse_m == Approx(a.all.rmse_m).margin(1e-5));
}

TEST_CASE("vegetated points get the ASPRS 95th percentile, the others NVA", "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  fixture::write_plane_dem(dir / "dem.tif", plane, 50, 50, kX0, kY0, kCell, 32632);
  // Bare ground: errors {0.1, -0.1} x 10 -> RMSE 0.1, NVA = 1.96 x 0.1 = 0.196.
  // Forest: |e| = 0.1, 0.2, ..., 2.0 (20 points) -> position 19 x 0.95 + 1 = 19.05 ->
  // 1.9 + 0.05 x 0.1 = 1.905.
  std::vector<fixture::PointRecord> pts;
  for (int i = 0; i < 20; ++i) {
    Point p{kX0 + 12.5 + 20 * i, kY0 - 100};
    double e = i % 2 ? 0.1 : -0.1;
    pts.push_back({"B" + std::to_string(i), p, plane.at(p) - e, "bare"});
    Point q{kX0 + 12.5 + 20 * i, kY0 - 300};
    double f = 0.1 * (i + 1) * (i % 2 ? 1 : -1);
    pts.push_back({"F" + std::to_string(i), q, plane.at(q) - f, "forest"});
  }
  fixture::write_points(dir / "points.gpkg", pts, 32632);
  CheckPointSource src;
  src.path = (dir / "points.gpkg").string();
  src.cover_field = "cover";
  AssessOptions o;
  o.vegetated_classes = {"forest", "scrub"};
  Assessment a = assess_vertical((dir / "dem.tif").string(), src, o);
  REQUIRE(a.has_cover);
  CHECK(a.non_vegetated.count == 20);
  CHECK(a.vegetated.count == 20);
  CHECK(a.non_vegetated.nssda_95_m == Approx(0.196).margin(1e-4));
  CHECK(a.vegetated.abs_p95_m == Approx(1.905).margin(1e-4));
}

TEST_CASE("points outside, on nodata and repeated are refused and counted", "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  // 20 x 20 cells; the first row is nodata (-9999).
  fixture::write_plane_dem(dir / "dem.tif", plane, 20, 20, kX0, kY0, kCell, 32632, -9999.0f);
  Point inside{kX0 + 55, kY0 - 105}, edge{kX0 + 55, kY0 - 2};
  std::vector<fixture::PointRecord> pts{
      {"A", inside, plane.at(inside), ""},
      {"A", {inside.x + 20, inside.y}, plane.at(inside), ""},  // same ID
      {"C", inside, plane.at(inside), ""},                     // same spot
      {"D", {kX0 - 50, kY0 - 50}, 100.0, ""},                  // outside
      {"E", edge, 100.0, ""},                                  // on the nodata row
      {"F", {kX0 + 150, kY0 - 150}, std::nullopt, ""},         // no height
  };
  fixture::write_points(dir / "points.gpkg", pts, 32632);
  CheckPointSource src;
  src.path = (dir / "points.gpkg").string();
  Assessment a = assess_vertical((dir / "dem.tif").string(), src);
  CHECK(a.used == 1);
  CHECK(a.duplicate == 2);
  CHECK(a.outside == 1);
  CHECK(a.nodata == 1);
  CHECK(a.no_height == 1);
  CHECK(a.residuals[0].error_m == Approx(0).margin(1e-3));
}
