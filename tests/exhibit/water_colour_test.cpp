// Low ground must not read as water (issue 15): the default ramp has no blue or teal, and a lake
// keeps its own colour, darker or more saturated than the land around it. Colours are compared
// in CIE LCh(ab) from CIELAB (D65; to_lab is checked against published values in
// ramp_test.cpp). "Blue-teal" is taken as hue 170 to 290 degrees with chroma above 8 (common
// practice for naming hue sectors; the bounds are our choice, stated here).
#include <fmt/format.h>

#include <catch2/catch.hpp>
#include <cmath>

#include "exhibit_fixture.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/exhibit/colour_vision.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/ramps.hpp"
#include "sheetmill/exhibit/render_exhibit.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

namespace {

struct Lch {
  double l = 0, c = 0, h = 0;
};

Lch lch_of(const Colour& c) {
  const Lab lab = to_lab(c);
  double h = std::atan2(lab.b, lab.a) * 180 / M_PI;
  if (h < 0) h += 360;
  return {lab.l, std::hypot(lab.a, lab.b), h};
}

bool blue_teal(const Lch& x) {
  return x.c > 8 && x.h >= 170 && x.h <= 290;
}

}  // namespace

TEST_CASE("the default ramp has no blue or teal and stays safe for colour-vision deficiency",
          "[exhibit]") {
  const ShippedRamp& ramp = shipped_ramp(ExhibitProject{}.relief.ramp_name);
  CHECK(ramp.colour_vision_safe);
  for (int i = 0; i <= 64; ++i) {
    const Lch x = lch_of(ramp_colour_at(ramp, i / 64.0));
    INFO("t = " << i / 64.0 << ": L " << x.l << " C " << x.c << " h " << x.h);
    CHECK_FALSE(blue_teal(x));
  }
  // The same dichromat checks as the clearsight ramp (ramp_test.cpp): lightness rises under
  // simulated deuteranopia and protanopia, neighbouring stops at least 10 CIE76 units apart.
  for (Deficiency d : {Deficiency::deuteranopia, Deficiency::protanopia}) {
    double last = -1;
    for (int i = 0; i <= 64; ++i) {
      const double l = to_lab(simulate(ramp_colour_at(ramp, i / 64.0), d)).l;
      CHECK(l > last);
      last = l;
    }
    for (std::size_t i = 1; i < ramp.stops.size(); ++i)
      CHECK(delta_e76(to_lab(simulate(ramp.stops[i - 1].second, d)),
                      to_lab(simulate(ramp.stops[i].second, d))) >= 10);
  }
  // The blue-green ramp is the counter-example the check must catch.
  CHECK(blue_teal(lch_of(ramp_colour_at(shipped_ramp("clearsight"), 0))));
}

TEST_CASE("a lake on low ground is blue, and darker or more saturated than the land around it",
          "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-water");
  // Low ground in the west (the ramp's lowest colours), the lake there.
  fx::write_plane_dem(dir / "dem.tif", 100, 0.05, 50);
  const double e0 = fx::kE0 + 1000, e1 = fx::kE0 + 3000, n0 = fx::kN0 + 3000, n1 = fx::kN0 + 5000;
  sheetmill::test::write_text(dir / "lake.geojson", fmt::format(R"({{"type": "FeatureCollection",
 "crs": {{"type": "name", "properties": {{"name": "urn:ogc:def:crs:EPSG::32632"}}}},
 "features": [{{"type": "Feature", "properties": {{"name": "Test Mere"}},
   "geometry": {{"type": "Polygon",
     "coordinates": [[[{0}, {2}], [{1}, {2}], [{1}, {3}], [{0}, {3}], [{0}, {2}]]]}}}}]}})",
                                                                e0, e1, n0, n1));
  sheetmill::test::write_text(
      dir / "x.yaml", fx::exhibit_yaml(dir / "dem.tif", "ARCH D", false, 1,
                                       "  shading: 0\n  compression: lossless\n  dpi: 50\n"
                                       "  water_shade: \"#2f6fb0\"\n",
                                       fmt::format("context:\n  water_areas: {{file: {}}}\n",
                                                   (dir / "lake.geojson").string())));
  ExhibitReport rep = render_exhibit(load_exhibit_project(dir / "x.yaml"), dir / "x.pdf");
  const double dpi = 100;
  fx::Raster page = fx::rasterise(dir / "x.pdf", dpi, dir.path());
  auto sample = [&](double e, double n) {
    Point p = rep.layout.frame.to_page({e, n});
    fx::Rgb v =
        page.at(static_cast<int>(p.x / kMmPerInch * dpi), static_cast<int>(p.y / kMmPerInch * dpi));
    return lch_of({v.r / 255.0, v.g / 255.0, v.b / 255.0, 1});
  };
  const double n_mid = (n0 + n1) / 2;
  // Off the lake's centre, where its name is written.
  const Lch lake = sample(e0 + 300, n0 + 300);
  for (double e : {e0 - 500, e1 + 500}) {
    const Lch land = sample(e, n_mid);
    INFO("lake L " << lake.l << " C " << lake.c << " h " << lake.h << "; land L " << land.l << " C "
                   << land.c << " h " << land.h);
    CHECK_FALSE(blue_teal(land));
    CHECK(blue_teal(lake));
    CHECK((lake.l < land.l || lake.c > land.c));
  }
}
