// Pole of inaccessibility by cell subdivision: Garcia-Castellanos and Lombardo (2007), Scottish
// Geographical Journal 123(3). Cells are refined best-first while a cell could still hold a point
// farther from the edges than the best found by more than `precision`.
#include <cmath>
#include <queue>

#include "sheetmill/labels/names.hpp"

namespace sheetmill::labels {

namespace {

// Signed distance from p to the area's edges: positive inside (even-odd), negative outside.
double signed_distance(Point p, const std::vector<Polyline>& rings) {
  bool inside = false;
  double best = INFINITY;
  for (const Polyline& r : rings) {
    const std::size_t n = r.size();
    for (std::size_t i = 0, j = n - 1; i < n; j = i++) {
      const Point a = r[i], b = r[j];
      if ((a.y > p.y) != (b.y > p.y) && p.x < (b.x - a.x) * (p.y - a.y) / (b.y - a.y) + a.x)
        inside = !inside;
      Point ab = b - a;
      double l2 = dot(ab, ab);
      double t = l2 > 0 ? std::clamp(dot(p - a, ab) / l2, 0.0, 1.0) : 0;
      best = std::min(best, distance(p, a + ab * t));
    }
  }
  return inside ? best : -best;
}

struct Cell {
  Point c;
  double half;
  double d;    // distance at the centre
  double max;  // upper bound inside the cell
};

}  // namespace

InteriorPoint pole_of_inaccessibility(const std::vector<Polyline>& rings, double precision) {
  Box box;
  for (const auto& r : rings)
    for (const Point& p : r) box.add(p);
  if (box.empty()) return {};
  auto make = [&](Point c, double h) {
    double d = signed_distance(c, rings);
    return Cell{c, h, d, d + h * std::sqrt(2.0)};
  };
  auto cmp = [](const Cell& a, const Cell& b) { return a.max < b.max; };
  std::priority_queue<Cell, std::vector<Cell>, decltype(cmp)> q(cmp);
  const double size = std::min(box.width(), box.height());
  Cell best = make(box.centre(), 0);
  if (size <= 0) return {best.c, std::max(0.0, best.d)};
  const double h = size / 2;
  for (double x = box.min_x; x < box.max_x; x += size)
    for (double y = box.min_y; y < box.max_y; y += size) q.push(make({x + h, y + h}, h));
  int guard = 0;
  while (!q.empty() && ++guard < 20000) {
    Cell c = q.top();
    q.pop();
    if (c.d > best.d) best = c;
    if (c.max - best.d <= precision) continue;
    const double k = c.half / 2;
    for (double dx : {-k, k})
      for (double dy : {-k, k}) q.push(make({c.c.x + dx, c.c.y + dy}, k));
  }
  return {best.c, std::max(0.0, best.d)};
}

}  // namespace sheetmill::labels
