// Line symbols: offset geometry and dashes, checked analytically and by measuring the ink that
// Cairo lays down on an image surface.

#include "sheetmill/draw/line.hpp"

#include <catch2/catch.hpp>
#include <cmath>

#include "draw/raster_probe.hpp"

using namespace sheetmill;
using namespace sheetmill::draw;

TEST_CASE("parallel offset of a straight segment lies at exactly the offset", "[draw]") {
  // Direction of travel +x on a y-down page: its left is -y.
  Polyline l{{0, 0}, {10, 0}};
  Polyline o = offset_polyline(l, 1.5, style::LineJoin::miter);
  REQUIRE(o.size() == 2);
  CHECK(o[0].x == Approx(0));
  CHECK(o[0].y == Approx(-1.5));
  CHECK(o[1].x == Approx(10));
  CHECK(o[1].y == Approx(-1.5));
  // A slanted segment: the distance from every offset point to the original line is |offset|.
  Polyline s{{1, 2}, {7, 10}};
  for (const Point& p : offset_polyline(s, -0.75, style::LineJoin::round)) {
    Point d = s[1] - s[0];
    CHECK(std::abs(cross(d, p - s[0])) / length(d) == Approx(0.75));
  }
}

TEST_CASE("offset corners follow the join: miter meets at the corner bisector", "[draw]") {
  // Right then down (a clockwise turn on the page): left side is the outer side.
  Polyline l{{0, 0}, {10, 0}, {10, 10}};
  Polyline m = offset_polyline(l, 1, style::LineJoin::miter);
  REQUIRE(m.size() == 3);
  // Hand computation: offset lines y = -1 and x = 11 meet at (11, -1).
  CHECK(m[1].x == Approx(11));
  CHECK(m[1].y == Approx(-1));
  Polyline b = offset_polyline(l, 1, style::LineJoin::bevel);
  CHECK(b.size() == 4);
  Polyline r = offset_polyline(l, 1, style::LineJoin::round);
  CHECK(r.size() > 4);
  for (std::size_t i = 1; i + 1 < r.size(); ++i) CHECK(distance(r[i], {10, 0}) == Approx(1));
  // The inner side (right, offset -1) meets at (9, 1) whatever the join.
  Polyline in = offset_polyline(l, -1, style::LineJoin::round);
  REQUIRE(in.size() == 3);
  CHECK(in[1].x == Approx(9));
  CHECK(in[1].y == Approx(1));
}

TEST_CASE("an offset stroke puts its ink at the offset distance", "[draw]") {
  test::RasterProbe probe(20, 20, 20);  // 20 px per mm
  style::Stroke st;
  st.width_mm = 0.5;
  st.offset_mm = 3;  // to the left of +x travel: up on the page
  stroke_polyline(probe.cr(), {{2, 10}, {18, 10}}, st);
  // Ink-weighted centre of column x = 10 mm.
  int col = static_cast<int>(10 * probe.px_per_mm());
  double w = 0, wy = 0;
  for (int y = 0; y < probe.height(); ++y) {
    double k = probe.ink(col, y);
    w += k;
    wy += k * (y + 0.5);
  }
  REQUIRE(w > 0);
  CHECK(wy / w / probe.px_per_mm() == Approx(7.0).margin(0.025));  // 10 - 3 mm, half a pixel
  CHECK(w / probe.px_per_mm() == Approx(0.5).margin(0.025));       // the stroke's width
}

TEST_CASE("dashes are laid down with their stated lengths in mm", "[draw]") {
  test::RasterProbe probe(40, 4, 20);
  style::Stroke st;
  st.width_mm = 1;
  st.dash_mm = {3, 1.5};
  stroke_polyline(probe.cr(), {{0, 2}, {40, 2}}, st);
  // Runs of ink along the centre row.
  int row = static_cast<int>(2 * probe.px_per_mm());
  std::vector<int> on, off;
  bool inked = probe.ink(0, row) > 0.5;
  int run = 0;
  for (int x = 0; x < probe.width(); ++x) {
    bool k = probe.ink(x, row) > 0.5;
    if (k == inked) {
      ++run;
      continue;
    }
    (inked ? on : off).push_back(run);
    inked = k;
    run = 1;
  }
  REQUIRE(on.size() >= 7);  // 40 mm / 4.5 mm per period: 8 dashes, the last one cut by the edge
  for (int r : on) CHECK(r / probe.px_per_mm() == Approx(3.0).margin(0.05));
  for (std::size_t i = 0; i < off.size(); ++i)
    CHECK(off[i] / probe.px_per_mm() == Approx(1.5).margin(0.05));
}
