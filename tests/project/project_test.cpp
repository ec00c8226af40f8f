#include "sheetmill/project/project.hpp"

#include <catch2/catch.hpp>

#include "sheetmill/core/error.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {
std::string load_error(const test::TempDir& dir, const std::string& text) {
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
const char* kMinimal =
    "title: T\ncrs: EPSG:32632\nscale: 25000\npaper: {size: A3, orientation: landscape}\n"
    "extent: {centre: [480000, 5197000]}\nstyle: s.yaml\n";
}  // namespace

TEST_CASE("paper sizes follow ISO 216, ANSI and ARCH", "[project]") {
  // ISO 216: A0 841 x 1189 mm ... A4 210 x 297 mm. ANSI A-E 8.5x11 in to 34x44 in; ARCH A-E
  // 9x12 in to 36x48 in, E1 30x42 in (REFERENCES.md, paper sizes).
  struct Case {
    const char* name;
    double w, h;
  };
  const Case cases[] = {
      {"A0", 841, 1189},         {"A1", 594, 841},         {"A2", 420, 594},
      {"A3", 297, 420},          {"A4", 210, 297},         {"ANSI A", 215.9, 279.4},
      {"ANSI B", 279.4, 431.8},  {"ANSI C", 431.8, 558.8}, {"ANSI D", 558.8, 863.6},
      {"ANSI E", 863.6, 1117.6}, {"ARCH A", 228.6, 304.8}, {"ARCH B", 304.8, 457.2},
      {"ARCH C", 457.2, 609.6},  {"ARCH D", 609.6, 914.4}, {"ARCH E", 914.4, 1219.2},
      {"ARCH E1", 762, 1066.8}};
  for (const auto& c : cases) {
    auto p = project::paper_by_name(c.name);
    CHECK(p.width_mm == Approx(c.w).margin(1e-9));
    CHECK(p.height_mm == Approx(c.h).margin(1e-9));
  }
  CHECK(project::paper_by_name("arch-e1").name == "ARCH E1");
  CHECK_THROWS_AS(project::paper_by_name("B7"), Error);
}

TEST_CASE("a minimal project loads with paths resolved against its folder", "[project]") {
  test::TempDir dir;
  auto path = dir / "p.yaml";
  test::write_text(path, std::string(kMinimal) + "vector_data: data/f.gpkg\n");
  auto p = project::load_project(path);
  CHECK(p.paper.width_mm == Approx(420));
  CHECK(p.paper.height_mm == Approx(297));
  CHECK(p.extent.centre->x == 480000);
  CHECK(p.style == (dir.path() / "s.yaml"));
  auto src = project::source_for(p, "roads");
  CHECK(src.path == (dir.path() / "data/f.gpkg").string());
  CHECK(src.layer == "roads");
  CHECK_FALSE(src.required);
}

TEST_CASE("project errors name file, line:column, key path and what was expected", "[project]") {
  test::TempDir dir;
  std::string p = (dir / "p.yaml").string();
  CHECK(load_error(dir, std::string(kMinimal) + "scael: 3\n") ==
        p + ":7:1: scael: unknown key 'scael'; did you mean 'scale'?");
  CHECK(load_error(dir, "title: T\ncrs: EPSG:32632\nscale: big\n") ==
        p + ":3:8: scale: expected a scale from 1:1 to 1:100 000 000 such as 1:25000, 1:25 000 "
            "or 25000, got \"big\"");
  CHECK(load_error(dir, "title: T\ncrs: EPSG:1\nscale: 1000\npaper: {size: B9}\n") ==
        p + ":4:15: paper.size: unknown paper size 'B9' (known: A0, A1, A2, A3, A4, ANSI A, "
            "ANSI B, ANSI C, ANSI D, ANSI E, ARCH A, ARCH B, ARCH C, ARCH D, ARCH E, ARCH E1, or "
            "width and height)");
  CHECK(load_error(dir, std::string(kMinimal) + "contours: {interval: -5m}\n") ==
        p + ":7:22: contours.interval: expected a contour interval > 0");
  CHECK(load_error(dir, std::string(kMinimal) + "margin: 10\n") ==
        p + ":7:9: margin: expected a length such as 0.35mm (units: mm, cm, in, pt), got \"10\"");
  CHECK(load_error(dir, "title: [\n").rfind(p + ":", 0) == 0);
  CHECK(load_error(dir, "title: T\n") == p + ":1:1: missing required key 'crs'");
  std::string missing = (dir / "nope.yaml").string();
  try {
    project::load_project(missing);
    FAIL("no error");
  } catch (const Error& e) {
    CHECK(std::string(e.what()) == missing + ": file not found or not readable");
  }
}
