// Line displacement against analytic cases: parallel straight lines, whose distance after
// displacement is known exactly (the sum of the two half-widths: "just touching").
#include "sheetmill/features/displace.hpp"

#include <catch2/catch.hpp>
#include <cmath>

using namespace sheetmill;
using features::DisplacedLine;

namespace {

Polyline straight(double y_mm, double x0_mm, double x1_mm) {
  return {{x0_mm, y_mm}, {x1_mm, y_mm}};
}

bool same(const Polyline& a, const Polyline& b) {
  if (a.size() != b.size()) return false;
  for (std::size_t i = 0; i < a.size(); ++i)
    if (a[i].x != b[i].x || a[i].y != b[i].y) return false;
  return true;
}

DisplacedLine line(Polyline l, double half_width_mm, int priority, double max_shift_mm, int group) {
  return {std::move(l), half_width_mm, priority, max_shift_mm, group};
}

}  // namespace

// Analytic: a railway (half-width 1.4 mm) on y = 0 and a road (half-width 0.55 mm) on y = 1,
// both 100 mm long. The road yields: every vertex of it moves straight away to y = 1.95, the sum
// of the half-widths, so the two inks touch and do not overlap; the railway stays as it was.
TEST_CASE("parallel lines closer than their widths are displaced exactly to touching",
          "[features][displace]") {
  std::vector<DisplacedLine> lines{line(straight(0, 0, 100), 1.4, 80, 0, 1),
                                   line(straight(1, 0, 100), 0.55, 50, 2.0, 2)};
  auto conflicts = features::displace_lines(lines);
  CHECK(conflicts.empty());
  CHECK(same(lines[0].line_mm, straight(0, 0, 100)));
  REQUIRE(lines[1].line_mm.size() >= 2);
  for (Point p : lines[1].line_mm) {
    CHECK(p.y == Approx(1.95).margin(1e-9));
    CHECK(p.x >= 0);
    CHECK(p.x <= 100);
  }
  CHECK(lines[1].line_mm.front().x == 0);
  CHECK(lines[1].line_mm.back().x == 100);
}

// The same with the road below the railway (y = -0.5): it moves down, to y = -1.95.
TEST_CASE("a yielding line moves to its own side", "[features][displace]") {
  std::vector<DisplacedLine> lines{line(straight(0, 0, 60), 1.4, 80, 0, 1),
                                   line(straight(-0.5, 0, 60), 0.55, 50, 2.0, 2)};
  CHECK(features::displace_lines(lines).empty());
  for (Point p : lines[1].line_mm) CHECK(p.y == Approx(-1.95).margin(1e-9));
}

// Lines that already clear each other (2 mm > 1.95 mm) stay exactly as they were.
TEST_CASE("lines that clear each other are not moved", "[features][displace]") {
  std::vector<DisplacedLine> lines{line(straight(0, 0, 60), 1.4, 80, 0, 1),
                                   line(straight(2.0, 0, 60), 0.55, 50, 2.0, 2)};
  CHECK(features::displace_lines(lines).empty());
  CHECK(same(lines[1].line_mm, straight(2.0, 0, 60)));
}

// Touching would need 1.95 - 0.2 = 1.75 mm, the limit is 1 mm: the road moves 1 mm, to y = 1.2,
// and the conflict (0.75 mm of overlap left) is reported.
TEST_CASE("beyond its limit a line moves the limit and the conflict is reported",
          "[features][displace]") {
  std::vector<DisplacedLine> lines{line(straight(0, 0, 100), 1.4, 80, 0, 1),
                                   line(straight(0.2, 0, 100), 0.55, 50, 1.0, 2)};
  auto conflicts = features::displace_lines(lines);
  REQUIRE(conflicts.size() == 1);
  CHECK(conflicts[0].line == 1);
  CHECK(conflicts[0].obstacle == 0);
  CHECK(conflicts[0].overlap_mm == Approx(0.75).margin(1e-9));
  for (Point p : lines[1].line_mm) CHECK(p.y == Approx(1.2).margin(1e-9));
}

// A road running beside a short railway (x from 40 to 60 mm) moves only along it, and bends back
// to its own course over the transition (8 mm per mm of shift, at least 3 mm: the parameters'
// defaults): far from the railway it stays put; the shift never jumps between neighbouring
// vertices by more than the raised cosine's steepest slope allows (pi/2 x shift / transition per
// mm of line, times the 0.5 mm resampling).
TEST_CASE("the connecting parts of a displaced line are smoothed", "[features][displace]") {
  std::vector<DisplacedLine> lines{line(straight(0, 40, 60), 1.4, 80, 0, 1),
                                   line(straight(1, 0, 100), 0.55, 50, 2.0, 2)};
  CHECK(features::displace_lines(lines).empty());
  const Polyline& road = lines[1].line_mm;
  const double shift = 0.95, transition = 8 * shift;
  double max_step = 0;
  for (std::size_t i = 0; i < road.size(); ++i) {
    const Point p = road[i];
    if (p.x >= 40 && p.x <= 60) CHECK(p.y == Approx(1.95).margin(1e-9));
    if (p.x < 40 - transition - 1.5 || p.x > 60 + transition + 1.5) CHECK(p.y == 1.0);
    if (i > 0) max_step = std::max(max_step, std::abs(road[i].y - road[i - 1].y));
  }
  CHECK(max_step <= 3.14159265358979323846 / 2 * shift / transition * 0.5 + 1e-9);
}

// A road crossing the railway at right angles (a level crossing) keeps its place.
TEST_CASE("crossing lines keep their place", "[features][displace]") {
  std::vector<DisplacedLine> lines{line(straight(0, -50, 50), 1.4, 80, 0, 1),
                                   line({{0, -30}, {0, 30}}, 0.55, 50, 2.0, 2)};
  CHECK(features::displace_lines(lines).empty());
  for (Point p : lines[1].line_mm) CHECK(p.x == 0);
}

// Lines of one group (one layer's network) never yield to each other.
TEST_CASE("lines of one group do not displace each other", "[features][displace]") {
  std::vector<DisplacedLine> lines{line(straight(0, 0, 60), 1.4, 80, 2.0, 7),
                                   line(straight(0.5, 0, 60), 0.55, 50, 2.0, 7)};
  CHECK(features::displace_lines(lines).empty());
  CHECK(same(lines[1].line_mm, straight(0.5, 0, 60)));
}

// A side road ending on the main road stays joined to it when the main road gives way: its end
// lies on the displaced main road (here both move to y = -1.95, away from the railway on y = 0).
TEST_CASE("junctions stay joined", "[features][displace]") {
  std::vector<DisplacedLine> lines{line(straight(0, 0, 100), 1.4, 80, 0, 1),
                                   line(straight(-1, 0, 100), 0.55, 50, 2.0, 2),
                                   line({{50.25, -1}, {50.25, -20}}, 0.4, 50, 2.0, 2)};
  CHECK(features::displace_lines(lines).empty());
  CHECK(features::distance_to_polyline(lines[2].line_mm.front(), lines[1].line_mm) < 1e-9);
  CHECK(lines[2].line_mm.front().y == Approx(-1.95).margin(1e-9));
  CHECK(lines[2].line_mm.back().y == -20);
}
