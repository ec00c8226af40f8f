#include "sheetmill/demo/route.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <queue>

#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

namespace {

struct Move {
  int dc, dr;
  double len;  // in cells
};

std::vector<Move> make_moves() {
  std::vector<Move> m;
  const int base[5][2] = {{1, 0}, {1, 1}, {2, 1}, {3, 1}, {3, 2}};
  for (const auto& b : base) {
    for (int sx : {1, -1}) {
      for (int sy : {1, -1}) {
        for (int swap = 0; swap < 2; ++swap) {
          int dc = (swap ? b[1] : b[0]) * sx;
          int dr = (swap ? b[0] : b[1]) * sy;
          bool dup = false;
          for (const Move& e : m) dup = dup || (e.dc == dc && e.dr == dr);
          if (!dup) m.push_back({dc, dr, std::hypot(dc, dr)});
        }
      }
    }
  }
  return m;
}

const std::vector<Move>& moves() {
  static const std::vector<Move> m = make_moves();
  return m;
}

}  // namespace

RouteGrid::RouteGrid(const FloatGrid& dem, double cell_m) {
  Box b = dem.spec.bounds();
  spec_.x0 = b.min_x;
  spec_.y_top = b.max_y;
  spec_.cell_m = cell_m;
  spec_.width = static_cast<int>(std::floor(b.width() / cell_m));
  spec_.height = static_cast<int>(std::floor(b.height() / cell_m));
  z_.resize(spec_.size());
  for (int r = 0; r < spec_.height; ++r) {
    for (int c = 0; c < spec_.width; ++c) {
      z_[static_cast<std::size_t>(r) * spec_.width + c] =
          static_cast<float>(sample(dem, spec_.centre(c, r)));
    }
  }
  kind_.assign(spec_.size(), NodeKind::land);
  discount_.assign(spec_.size(), 1.0f);
}

void RouteGrid::mark_line(const Polyline& line, double radius_m, NodeKind k) {
  int reach = static_cast<int>(std::ceil(radius_m / spec_.cell_m));
  for (const Point& p : densify(line, spec_.cell_m / 2)) {
    int c0 = spec_.col_clamped(p.x), r0 = spec_.row_clamped(p.y);
    for (int r = r0 - reach; r <= r0 + reach; ++r) {
      for (int c = c0 - reach; c <= c0 + reach; ++c) {
        if (!spec_.inside(c, r) || distance(spec_.centre(c, r), p) > radius_m) continue;
        NodeKind& cur = kind_[static_cast<std::size_t>(r) * spec_.width + c];
        cur = std::max(cur, k);
      }
    }
  }
}

std::vector<int> RouteGrid::route(int from, int to, const RouteCost& cost) const {
  return search(from, to, nullptr, cost);
}

std::vector<int> RouteGrid::route_to_any(int from, const std::vector<char>& targets,
                                         const RouteCost& cost) const {
  return search(from, -1, &targets, cost);
}

std::vector<int> RouteGrid::search(int from, int to, const std::vector<char>* targets,
                                   const RouteCost& cost) const {
  const int w = spec_.width;
  const double cell = spec_.cell_m;
  std::vector<double> g(spec_.size(), std::numeric_limits<double>::infinity());
  std::vector<int> came(spec_.size(), -1);
  std::vector<char> closed(spec_.size(), 0);
  using Item = std::pair<double, int>;
  std::priority_queue<Item, std::vector<Item>, std::greater<Item>> open;
  Point goal = to >= 0 ? position(to) : Point{};
  // Weighted toward the goal (not admissible where discounts apply): routes need to be good,
  // not optimal, and this keeps each search to a corridor.
  auto h = [&](int n) { return to >= 0 ? distance(position(n), goal) : 0.0; };
  g[from] = 0;
  open.push({h(from), from});
  int reached = -1;
  while (!open.empty()) {
    auto [f, n] = open.top();
    open.pop();
    if (closed[n]) continue;
    closed[n] = 1;
    if (n == to || (targets && (*targets)[n])) {
      reached = n;
      break;
    }
    int col = n % w, row = n / w;
    for (const Move& m : moves()) {
      int c = col + m.dc, r = row + m.dr;
      if (!spec_.inside(c, r)) continue;
      int k = r * w + c;
      if (closed[k] || kind_[k] == NodeKind::blocked) continue;
      double len = m.len * cell;
      double step;
      bool bridge = kind_[k] == NodeKind::bridge || kind_[n] == NodeKind::bridge;
      if (bridge) {
        step = len * cost.bridge_factor;
        if (kind_[k] == NodeKind::land) {
          // Leaving a bridge: the span from the last land node to here must keep the grade
          // too, or routes would use bridges to skip climbs.
          int land = n;
          for (int i = 0; i < 8 && land >= 0 && kind_[land] != NodeKind::land; ++i)
            land = came[land];
          if (land >= 0 && kind_[land] == NodeKind::land) {
            double span = distance(position(land), position(k));
            double grade = std::fabs(z_[k] - z_[land]) / std::max(span, cell);
            step += span * std::pow(grade / cost.comfortable_grade, cost.exponent);
          }
        }
      } else {
        // Grade over the move, and over its halves for long moves (so a route cannot hop a
        // ridge or a hollow between nodes).
        double zm = 0.5 * (z_[n] + z_[k]);
        if (m.len > 1.5) {
          int mc = col + m.dc / 2, mr = row + m.dr / 2;
          zm = z_[mr * w + mc];
          if (kind_[mr * w + mc] == NodeKind::blocked) continue;
        }
        double grade = std::max(std::fabs(zm - z_[n]), std::fabs(z_[k] - zm)) / (len / 2);
        step = len * (1 + std::pow(grade / cost.comfortable_grade, cost.exponent));
      }
      double ng = g[n] + step * discount_[k];
      if (ng < g[k]) {
        g[k] = ng;
        came[k] = n;
        open.push({ng + h(k), k});
      }
    }
  }
  std::vector<int> path;
  for (int n = reached; n >= 0; n = came[n]) path.push_back(n);
  std::reverse(path.begin(), path.end());
  return path;
}

Polyline path_to_line(const RouteGrid& grid, const std::vector<int>& path, const FloatGrid& dem) {
  Polyline line;
  for (std::size_t i = 0; i < path.size(); ++i) {
    bool end = i == 0 || i + 1 == path.size();
    if (!end && grid.kind(path[i]) == NodeKind::bridge) continue;
    line.push_back(grid.position(path[i]));
  }
  // Smooth, but keep a vertex where smoothing would steepen the road next to it (on a side
  // slope a vertex moved sideways lands higher or lower).
  Polyline smooth = smooth_open(line, 1);
  auto grade = [&](Point a, Point b) {
    return std::fabs(sample(dem, b) - sample(dem, a)) / std::max(distance(a, b), 1e-6);
  };
  for (std::size_t i = 1; i + 1 < line.size(); ++i) {
    double before = std::max(grade(line[i - 1], line[i]), grade(line[i], line[i + 1]));
    double after = std::max(grade(line[i - 1], smooth[i]), grade(smooth[i], line[i + 1]));
    if (after <= std::max(before, 0.04)) line[i] = smooth[i];
  }
  return line;
}

}  // namespace sheetmill::demo
