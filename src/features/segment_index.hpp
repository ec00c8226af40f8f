#pragma once
// Private to the features stage: the segments of a set of polylines in a uniform grid, for
// "which segments lie within r of this point or segment" in page millimetres.

#include <cmath>
#include <cstddef>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::features::detail {

struct Segment {
  Point a, b;
  std::size_t owner = 0;  // index of the polyline it belongs to
};

// The point of segment [a, b] nearest to p.
inline Point nearest_on_segment(Point p, Point a, Point b) {
  const Point d = b - a;
  const double len2 = dot(d, d);
  if (len2 <= 0) return a;
  const double t = std::clamp(dot(p - a, d) / len2, 0.0, 1.0);
  return a + d * t;
}

// Do segments [a, b] and [c, d] cross (a proper crossing or a touch)? `at` gets the point.
bool segments_cross(Point a, Point b, Point c, Point d, Point& at);

class SegmentIndex {
 public:
  SegmentIndex(std::vector<Segment> segments, double cell_mm);
  // Calls f(segment) for every segment whose cell range meets `box` (a superset of the
  // segments within the box; each segment at most once per call).
  template <class F>
  void near(const Box& box, F&& f) const {
    if (segments_.empty() || !box.intersects(bounds_)) return;
    ++stamp_;
    const int x0 = cell_x(box.min_x), x1 = cell_x(box.max_x);
    const int y0 = cell_y(box.min_y), y1 = cell_y(box.max_y);
    for (int y = y0; y <= y1; ++y)
      for (int x = x0; x <= x1; ++x)
        for (std::size_t i : cells_[static_cast<std::size_t>(y) * nx_ + x]) {
          if (seen_[i] == stamp_) continue;
          seen_[i] = stamp_;
          f(segments_[i]);
        }
  }

 private:
  int cell_x(double x) const;
  int cell_y(double y) const;
  std::vector<Segment> segments_;
  Box bounds_;
  double cell_ = 1;
  int nx_ = 1, ny_ = 1;
  std::vector<std::vector<std::size_t>> cells_;
  mutable std::vector<unsigned> seen_;
  mutable unsigned stamp_ = 0;
};

}  // namespace sheetmill::features::detail
