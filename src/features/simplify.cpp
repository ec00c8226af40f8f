#include "sheetmill/features/simplify.hpp"

#include <utility>
#include <vector>

#include "features/farthest_point.hpp"

namespace sheetmill::features {

namespace {

// Douglas-Peucker over [first, last], marking kept points; iterative so long lines cannot
// overflow the stack, and each split's farthest vertex comes from the box tree, not a scan.
void mark(const detail::FarthestPointTree& tree, std::size_t first, std::size_t last, double tol,
          std::vector<char>& keep) {
  std::vector<std::pair<std::size_t, std::size_t>> stack{{first, last}};
  while (!stack.empty()) {
    auto [a, b] = stack.back();
    stack.pop_back();
    auto [at, worst] = tree.between(a, b);
    if (worst > tol) {
      keep[at] = 1;
      stack.push_back({a, at});
      stack.push_back({at, b});
    }
  }
}

void compact(Polyline& line, const std::vector<char>& keep) {
  std::size_t n = 0;
  for (std::size_t i = 0; i < line.size(); ++i)
    if (keep[i]) line[n++] = line[i];
  line.resize(n);
}

}  // namespace

void simplify_polyline(Polyline& line, double tolerance) {
  if (line.size() < 3) return;
  std::vector<char> keep(line.size(), 0);
  keep.front() = keep.back() = 1;
  detail::FarthestPointTree tree(line);
  mark(tree, 0, line.size() - 1, tolerance, keep);
  compact(line, keep);
}

void simplify_ring(Polyline& ring, double tolerance) {
  if (ring.size() <= 3) return;
  // Split the ring at its first point and the point farthest from it, simplify both halves.
  std::size_t far = 0;
  double worst = -1;
  for (std::size_t i = 1; i < ring.size(); ++i) {
    double d = distance(ring[i], ring[0]);
    if (d > worst) {
      worst = d;
      far = i;
    }
  }
  Polyline closed = ring;
  closed.push_back(ring[0]);
  std::vector<char> keep(closed.size(), 0);
  keep[0] = keep[far] = keep.back() = 1;
  detail::FarthestPointTree tree(closed);
  mark(tree, 0, far, tolerance, keep);
  mark(tree, far, closed.size() - 1, tolerance, keep);
  keep.back() = 0;  // the repeated first point
  std::size_t kept = 0;
  for (std::size_t i = 0; i + 1 < closed.size(); ++i) kept += keep[i];
  if (kept < 3) return;  // too small to simplify meaningfully; keep as is
  closed.pop_back();
  keep.pop_back();
  compact(closed, keep);
  ring = std::move(closed);
}

}  // namespace sheetmill::features
