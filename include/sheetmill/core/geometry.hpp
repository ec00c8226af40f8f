#pragma once
// Plain geometric values shared by every stage. Coordinates are in the unit of the frame they
// are stated in: ground metres of the sheet CRS, or millimetres on the page (y down).

#include <algorithm>
#include <cmath>
#include <limits>
#include <vector>

namespace sheetmill {

struct Point {
  double x = 0;
  double y = 0;
};

inline Point operator+(Point a, Point b) {
  return {a.x + b.x, a.y + b.y};
}
inline Point operator-(Point a, Point b) {
  return {a.x - b.x, a.y - b.y};
}
inline Point operator*(Point a, double s) {
  return {a.x * s, a.y * s};
}
inline double dot(Point a, Point b) {
  return a.x * b.x + a.y * b.y;
}
inline double cross(Point a, Point b) {
  return a.x * b.y - a.y * b.x;
}
// sqrt(x^2 + y^2), not std::hypot: glibc's hypot guards against overflow at a cost that was a
// quarter of contour preparation time (perf), and map coordinates (below 1e8 m, above 1e-6 m)
// square safely in double.
inline double length(Point a) {
  return std::sqrt(a.x * a.x + a.y * a.y);
}
inline double distance(Point a, Point b) {
  return length(a - b);
}

// Axis-aligned box; empty() when nothing has been added.
struct Box {
  double min_x = std::numeric_limits<double>::infinity();
  double min_y = std::numeric_limits<double>::infinity();
  double max_x = -std::numeric_limits<double>::infinity();
  double max_y = -std::numeric_limits<double>::infinity();

  static Box of(double x0, double y0, double x1, double y1) {
    return {std::min(x0, x1), std::min(y0, y1), std::max(x0, x1), std::max(y0, y1)};
  }
  bool empty() const { return !(min_x <= max_x && min_y <= max_y); }
  double width() const { return max_x - min_x; }
  double height() const { return max_y - min_y; }
  Point centre() const { return {(min_x + max_x) / 2, (min_y + max_y) / 2}; }
  void add(Point p) {
    min_x = std::min(min_x, p.x);
    min_y = std::min(min_y, p.y);
    max_x = std::max(max_x, p.x);
    max_y = std::max(max_y, p.y);
  }
  Box expanded(double d) const { return {min_x - d, min_y - d, max_x + d, max_y + d}; }
  bool intersects(const Box& o) const {
    return !(o.min_x > max_x || o.max_x < min_x || o.min_y > max_y || o.max_y < min_y);
  }
  bool contains(Point p) const {
    return p.x >= min_x && p.x <= max_x && p.y >= min_y && p.y <= max_y;
  }
};

using Polyline = std::vector<Point>;

}  // namespace sheetmill
