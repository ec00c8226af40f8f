#include "features/segment_index.hpp"

#include <algorithm>

namespace sheetmill::features::detail {

bool segments_cross(Point a, Point b, Point c, Point d, Point& at) {
  const Point r = b - a, s = d - c;
  const double denom = cross(r, s);
  if (denom == 0) return false;  // parallel: running together, not crossing
  const double t = cross(c - a, s) / denom;
  const double u = cross(c - a, r) / denom;
  if (t < 0 || t > 1 || u < 0 || u > 1) return false;
  at = a + r * t;
  return true;
}

SegmentIndex::SegmentIndex(std::vector<Segment> segments, double cell_mm)
    : segments_(std::move(segments)), cell_(cell_mm > 0 ? cell_mm : 1) {
  for (const Segment& s : segments_) {
    bounds_.add(s.a);
    bounds_.add(s.b);
  }
  if (segments_.empty()) return;
  // A grid of at most ~4 million cells: a line network across a sheet needs far fewer.
  const double span = std::max(bounds_.width(), bounds_.height());
  cell_ = std::max(cell_, span / 2000);
  nx_ = static_cast<int>(bounds_.width() / cell_) + 1;
  ny_ = static_cast<int>(bounds_.height() / cell_) + 1;
  cells_.resize(static_cast<std::size_t>(nx_) * ny_);
  seen_.assign(segments_.size(), 0);
  for (std::size_t i = 0; i < segments_.size(); ++i) {
    const Segment& s = segments_[i];
    const int x0 = cell_x(std::min(s.a.x, s.b.x)), x1 = cell_x(std::max(s.a.x, s.b.x));
    const int y0 = cell_y(std::min(s.a.y, s.b.y)), y1 = cell_y(std::max(s.a.y, s.b.y));
    for (int y = y0; y <= y1; ++y)
      for (int x = x0; x <= x1; ++x) cells_[static_cast<std::size_t>(y) * nx_ + x].push_back(i);
  }
}

int SegmentIndex::cell_x(double x) const {
  return std::clamp(static_cast<int>(std::floor((x - bounds_.min_x) / cell_)), 0, nx_ - 1);
}
int SegmentIndex::cell_y(double y) const {
  return std::clamp(static_cast<int>(std::floor((y - bounds_.min_y) / cell_)), 0, ny_ - 1);
}

}  // namespace sheetmill::features::detail
