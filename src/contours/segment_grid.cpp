#include "contours/segment_grid.hpp"

#include <algorithm>
#include <cmath>

namespace sheetmill::contours::detail {

namespace {

double point_segment_distance(Point p, Point a, Point b) {
  Point ab = b - a;
  double len2 = dot(ab, ab);
  double t = len2 > 0 ? std::clamp(dot(p - a, ab) / len2, 0.0, 1.0) : 0.0;
  return distance(p, a + ab * t);
}

int orientation(Point a, Point b, Point c) {
  double v = cross(b - a, c - a);
  return (v > 0) - (v < 0);
}

bool on_segment(Point a, Point b, Point p) {
  return std::min(a.x, b.x) <= p.x && p.x <= std::max(a.x, b.x) && std::min(a.y, b.y) <= p.y &&
         p.y <= std::max(a.y, b.y);
}

Box segment_box(Point a, Point b) {
  return Box::of(a.x, a.y, b.x, b.y);
}

}  // namespace

bool segments_intersect(Point a, Point b, Point c, Point d) {
  int o1 = orientation(a, b, c), o2 = orientation(a, b, d);
  int o3 = orientation(c, d, a), o4 = orientation(c, d, b);
  if (o1 != o2 && o3 != o4) return true;
  if (o1 == 0 && on_segment(a, b, c)) return true;
  if (o2 == 0 && on_segment(a, b, d)) return true;
  if (o3 == 0 && on_segment(c, d, a)) return true;
  if (o4 == 0 && on_segment(c, d, b)) return true;
  return false;
}

double segment_distance(Point a, Point b, Point c, Point d) {
  if (segments_intersect(a, b, c, d)) return 0;
  return std::min({point_segment_distance(a, c, d), point_segment_distance(b, c, d),
                   point_segment_distance(c, a, b), point_segment_distance(d, a, b)});
}

SegmentGrid::SegmentGrid(const std::vector<ContourLine>& lines, double cell_hint) {
  std::size_t total = 0;
  for (const auto& l : lines) {
    for (const auto& p : l.ground) bounds_.add(p);
    total += segment_count(l);
  }
  if (bounds_.empty() || total == 0) return;
  // Keep the grid to about two cells per segment and at most 4 M cells.
  double area = std::max(bounds_.width() * bounds_.height(), 1e-12);
  cell_ = std::max({cell_hint, std::sqrt(area / (2.0 * static_cast<double>(total) + 1)),
                    std::sqrt(area / 4e6), 1e-9});
  nx_ = std::max(1, static_cast<int>(std::ceil(bounds_.width() / cell_)) + 1);
  ny_ = std::max(1, static_cast<int>(std::ceil(bounds_.height() / cell_)) + 1);
  std::size_t ncell = static_cast<std::size_t>(nx_) * ny_;
  start_.assign(ncell + 1, 0);
  auto each = [&](auto&& f) {
    for (std::uint32_t li = 0; li < lines.size(); ++li) {
      const auto& l = lines[li];
      std::size_t ns = segment_count(l);
      for (std::uint32_t s = 0; s < ns; ++s) {
        int x0, y0, x1, y1;
        cells(segment_box(seg_a(l, s), seg_b(l, s)), x0, y0, x1, y1);
        for (int y = y0; y <= y1; ++y)
          for (int x = x0; x <= x1; ++x) f(static_cast<std::size_t>(y) * nx_ + x, SegRef{li, s});
      }
    }
  };
  each([&](std::size_t c, SegRef) { ++start_[c + 1]; });
  for (std::size_t c = 0; c < ncell; ++c) start_[c + 1] += start_[c];
  items_.resize(start_[ncell]);
  std::vector<std::uint32_t> fill(start_.begin(), start_.end() - 1);
  each([&](std::size_t c, SegRef r) { items_[fill[c]++] = r; });
}

void SegmentGrid::cells(const Box& b, int& x0, int& y0, int& x1, int& y1) const {
  auto cx = [&](double x) {
    return std::clamp(static_cast<int>(std::floor((x - bounds_.min_x) / cell_)), 0, nx_ - 1);
  };
  auto cy = [&](double y) {
    return std::clamp(static_cast<int>(std::floor((y - bounds_.min_y) / cell_)), 0, ny_ - 1);
  };
  x0 = cx(b.min_x);
  x1 = cx(b.max_x);
  y0 = cy(b.min_y);
  y1 = cy(b.max_y);
}

}  // namespace sheetmill::contours::detail
