#include "features/farthest_point.hpp"

#include <algorithm>
#include <queue>

namespace sheetmill::features::detail {

double segment_distance(Point p, Point a, Point b) {
  Point ab = b - a;
  double len2 = dot(ab, ab);
  if (len2 == 0) return distance(p, a);
  double t = std::clamp(dot(p - a, ab) / len2, 0.0, 1.0);
  return distance(p, a + ab * t);
}

FarthestPointTree::FarthestPointTree(const Polyline& line) : line_(line) {
  std::size_t buckets = (line.size() + leaf_points - 1) / leaf_points;
  while (leaves_ < buckets) leaves_ *= 2;
  boxes_.assign(2 * leaves_, Box{});
  for (std::size_t i = 0; i < line.size(); ++i) boxes_[leaves_ + i / leaf_points].add(line[i]);
  for (std::size_t k = leaves_ - 1; k >= 1; --k) {
    const Box &l = boxes_[2 * k], &r = boxes_[2 * k + 1];
    boxes_[k] = Box{std::min(l.min_x, r.min_x), std::min(l.min_y, r.min_y),
                    std::max(l.max_x, r.max_x), std::max(l.max_y, r.max_y)};
  }
}

namespace {
// An upper bound of segment_distance over a box: the largest distance of its four corners, a
// little enlarged so that rounding in the per-vertex distance can never exceed it.
double corner_bound(const Box& b, Point a0, Point a1) {
  double worst = 0;
  for (Point c : {Point{b.min_x, b.min_y}, Point{b.min_x, b.max_y}, Point{b.max_x, b.min_y},
                  Point{b.max_x, b.max_y}}) {
    worst = std::max(worst, segment_distance(c, a0, a1));
  }
  return worst * (1 + 1e-9) + 1e-300;
}
}  // namespace

FarthestPointTree::Farthest FarthestPointTree::between(std::size_t first, std::size_t last) const {
  Farthest best{first, -1};
  if (last <= first + 1) return best;
  const Point a = line_[first], b = line_[last];
  auto scan = [&](std::size_t begin, std::size_t end) {
    for (std::size_t i = begin; i < end; ++i) {
      double d = segment_distance(line_[i], a, b);
      // The lowest index wins a tie, as in a scan from the front.
      if (d > best.distance || (d == best.distance && i < best.index)) best = {i, d};
    }
  };
  const std::size_t lo = first + 1, end = last;  // the vertices [lo, end)
  // Short ranges are scanned: the tree pays off only where a scan would be long.
  std::size_t leaf_lo = (lo + leaf_points - 1) / leaf_points, leaf_end = end / leaf_points;
  if (end - lo <= scan_points || leaf_lo >= leaf_end) {
    scan(lo, end);
    return best;
  }
  scan(lo, leaf_lo * leaf_points);
  scan(leaf_end * leaf_points, end);
  struct Node {
    double bound;
    std::size_t k;
    bool operator<(const Node& o) const { return bound < o.bound; }
  };
  std::priority_queue<Node> open;
  auto push = [&](std::size_t k) {
    if (!boxes_[k].empty()) open.push({corner_bound(boxes_[k], a, b), k});
  };
  // The nodes that exactly cover the whole leaves [leaf_lo, leaf_end) (segment-tree cover).
  for (std::size_t l = leaf_lo + leaves_, r = leaf_end + leaves_; l < r; l /= 2, r /= 2) {
    if (l & 1) push(l++);
    if (r & 1) push(--r);
  }
  while (!open.empty()) {
    Node n = open.top();
    open.pop();
    if (n.bound < best.distance) break;  // nothing left can be as far
    if (n.k >= leaves_) {
      std::size_t begin = (n.k - leaves_) * leaf_points;
      scan(begin, std::min(begin + leaf_points, line_.size()));
      continue;
    }
    push(2 * n.k);
    push(2 * n.k + 1);
  }
  return best;
}

}  // namespace sheetmill::features::detail
