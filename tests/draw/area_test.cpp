// Area symbols: hatch and point patterns anchored to the page so neighbours line up.

#include "sheetmill/draw/area.hpp"

#include <catch2/catch.hpp>

#include "draw/raster_probe.hpp"

using namespace sheetmill;
using namespace sheetmill::draw;

namespace {
Polyline rect(double x0, double y0, double x1, double y1) {
  return {{x0, y0}, {x1, y0}, {x1, y1}, {x0, y1}};
}

style::AreaSymbol hatched_and_dotted() {
  style::AreaSymbol a;
  style::Hatch h;
  h.spacing_mm = 1.7;
  h.angle_deg = 30;
  h.stroke.width_mm = 0.2;
  a.hatches.push_back(h);
  style::PatternFill p;
  style::ShapePart dot;
  dot.kind = style::ShapePart::Kind::circle;
  dot.size_mm = 0.6;
  dot.fill = Colour{0, 0, 0, 1};
  p.symbol.parts.push_back(dot);
  p.spacing_x_mm = 2.3;
  p.spacing_y_mm = 1.9;
  a.pattern = p;
  return a;
}

// Mean absolute difference of ink between two probes.
double mean_diff(test::RasterProbe& a, test::RasterProbe& b) {
  double s = 0;
  for (int y = 0; y < a.height(); ++y)
    for (int x = 0; x < a.width(); ++x) s += std::abs(a.ink(x, y) - b.ink(x, y));
  return s / (a.width() * a.height());
}
}  // namespace

TEST_CASE("two adjacent areas share the hatch and pattern phase", "[draw]") {
  // Two squares side by side, drawn separately, must look like one rectangle drawn at once:
  // hatch lines and pattern points are anchored to the page origin, not to each area.
  const auto sym = hatched_and_dotted();
  test::RasterProbe split(30, 15, 10), whole(30, 15, 10);
  draw_area(split.cr(), {rect(5, 2.5, 15, 12.5)}, sym);
  draw_area(split.cr(), {rect(15, 2.5, 25, 12.5)}, sym);
  draw_area(whole.cr(), {rect(5, 2.5, 25, 12.5)}, sym);
  // The seam at x = 15 mm falls on a pixel edge; what may differ is antialiasing where both
  // clip paths meet, a few pixels in 45 000.
  CHECK(mean_diff(split, whole) < 0.002);

  // And a control: the same right square drawn with the pattern anchored to the area instead
  // (shifted by a fraction of the spacing) differs clearly, so the check above can fail.
  test::RasterProbe shifted(30, 15, 10);
  draw_area(shifted.cr(), {rect(5, 2.5, 15, 12.5)}, sym);
  cairo_translate(shifted.cr(), 0.7, 0.4);
  draw_area(shifted.cr(), {rect(14.3, 2.1, 24.3, 12.1)}, sym);
  CHECK(mean_diff(shifted, whole) > 0.01);
}

TEST_CASE("hatch lines lie at whole multiples of the spacing from the page origin", "[draw]") {
  style::Hatch h;
  h.spacing_mm = 2;
  h.angle_deg = 0;  // horizontal lines y = 2k
  auto segs = hatch_segments(Box::of(3, 3.5, 9, 10.5), h);
  REQUIRE(!segs.empty());
  for (const auto& [a, b] : segs) {
    CHECK(a.y == Approx(b.y));
    CHECK(std::fmod(std::abs(a.y), 2.0) == Approx(0).margin(1e-9));
  }
  h.angle_deg = 90;  // vertical lines x = -2k (the normal points along -x at 90 degrees)
  for (const auto& [a, b] : hatch_segments(Box::of(3, 3, 9, 9), h)) {
    CHECK(a.x == Approx(b.x).margin(1e-9));
    CHECK(std::remainder(a.x, 2.0) == Approx(0).margin(1e-9));
  }
}

TEST_CASE("a hole stays empty (even-odd)", "[draw]") {
  style::AreaSymbol a;
  a.fill = Colour{0, 0, 0, 1};
  test::RasterProbe p(20, 20, 10);
  draw_area(p.cr(), {rect(2, 2, 18, 18), rect(8, 8, 12, 12)}, a);
  CHECK(p.ink(30, 30) > 0.99);    // at (3, 3) mm: inside the outer ring
  CHECK(p.ink(100, 100) < 0.01);  // at (10, 10) mm: inside the hole
}
