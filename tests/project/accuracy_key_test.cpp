// The project's `accuracy:` key (docs/project.md, docs/accuracy.md): read with its path resolved,
// and its mistakes reported on one located line.
#include <catch2/catch.hpp>

#include "sheetmill/core/error.hpp"
#include "sheetmill/project/project.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

const char* kBase =
    "title: T\ncrs: EPSG:32632\nscale: 25000\npaper: {size: A3, orientation: landscape}\n"
    "extent: {centre: [480000, 5197000]}\nstyle: s.yaml\nelevation: {dem: dem.tif}\n";

std::string error_of(const test::TempDir& dir, const std::string& text) {
  auto path = dir / "p.yaml";
  test::write_text(path, text);
  try {
    project::load_project(path);
  } catch (const Error& e) {
    CHECK(e.exit_code() == 2);
    return e.what();
  }
  return "(no error)";
}

}  // namespace

TEST_CASE("accuracy: names the check points, resolved against the project", "[project]") {
  test::TempDir dir("proj");
  auto path = dir / "p.yaml";
  test::write_text(path, std::string(kBase) +
                             "accuracy:\n  points: control.gpkg\n  layer: bm\n"
                             "  height_field: h\n  id_field: name\n  crs: EPSG:4326\n"
                             "  height_unit: us-ft\n  cover_field: lc\n"
                             "  vegetated: [forest, scrub]\n  date: 2026-11-30\n");
  project::Project p = project::load_project(path);
  REQUIRE(p.accuracy);
  CHECK(p.accuracy->points == (dir.path() / "control.gpkg").string());
  CHECK(p.accuracy->layer == "bm");
  CHECK(p.accuracy->height_field == "h");
  CHECK(p.accuracy->id_field == "name");
  CHECK(p.accuracy->crs == std::optional<std::string>("EPSG:4326"));
  CHECK(p.accuracy->height_unit == "us-ft");
  CHECK(p.accuracy->vegetated == std::vector<std::string>{"forest", "scrub"});
  CHECK(p.accuracy->date == std::optional<std::string>("2026-11-30"));
}

TEST_CASE("accuracy: mistakes are one located line", "[project]") {
  test::TempDir dir("proj");
  // Line 10 is the `vegetated:` line (kBase has 7 lines, then "accuracy:" and "points:").
  std::string e =
      error_of(dir, std::string(kBase) + "accuracy:\n  points: c.gpkg\n  vegetated: [forest]\n");
  CHECK(e.find("p.yaml:10:") != std::string::npos);
  CHECK(e.find("accuracy.vegetated") != std::string::npos);
  CHECK(e.find("cover_field") != std::string::npos);
  e = error_of(dir, std::string(kBase) + "accuracy:\n  points: c.gpkg\n  height_unit: yards\n");
  CHECK(e.find("accuracy.height_unit") != std::string::npos);
  e = error_of(dir, std::string(kBase) + "accuracy:\n  layer: bm\n");
  CHECK(e.find("accuracy") != std::string::npos);
  CHECK(e.find("points") != std::string::npos);
  // Check points test a DEM: without elevation.dem there is nothing to test.
  std::string no_dem = kBase;
  no_dem.erase(no_dem.find("elevation:"));
  e = error_of(dir, no_dem + "accuracy:\n  points: c.gpkg\n");
  CHECK(e.find("elevation.dem") != std::string::npos);
}
