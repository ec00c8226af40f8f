// `sheetmill accuracy` end to end: bad input gives one line and exit 2, and nothing is written;
// good input writes the residuals and the report.
#include <algorithm>
#include <catch2/catch.hpp>
#include <fstream>

#include "fixtures.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::accuracy;
namespace st = sheetmill::test;

namespace {

constexpr double kX0 = 400000, kY0 = 5200000;

std::vector<fixture::PointRecord> grid_points(const fixture::Plane& plane, double dx = 0) {
  std::vector<fixture::PointRecord> pts;
  for (int i = 0; i < 25; ++i) {
    Point p{kX0 + 20 + 40 * (i % 5) + dx, kY0 - 20 - 40 * (i / 5)};
    pts.push_back({"Q" + std::to_string(i), p, plane.at(p) + 0.01 * (i % 3 - 1), ""});
  }
  return pts;
}

// One line on stderr, naming `file` and containing `what`; exit 2.
void check_one_line_error(const st::CommandResult& r, const std::string& file,
                          const std::string& what) {
  INFO(r.err);
  CHECK(r.exit_code == 2);
  CHECK(std::count(r.err.begin(), r.err.end(), '\n') == 1);
  CHECK(r.err.find(file) != std::string::npos);
  CHECK(r.err.find(what) != std::string::npos);
}

}  // namespace

TEST_CASE("accuracy: points without heights are one line, exit 2", "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  fixture::write_plane_dem(dir / "dem.tif", plane, 20, 20, kX0, kY0, 10, 32632);
  fixture::write_points(dir / "bare.gpkg", grid_points(plane), 32632, "");
  auto r = st::run_sheetmill({"accuracy", (dir / "dem.tif").string(), (dir / "bare.gpkg").string(),
                              "--report", (dir / "r.pdf").string()});
  check_one_line_error(r, "bare.gpkg", "no height field");
  CHECK_FALSE(std::filesystem::exists(dir / "r.pdf"));
  // A height field with no values in it is the same mistake.
  auto pts = grid_points(plane);
  for (auto& p : pts) p.height.reset();
  fixture::write_points(dir / "empty.gpkg", pts, 32632);
  r = st::run_sheetmill({"accuracy", (dir / "dem.tif").string(), (dir / "empty.gpkg").string()});
  check_one_line_error(r, "empty.gpkg", "no point has a height");
}

TEST_CASE("accuracy: points in another CRS without one stated are one line, exit 2", "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  fixture::write_plane_dem(dir / "dem.tif", plane, 20, 20, kX0, kY0, 10, 32632);
  fixture::write_points(dir / "nocrs.gpkg", grid_points(plane), 0);
  auto r =
      st::run_sheetmill({"accuracy", (dir / "dem.tif").string(), (dir / "nocrs.gpkg").string()});
  check_one_line_error(r, "nocrs.gpkg", "states no CRS");
  // Stated, it works.
  r = st::run_sheetmill({"accuracy", (dir / "dem.tif").string(), (dir / "nocrs.gpkg").string(),
                         "--points-crs", "EPSG:32632"});
  INFO(r.err);
  CHECK(r.exit_code == 0);
  CHECK(r.out.find("25 used") != std::string::npos);
}

TEST_CASE("accuracy: all points outside the DEM are one line, exit 2", "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  fixture::write_plane_dem(dir / "dem.tif", plane, 20, 20, kX0, kY0, 10, 32632);
  fixture::write_points(dir / "away.gpkg", grid_points(plane, 5000), 32632);
  auto r = st::run_sheetmill({"accuracy", (dir / "dem.tif").string(), (dir / "away.gpkg").string(),
                              "--residuals", (dir / "res.csv").string()});
  check_one_line_error(r, "away.gpkg", "none of the 25 check points");
  CHECK_FALSE(std::filesystem::exists(dir / "res.csv"));
}

TEST_CASE("accuracy: a wrong output extension is refused before any work", "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  fixture::write_plane_dem(dir / "dem.tif", plane, 20, 20, kX0, kY0, 10, 32632);
  fixture::write_points(dir / "p.gpkg", grid_points(plane), 32632);
  auto r = st::run_sheetmill({"accuracy", (dir / "dem.tif").string(), (dir / "p.gpkg").string(),
                              "--residuals", (dir / "res.txt").string()});
  check_one_line_error(r, "res.txt", ".csv or .gpkg");
}

TEST_CASE("accuracy: residuals as CSV and GeoPackage, one row per check point", "[accuracy]") {
  st::TempDir dir("acc");
  fixture::Plane plane;
  fixture::write_plane_dem(dir / "dem.tif", plane, 20, 20, kX0, kY0, 10, 32632);
  fixture::write_points(dir / "p.gpkg", grid_points(plane), 32632);
  auto r = st::run_sheetmill({"accuracy", (dir / "dem.tif").string(), (dir / "p.gpkg").string(),
                              "--residuals", (dir / "res.csv").string(), "--report",
                              (dir / "report.png").string()});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  std::string csv = st::read_text(dir / "res.csv");
  CHECK(std::count(csv.begin(), csv.end(), '\n') == 26);  // header + 25
  // Q1: surveyed = plane + 0.01 x (1 % 3 - 1) = plane + 0, so the error is 0; Q0: plane - 0.01,
  // error +0.01.
  CHECK(csv.find("\nQ0,") != std::string::npos);
  CHECK(csv.find(",0.0100,used,") != std::string::npos);
  // The PNG is a PNG (its signature), as the extension asked.
  std::ifstream png(dir / "report.png", std::ios::binary);
  char sig[8] = {};
  png.read(sig, 8);
  CHECK(std::string(sig + 1, 3) == "PNG");
  // GeoPackage: read back with ogrinfo (GDAL as the oracle).
  r = st::run_sheetmill({"accuracy", (dir / "dem.tif").string(), (dir / "p.gpkg").string(),
                         "--residuals", (dir / "res.gpkg").string()});
  REQUIRE(r.exit_code == 0);
  auto info = st::run_command({"ogrinfo", "-so", (dir / "res.gpkg").string(), "residuals"});
  CHECK(info.out.find("Feature Count: 25") != std::string::npos);
  CHECK(info.out.find("error_m: Real") != std::string::npos);
}
