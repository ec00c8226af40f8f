// Douglas-Peucker with the box-tree split search must keep exactly the vertices the textbook
// algorithm keeps (Douglas and Peucker 1973: recursive split at the vertex farthest from the
// chord, lowest index on a tie), including on the line shape that made a linear scan quadratic.
#include "sheetmill/features/simplify.hpp"

#include <catch2/catch.hpp>
#include <random>

using namespace sheetmill;
using namespace sheetmill::features;

namespace {
// The textbook algorithm, recursive, with a front-to-back scan for the farthest vertex.
void reference_mark(const Polyline& l, std::size_t a, std::size_t b, double tol,
                    std::vector<char>& keep) {
  double worst = -1;
  std::size_t at = a;
  for (std::size_t i = a + 1; i < b; ++i) {
    Point ab = l[b] - l[a];
    double len2 = dot(ab, ab);
    double d = len2 == 0
                   ? distance(l[i], l[a])
                   : distance(l[i], l[a] + ab * std::clamp(dot(l[i] - l[a], ab) / len2, 0.0, 1.0));
    if (d > worst) {
      worst = d;
      at = i;
    }
  }
  if (worst <= tol) return;
  keep[at] = 1;
  reference_mark(l, a, at, tol, keep);
  reference_mark(l, at, b, tol, keep);
}

Polyline reference_simplify(const Polyline& l, double tol) {
  std::vector<char> keep(l.size(), 0);
  keep.front() = keep.back() = 1;
  reference_mark(l, 0, l.size() - 1, tol, keep);
  Polyline out;
  for (std::size_t i = 0; i < l.size(); ++i)
    if (keep[i]) out.push_back(l[i]);
  return out;
}

bool same(const Polyline& a, const Polyline& b) {
  if (a.size() != b.size()) return false;
  for (std::size_t i = 0; i < a.size(); ++i)
    if (a[i].x != b[i].x || a[i].y != b[i].y) return false;
  return true;
}
}  // namespace

TEST_CASE("the simplified line is vertex for vertex the textbook Douglas-Peucker result",
          "[features][simplify]") {
  std::mt19937 random(14);  // fixed seed: the same lines every run
  std::normal_distribution<double> step(0, 0.05);
  for (int trial = 0; trial < 40; ++trial) {
    Polyline walk{{0, 0}};
    std::size_t n = 50 + 97 * static_cast<std::size_t>(trial);
    for (std::size_t i = 1; i < n; ++i)
      walk.push_back(walk.back() + Point{step(random), step(random)});
    // Lattice points make exact ties in distance, where the lowest index must win.
    Polyline lattice;
    for (std::size_t i = 0; i < n; ++i) lattice.push_back({double(i % 7), double((i * 3) % 5)});
    for (const Polyline& line : {walk, lattice}) {
      for (double tol : {0.0, 0.01, 0.1, 1.0}) {
        Polyline ours = line;
        simplify_polyline(ours, tol);
        CHECK(same(ours, reference_simplify(line, tol)));
      }
    }
  }
}

TEST_CASE("a zigzag of growing amplitude keeps every vertex", "[features][simplify]") {
  // Each split of this line peels off a single vertex: n splits of n vertices each for a scan.
  // 20,000 vertices (the 200,000 of bench-sized runs take about a second; the old scan took 6
  // minutes there); the test checks the result, the time is the benchmark's to measure.
  Polyline zigzag;
  for (int i = 0; i < 20000; ++i)
    zigzag.push_back({i * 1e-3, (i % 2 ? 1.0 : -1.0) * (1 + i * 1e-4)});
  Polyline ours = zigzag;
  simplify_polyline(ours, 0.05);
  CHECK(same(ours, reference_simplify(zigzag, 0.05)));
}
