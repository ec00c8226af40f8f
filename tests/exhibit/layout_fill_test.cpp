// The exhibit's map uses the paper (issue 15): with terrain around the extent, the frame grows
// around it to fill the whole space between the title band and the furniture band, at the
// same tidy scale; it never reaches past the terrain (less a millimetre on paper), and without
// terrain beyond the extent it is the extent. Analytic page geometry: 1 m = 1000/N mm.
#include <catch2/catch.hpp>

#include "exhibit_fixture.hpp"
#include "sheetmill/exhibit/exhibit_layout.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

namespace {
std::vector<Point> ring_of(const Box& b) {
  return {{b.min_x, b.min_y}, {b.max_x, b.min_y}, {b.max_x, b.max_y}, {b.min_x, b.max_y}};
}
}  // namespace

TEST_CASE("the exhibit frame grows to fill the paper where there is terrain", "[exhibit]") {
  for (bool landscape : {false, true}) {
    INFO("landscape " << landscape);
    const ExhibitProject p =
        parse_exhibit_project(fx::exhibit_yaml("dem.tif", "ARCH E", landscape, 1), "ex.yaml");
    const ExhibitLayout plain = compute_exhibit_layout(p);
    const Box wide = p.extent.expanded(10000);
    const ExhibitLayout L = compute_exhibit_layout(p, ring_of(wide));
    const MapFrame& f = L.frame;
    CHECK(f.scale_denominator == plain.frame.scale_denominator);
    // The extent is still all there.
    CHECK(f.ground.min_x <= p.extent.min_x);
    CHECK(f.ground.max_x >= p.extent.max_x);
    CHECK(f.ground.min_y <= p.extent.min_y);
    CHECK(f.ground.max_y >= p.extent.max_y);
    // The space for the map: inside the margins, between the title and the furniture band.
    const double m = L.margin_mm, gap = 0.5 * m;
    const double space_w = L.page_w_mm - 2 * m;
    const double space_h = (L.colour_bar_box_mm.min_y - gap) - (L.title_box_mm.max_y + gap);
    CHECK(L.map_box_mm.width() == Approx(space_w).margin(0.01));
    CHECK(L.map_box_mm.height() == Approx(space_h).margin(0.01));
    CHECK(f.width_mm() == Approx(f.ground.width() * 1000 / f.scale_denominator));
    // Without the terrain: the bare extent, some paper left blank in one direction.
    CHECK(plain.frame.ground.width() == Approx(p.extent.width()));
    CHECK((plain.map_box_mm.width() < space_w - 1 || plain.map_box_mm.height() < space_h - 1));
  }
}

TEST_CASE("the exhibit frame stops a millimetre inside the terrain", "[exhibit]") {
  const ExhibitProject p =
      parse_exhibit_project(fx::exhibit_yaml("dem.tif", "ARCH E", true, 1), "ex.yaml");
  // Terrain 500 m past the extent on the west only.
  const Box data = Box::of(p.extent.min_x - 500, p.extent.min_y, p.extent.max_x, p.extent.max_y);
  const ExhibitLayout L = compute_exhibit_layout(p, ring_of(data));
  const double mm_m = L.frame.scale_denominator / 1000.0;  // ground metres per paper mm
  CHECK(L.frame.ground.min_x == Approx(data.min_x + mm_m).margin(1e-6));
  // The other sides cannot grow past the terrain: they stay on the extent (the growth would
  // need terrain there), shrunk by nothing since the extent itself is always shown.
  CHECK(L.frame.ground.max_x == Approx(p.extent.max_x));
  CHECK(L.frame.ground.min_y == Approx(p.extent.min_y));
  CHECK(L.frame.ground.max_y == Approx(p.extent.max_y));
}
