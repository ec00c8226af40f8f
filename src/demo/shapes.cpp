#include "sheetmill/demo/shapes.hpp"

#include <algorithm>
#include <cmath>

namespace sheetmill::demo {

bool point_in_ring(const Polyline& ring, Point p) {
  bool inside = false;
  std::size_t n = ring.size();
  for (std::size_t i = 0, j = n - 1; i < n; j = i++) {
    const Point& a = ring[i];
    const Point& b = ring[j];
    if ((a.y > p.y) != (b.y > p.y)) {
      double x = a.x + (p.y - a.y) * (b.x - a.x) / (b.y - a.y);
      if (p.x < x) inside = !inside;
    }
  }
  return inside;
}

double distance_to_segment(Point p, Point a, Point b, double* t_out) {
  Point ab = b - a;
  double len2 = dot(ab, ab);
  double t = len2 > 0 ? std::clamp(dot(p - a, ab) / len2, 0.0, 1.0) : 0.0;
  if (t_out) *t_out = t;
  return distance(p, a + ab * t);
}

double distance_to_polyline(const Polyline& line, Point p) {
  if (line.size() == 1) return distance(p, line[0]);
  double best = std::numeric_limits<double>::infinity();
  for (std::size_t i = 1; i < line.size(); ++i) {
    best = std::min(best, distance_to_segment(p, line[i - 1], line[i]));
  }
  return best;
}

double polyline_length(const Polyline& line) {
  double s = 0;
  for (std::size_t i = 1; i < line.size(); ++i) s += distance(line[i - 1], line[i]);
  return s;
}

double ring_area(const Polyline& ring) {
  double a = 0;
  for (std::size_t i = 0, j = ring.size() - 1; i < ring.size(); j = i++) {
    a += cross(ring[j], ring[i]);
  }
  return std::fabs(a) / 2;
}

void for_cells_in_ring(const GridSpec& spec, const Polyline& ring,
                       const std::function<void(int, int)>& visit) {
  Box box;
  for (const Point& p : ring) box.add(p);
  int r0 = std::max(0, static_cast<int>(std::floor(spec.row_of(box.max_y))));
  int r1 = std::min(spec.height - 1, static_cast<int>(std::ceil(spec.row_of(box.min_y))));
  std::vector<double> xs;
  for (int row = r0; row <= r1; ++row) {
    double y = spec.centre_y(row);
    xs.clear();
    for (std::size_t i = 0, j = ring.size() - 1; i < ring.size(); j = i++) {
      const Point& a = ring[i];
      const Point& b = ring[j];
      if ((a.y > y) != (b.y > y)) xs.push_back(a.x + (y - a.y) * (b.x - a.x) / (b.y - a.y));
    }
    std::sort(xs.begin(), xs.end());
    for (std::size_t k = 0; k + 1 < xs.size(); k += 2) {
      // Centres strictly inside [xs[k], xs[k+1]).
      int c0 = std::max(0, static_cast<int>(std::ceil(spec.col_of(xs[k]))));
      int c1 = std::min(spec.width - 1, static_cast<int>(std::ceil(spec.col_of(xs[k + 1]))) - 1);
      for (int col = c0; col <= c1; ++col) visit(col, row);
    }
  }
}

Polyline smooth_open(const Polyline& line, int passes) {
  Polyline cur = line;
  for (int p = 0; p < passes && cur.size() > 2; ++p) {
    Polyline next = cur;
    for (std::size_t i = 1; i + 1 < cur.size(); ++i) {
      next[i] = cur[i - 1] * 0.25 + cur[i] * 0.5 + cur[i + 1] * 0.25;
    }
    cur = std::move(next);
  }
  return cur;
}

Polyline chaikin_open(const Polyline& line, int passes) {
  Polyline cur = line;
  for (int p = 0; p < passes && cur.size() > 2; ++p) {
    Polyline next;
    next.push_back(cur.front());
    for (std::size_t i = 0; i + 1 < cur.size(); ++i) {
      Point a = cur[i];
      Point b = cur[i + 1];
      if (i > 0) next.push_back(a * 0.75 + b * 0.25);
      if (i + 2 < cur.size()) next.push_back(a * 0.25 + b * 0.75);
    }
    next.push_back(cur.back());
    cur = std::move(next);
  }
  return cur;
}

namespace {
void dp_keep(const Polyline& line, std::size_t i0, std::size_t i1, double tol,
             std::vector<char>& keep) {
  if (i1 <= i0 + 1) return;
  double worst = -1;
  std::size_t at = i0;
  for (std::size_t i = i0 + 1; i < i1; ++i) {
    double d = distance_to_segment(line[i], line[i0], line[i1]);
    if (d > worst) {
      worst = d;
      at = i;
    }
  }
  if (worst > tol) {
    keep[at] = 1;
    dp_keep(line, i0, at, tol, keep);
    dp_keep(line, at, i1, tol, keep);
  }
}
}  // namespace

Polyline simplify(const Polyline& line, double tol_m) {
  if (line.size() < 3) return line;
  std::vector<char> keep(line.size(), 0);
  keep.front() = keep.back() = 1;
  dp_keep(line, 0, line.size() - 1, tol_m, keep);
  Polyline out;
  for (std::size_t i = 0; i < line.size(); ++i)
    if (keep[i]) out.push_back(line[i]);
  return out;
}

Polyline densify(const Polyline& line, double step_m) {
  Polyline out;
  for (std::size_t i = 0; i < line.size(); ++i) {
    if (i > 0) {
      double d = distance(line[i - 1], line[i]);
      int n = static_cast<int>(std::ceil(d / step_m));
      for (int k = 1; k < n; ++k) {
        out.push_back(line[i - 1] + (line[i] - line[i - 1]) * (static_cast<double>(k) / n));
      }
    }
    out.push_back(line[i]);
  }
  return out;
}

Polyline rotated_rectangle(Point c, double length_m, double width_m, double angle_rad) {
  Point u{std::cos(angle_rad) * length_m / 2, std::sin(angle_rad) * length_m / 2};
  Point v{-std::sin(angle_rad) * width_m / 2, std::cos(angle_rad) * width_m / 2};
  return {c - u - v, c + u - v, c + u + v, c - u + v};
}

}  // namespace sheetmill::demo
