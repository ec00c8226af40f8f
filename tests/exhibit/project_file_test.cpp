// The exhibit project file: located errors for bad input, and the layout it leads to.
#include <catch2/catch.hpp>
#include <cmath>

#include "exhibit_fixture.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/exhibit/exhibit_layout.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

namespace {
std::string error_of(const std::string& yaml) {
  try {
    parse_exhibit_project(yaml, "ex.yaml");
  } catch (const Error& e) {
    CHECK(e.kind() == Error::Kind::input);
    return e.what();
  }
  return "";
}
}  // namespace

TEST_CASE("exhibit project errors name the file, line and key", "[exhibit]") {
  const std::string ok = fx::exhibit_yaml("dem.tif", "ARCH E", false, 2);
  CHECK(error_of(ok).empty());
  // An unknown key, with the closest known key suggested.
  std::string e = error_of(ok + "subtitel: x\n");
  CHECK(e.find("ex.yaml:") == 0);
  CHECK(e.find("subtitle") != std::string::npos);
  // A shipped ramp that does not exist.
  e = error_of(fx::exhibit_yaml("dem.tif", "ARCH E", false, 1, "  tint: rainbow\n"));
  CHECK(e.find("relief.tint") != std::string::npos);
  CHECK(e.find("clearsight") != std::string::npos);
  // Paper beyond the PDF page limit of 200 in.
  e = error_of(fx::exhibit_yaml("dem.tif", "210x100 in", false, 1));
  CHECK(e.find("200 in") != std::string::npos);
  // Exaggeration must be positive.
  e = error_of(fx::exhibit_yaml("dem.tif", "ARCH E", false, 0));
  CHECK(e.find("relief.exaggeration") != std::string::npos);
  // A stated scale at which the extent cannot fit.
  ExhibitProject p = parse_exhibit_project(ok + "scale: 1000\n", "ex.yaml");
  CHECK_THROWS_AS(compute_exhibit_layout(p), Error);
}

TEST_CASE("the layout shows the whole extent at an exact, tidy scale", "[exhibit]") {
  for (bool landscape : {false, true}) {
    ExhibitProject p =
        parse_exhibit_project(fx::exhibit_yaml("dem.tif", "ARCH E", landscape, 1), "ex.yaml");
    ExhibitLayout L = compute_exhibit_layout(p);
    const MapFrame& f = L.frame;
    CHECK(f.ground.min_x <= p.extent.min_x);
    CHECK(f.ground.max_x >= p.extent.max_x);
    CHECK(f.ground.min_y <= p.extent.min_y);
    CHECK(f.ground.max_y >= p.extent.max_y);
    // Two significant figures.
    const double unit = std::pow(10.0, std::floor(std::log10(f.scale_denominator)) - 1);
    CHECK(std::fmod(f.scale_denominator, unit) == Approx(0).margin(1e-6));
    // 1 km on the ground is 1e6 / N mm on paper.
    CHECK(f.to_page({f.ground.min_x + 1000, f.ground.max_y}).x -
              f.to_page({f.ground.min_x, f.ground.max_y}).x ==
          Approx(1e6 / f.scale_denominator));
    // Furniture inside the paper, below the map.
    CHECK(L.notes_box_mm.max_x <= L.page_w_mm);
    CHECK(L.notes_box_mm.min_y >= L.map_box_mm.max_y);
    CHECK(L.title_box_mm.max_y <= L.map_box_mm.min_y);
  }
  CHECK(tidy_scale(18234) == 19000);
  CHECK(tidy_scale(18000) == 18000);
  CHECK(tidy_scale(951) == 960);
}

TEST_CASE("the shipped demo exhibit project loads", "[exhibit]") {
  ExhibitProject p =
      load_exhibit_project(sheetmill::test::source_dir() / "demo_area" / "exhibit.yaml");
  CHECK(p.relief.exaggeration == 2);
  CHECK(p.areas.size() == 2);
  CHECK(p.areas[0].ring.size() == 4);
  CHECK(p.dim_outside == Approx(0.3));
  ExhibitLayout L = compute_exhibit_layout(p);
  CHECK(L.paper_name == "ARCH E");
  CHECK(L.page_w_mm > L.page_h_mm);  // landscape
}
