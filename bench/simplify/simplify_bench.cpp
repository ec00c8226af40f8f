// Douglas-Peucker on 200,000-vertex lines: the box-tree split search (simplify_polyline /
// simplify_ring) against the textbook front-to-back scan, side by side on the same input,
// with the ratio and a check that both keep the same vertices. Shapes: a circle (balanced
// splits), a spiral, a random walk, a parabola, and a zigzag of growing amplitude (each split
// peels off one vertex: the scan's quadratic case). Usage: simplify_bench [VERTICES] [--no-scan]
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstring>
#include <functional>
#include <random>
#include <string>

#include "sheetmill/features/simplify.hpp"

using namespace sheetmill;

namespace {
void scan_mark(const Polyline& l, std::size_t a, std::size_t b, double tol,
               std::vector<char>& keep) {
  std::vector<std::pair<std::size_t, std::size_t>> stack{{a, b}};
  while (!stack.empty()) {
    auto [s, e] = stack.back();
    stack.pop_back();
    double worst = -1;
    std::size_t at = s;
    Point ab = l[e] - l[s];
    double len2 = dot(ab, ab);
    for (std::size_t i = s + 1; i < e; ++i) {
      double d =
          len2 == 0 ? distance(l[i], l[s])
                    : distance(l[i], l[s] + ab * std::clamp(dot(l[i] - l[s], ab) / len2, 0.0, 1.0));
      if (d > worst) {
        worst = d;
        at = i;
      }
    }
    if (worst > tol) {
      keep[at] = 1;
      stack.push_back({s, at});
      stack.push_back({at, e});
    }
  }
}

Polyline scan_simplify(const Polyline& l, double tol) {
  std::vector<char> keep(l.size(), 0);
  keep.front() = keep.back() = 1;
  scan_mark(l, 0, l.size() - 1, tol, keep);
  Polyline out;
  for (std::size_t i = 0; i < l.size(); ++i)
    if (keep[i]) out.push_back(l[i]);
  return out;
}

double seconds(const std::function<void()>& f) {
  auto t0 = std::chrono::steady_clock::now();
  f();
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
}
}  // namespace

int main(int argc, char** argv) {
  const int n = argc > 1 && argv[1][0] != '-' ? std::atoi(argv[1]) : 200000;
  bool scan = true;
  for (int i = 1; i < argc; ++i) scan = scan && std::strcmp(argv[i], "--no-scan") != 0;
  const double tol = 0.05;
  std::vector<std::pair<std::string, Polyline>> shapes(5);
  std::mt19937 random(1);
  std::normal_distribution<double> step(0, 0.01);
  Point walk{0, 0};
  for (int i = 0; i < n; ++i) {
    double a = 2 * M_PI * i / n, t = double(i) / n;
    shapes[0].second.push_back({100 * std::cos(a), 100 * std::sin(a)});
    shapes[1].second.push_back(
        {(1 + 0.001 * i) * std::cos(0.01 * i), (1 + 0.001 * i) * std::sin(0.01 * i)});
    walk = walk + Point{step(random), step(random)};
    shapes[2].second.push_back(walk);
    shapes[3].second.push_back({t * 100, t * t * 100});
    shapes[4].second.push_back({i * 1e-3, (i % 2 ? 1.0 : -1.0) * (1 + i * 1e-4)});
  }
  const char* names[] = {"circle", "spiral", "walk", "parabola", "zigzag"};
  std::printf("%-9s %8s %8s %10s %10s %8s %s\n", "shape", "vertices", "kept", "tree_s", "scan_s",
              "ratio", "same");
  for (int k = 0; k < 5; ++k) {
    Polyline ours = shapes[k].second, theirs;
    double t_tree = seconds([&] { features::simplify_polyline(ours, tol); });
    double t_scan = scan ? seconds([&] { theirs = scan_simplify(shapes[k].second, tol); }) : 0;
    bool same = !scan || ours.size() == theirs.size();
    for (std::size_t i = 0; same && scan && i < ours.size(); ++i)
      same = ours[i].x == theirs[i].x && ours[i].y == theirs[i].y;
    std::printf("%-9s %8d %8zu %10.3f %10.3f %8.2f %s\n", names[k], n, ours.size(), t_tree, t_scan,
                scan ? t_scan / t_tree : 0.0, scan ? (same ? "yes" : "NO") : "-");
  }
  return 0;
}
