// Clipping and generalisation of plain geometry, against hand-computed cases.

#include <catch2/catch.hpp>

#include "sheetmill/features/clip.hpp"
#include "sheetmill/features/simplify.hpp"

using namespace sheetmill;
using namespace sheetmill::features;

TEST_CASE("a line crossing the box is cut at the box edges", "[features]") {
  Box box = Box::of(0, 0, 10, 10);
  std::vector<Polyline> out;
  // In from the left at y = 5, out through the top, back in, and out to the right.
  clip_polyline({{-5, 5}, {5, 5}, {5, 15}, {8, 15}, {8, 5}, {15, 5}}, box, out);
  REQUIRE(out.size() == 2);
  REQUIRE(out[0].size() == 3);
  CHECK(out[0][0].x == Approx(0));
  CHECK(out[0][2].y == Approx(10));
  CHECK(out[1].front().x == Approx(8));
  CHECK(out[1].front().y == Approx(10));
  CHECK(out[1].back().x == Approx(10));
  CHECK(out[1].back().y == Approx(5));
  out.clear();
  clip_polyline({{20, 20}, {30, 30}}, box, out);
  CHECK(out.empty());
}

TEST_CASE("a ring is clipped to the box with its area preserved inside", "[features]") {
  auto area = [](const Polyline& r) {
    double a = 0;
    for (std::size_t i = 0; i < r.size(); ++i) a += cross(r[i], r[(i + 1) % r.size()]);
    return std::abs(a) / 2;
  };
  // A 10 x 10 square centred on the corner of the box: a quarter (25) lies inside.
  Polyline ring{{-5, -5}, {5, -5}, {5, 5}, {-5, 5}};
  Polyline c = clip_ring(ring, Box::of(0, 0, 100, 100));
  CHECK(area(c) == Approx(25));
  Polygon p{{{-5, -5}, {5, -5}, {5, 5}, {-5, 5}}, {{{1, 1}, {2, 1}, {2, 2}, {1, 2}}}};
  CHECK(clip_polygon(p, Box::of(0, 0, 100, 100)));
  CHECK(p.holes.size() == 1);
  CHECK_FALSE(clip_polygon(p, Box::of(50, 50, 60, 60)));
}

TEST_CASE("Douglas-Peucker keeps every removed point within the tolerance", "[features]") {
  Polyline line;
  for (int i = 0; i <= 1000; ++i) line.push_back({i * 0.01, 0.3 * std::sin(i * 0.02)});
  Polyline original = line;
  simplify_polyline(line, 0.05);
  CHECK(line.size() < original.size() / 5);
  CHECK(line.front().x == original.front().x);
  CHECK(line.back().x == original.back().x);
  // Douglas and Peucker (1973): each dropped point lies within the tolerance of the result.
  for (const Point& p : original) {
    double best = 1e9;
    for (std::size_t i = 0; i + 1 < line.size(); ++i) {
      Point a = line[i], b = line[i + 1], ab = b - a;
      double t = std::clamp(dot(p - a, ab) / dot(ab, ab), 0.0, 1.0);
      best = std::min(best, distance(p, a + ab * t));
    }
    CHECK(best <= 0.05 + 1e-12);
  }
  Polyline square{{0, 0}, {1, 0}, {1, 0.001}, {1, 1}, {0, 1}};
  simplify_ring(square, 0.01);
  CHECK(square.size() == 4);
}
