#include "sheetmill/text/collision_index.hpp"

#include <algorithm>
#include <cmath>

namespace sheetmill::text {

Quad rotated_box(Point origin, double w, double h, double angle_rad) {
  // Page y runs down: the box extends from the baseline upwards, i.e. towards -y in its own frame.
  double c = std::cos(angle_rad), s = std::sin(angle_rad);
  auto at = [&](double x, double y) {
    return Point{origin.x + x * c - y * s, origin.y + x * s + y * c};
  };
  return {at(0, 0), at(w, 0), at(w, -h), at(0, -h)};
}

Quad box_quad(const Box& b) {
  return {Point{b.min_x, b.min_y}, Point{b.max_x, b.min_y}, Point{b.max_x, b.max_y},
          Point{b.min_x, b.max_y}};
}

namespace {
// Separating-axis test for two convex quadrilaterals.
bool separated_on_axes_of(const Quad& a, const Quad& b) {
  for (int i = 0; i < 4; ++i) {
    Point e = a[(i + 1) % 4] - a[i];
    Point n{-e.y, e.x};
    if (n.x == 0 && n.y == 0) continue;
    double amin = 1e300, amax = -1e300, bmin = 1e300, bmax = -1e300;
    for (const auto& p : a) {
      double d = dot(p, n);
      amin = std::min(amin, d);
      amax = std::max(amax, d);
    }
    for (const auto& p : b) {
      double d = dot(p, n);
      bmin = std::min(bmin, d);
      bmax = std::max(bmax, d);
    }
    if (amax <= bmin || bmax <= amin) return true;
  }
  return false;
}

Box bounds_of(const Quad& q) {
  Box b;
  for (const auto& p : q) b.add(p);
  return b;
}
}  // namespace

bool quads_overlap(const Quad& a, const Quad& b) {
  return !separated_on_axes_of(a, b) && !separated_on_axes_of(b, a);
}

CollisionIndex::CollisionIndex(Box page_mm, double cell_mm) : page_(page_mm), cell_(cell_mm) {
  nx_ = std::max(1, static_cast<int>(std::ceil(page_.width() / cell_)));
  ny_ = std::max(1, static_cast<int>(std::ceil(page_.height() / cell_)));
  grid_.resize(static_cast<std::size_t>(nx_) * ny_);
}

void CollisionIndex::cells_of(const Quad& q, int& x0, int& y0, int& x1, int& y1) const {
  Box b = bounds_of(q);
  auto clampi = [](int v, int hi) { return std::clamp(v, 0, hi - 1); };
  x0 = clampi(static_cast<int>(std::floor((b.min_x - page_.min_x) / cell_)), nx_);
  x1 = clampi(static_cast<int>(std::floor((b.max_x - page_.min_x) / cell_)), nx_);
  y0 = clampi(static_cast<int>(std::floor((b.min_y - page_.min_y) / cell_)), ny_);
  y1 = clampi(static_cast<int>(std::floor((b.max_y - page_.min_y) / cell_)), ny_);
}

bool CollisionIndex::is_free(const Quad& q) const {
  if (!bounds_.empty()) {
    for (const auto& p : q) {
      if (!bounds_.contains(p)) return false;
    }
  }
  int x0, y0, x1, y1;
  cells_of(q, x0, y0, x1, y1);
  for (int y = y0; y <= y1; ++y) {
    for (int x = x0; x <= x1; ++x) {
      for (std::size_t i : grid_[static_cast<std::size_t>(y) * nx_ + x]) {
        if (quads_overlap(q, quads_[i])) return false;
      }
    }
  }
  return true;
}

bool CollisionIndex::all_free(const std::vector<Quad>& qs) const {
  return std::all_of(qs.begin(), qs.end(), [&](const Quad& q) { return is_free(q); });
}

void CollisionIndex::insert(const Quad& q) {
  std::size_t id = quads_.size();
  quads_.push_back(q);
  int x0, y0, x1, y1;
  cells_of(q, x0, y0, x1, y1);
  for (int y = y0; y <= y1; ++y) {
    for (int x = x0; x <= x1; ++x) grid_[static_cast<std::size_t>(y) * nx_ + x].push_back(id);
  }
}

void CollisionIndex::insert_all(const std::vector<Quad>& qs) {
  for (const auto& q : qs) insert(q);
}

}  // namespace sheetmill::text
