#include "sheetmill/contours/prepare.hpp"

#include <algorithm>
#include <atomic>
#include <cmath>
#include <thread>

#include "contours/segment_grid.hpp"
#include "sheetmill/core/log.hpp"

namespace sheetmill::contours {

namespace {

using detail::segment_count;
using detail::SegmentGrid;
using detail::SegRef;

// Fraction of the clearance to other lines a vertex may move by (below one half, see header).
constexpr double kClearanceShare = 0.45;

struct Tolerances {
  double sigma_m;     // Gaussian smoothing
  double cap_m;       // largest displacement allowed anywhere
  double simplify_m;  // Douglas-Peucker tolerance
  double reach_m;     // clearance is measured up to this distance
  double self_gap_m;  // own segments nearer than this along the line are neighbours, not obstacles
};

// Runs f(i) for i in [0, n) on two threads (the machine's budget for one sheet).
template <class F>
void parallel_for(std::size_t n, F&& f) {
  std::atomic<std::size_t> next{0};
  auto work = [&] {
    for (std::size_t i; (i = next.fetch_add(1)) < n;) f(i);
  };
  if (n < 64) {
    work();
    return;
  }
  std::thread other(work);
  work();
  other.join();
}

std::vector<double> arclengths(const ContourLine& l) {
  std::vector<double> s(l.ground.size() + 1, 0.0);
  for (std::size_t i = 1; i < l.ground.size(); ++i)
    s[i] = s[i - 1] + distance(l.ground[i - 1], l.ground[i]);
  s[l.ground.size()] =
      s[l.ground.size() - 1] + (l.closed ? distance(l.ground.back(), l.ground.front()) : 0.0);
  return s;
}

// Clearance of each segment of line `li`: its distance to every other line and to the far parts
// of its own line, capped at reach.
std::vector<double> segment_clearance(const std::vector<ContourLine>& lines, std::size_t li,
                                      const std::vector<double>& arc, const SegmentGrid& grid,
                                      const Tolerances& t) {
  const ContourLine& l = lines[li];
  std::size_t ns = segment_count(l);
  double total = arc.back();
  std::vector<double> clear(ns, t.reach_m);
  for (std::size_t s = 0; s < ns; ++s) {
    Point a = detail::seg_a(l, s), b = detail::seg_b(l, s);
    double best = t.reach_m;
    grid.query(Box::of(a.x, a.y, b.x, b.y).expanded(t.reach_m), [&](SegRef r) {
      if (r.line == li) {
        double gap = std::abs(arc[r.seg] - arc[s]);
        if (l.closed) gap = std::min(gap, total - gap);
        if (gap < t.self_gap_m) return;
      }
      const ContourLine& o = lines[r.line];
      const Point c = detail::seg_a(o, r.seg), d = detail::seg_b(o, r.seg);
      // The boxes' gap bounds the distance from below: most grid neighbours are out of reach
      // and need no exact distance (a profile's largest item before this test).
      const double gx = std::max(
          {0.0, std::min(c.x, d.x) - std::max(a.x, b.x), std::min(a.x, b.x) - std::max(c.x, d.x)});
      const double gy = std::max(
          {0.0, std::min(c.y, d.y) - std::max(a.y, b.y), std::min(a.y, b.y) - std::max(c.y, d.y)});
      if (gx * gx + gy * gy >= best * best) return;
      best = std::min(best, detail::segment_distance(a, b, c, d));
    });
    clear[s] = best;
  }
  return clear;
}

// Gaussian moving average along the line; open lines keep their end points, and the window
// shrinks symmetrically near them so the ends are not pulled inwards.
Polyline smooth(const ContourLine& l, const std::vector<double>& arc, double sigma) {
  const Polyline& p = l.ground;
  std::size_t n = p.size();
  Polyline out = p;
  if (sigma <= 0 || n < 3) return out;
  double total = arc.back();
  double reach = 3 * sigma;
  auto seg_len = [&](std::size_t i) { return arc[i + 1] - arc[i]; };  // segment i -> i+1
  auto weight_len = [&](std::size_t j) {
    double before = j > 0 ? seg_len(j - 1) : (l.closed ? seg_len(n - 1) : 0.0);
    double after = (j + 1 < n || l.closed) ? seg_len(j) : 0.0;
    return (before + after) / 2;
  };
  for (std::size_t i = 0; i < n; ++i) {
    double h = reach;
    if (!l.closed) h = std::min({reach, arc[i], arc[n - 1] - arc[i]});
    if (h <= 0) continue;
    double wsum = weight_len(i), sx = p[i].x * wsum, sy = p[i].y * wsum;
    for (int dir : {-1, 1}) {
      for (std::size_t k = 1; k < n; ++k) {
        long jj = static_cast<long>(i) + dir * static_cast<long>(k);
        if (!l.closed && (jj < 0 || jj >= static_cast<long>(n))) break;
        std::size_t j = static_cast<std::size_t>(((jj % static_cast<long>(n)) + n) % n);
        double ds = std::abs(arc[j] - arc[i]);
        if (l.closed) {
          // distance along the loop in this direction
          ds = dir > 0 ? std::fmod(arc[j] - arc[i] + total, total)
                       : std::fmod(arc[i] - arc[j] + total, total);
        }
        if (ds > h) break;
        double w = std::exp(-ds * ds / (2 * sigma * sigma)) * weight_len(j);
        wsum += w;
        sx += p[j].x * w;
        sy += p[j].y * w;
      }
    }
    if (wsum > 0) out[i] = {sx / wsum, sy / wsum};
  }
  return out;
}

double point_segment_distance(Point p, Point a, Point b) {
  Point ab = b - a;
  double len2 = dot(ab, ab);
  double t = len2 > 0 ? std::clamp(dot(p - a, ab) / len2, 0.0, 1.0) : 0.0;
  return distance(p, a + ab * t);
}

// Douglas and Peucker (1973), with a per-vertex allowance: vertex i may be dropped only when it
// lies within allowed[i] of the chord that replaces it. Marks kept vertices in `keep` over the
// index range [a, b] of `p` (indices taken modulo p.size() for closed lines).
void simplify_range(const Polyline& p, const std::vector<double>& allowed, std::size_t a,
                    std::size_t b, std::vector<char>& keep) {
  std::size_t n = p.size();
  std::vector<std::pair<std::size_t, std::size_t>> stack{{a, b}};
  while (!stack.empty()) {
    auto [lo, hi] = stack.back();
    stack.pop_back();
    if (hi <= lo + 1) continue;
    Point pa = p[lo % n], pb = p[hi % n];
    double worst = 1.0;
    std::size_t split = 0;
    for (std::size_t i = lo + 1; i < hi; ++i) {
      double d = point_segment_distance(p[i % n], pa, pb);
      double ratio = allowed[i % n] > 0 ? d / allowed[i % n] : (d > 0 ? 1e300 : 0.0);
      if (ratio > worst) worst = ratio, split = i;
    }
    if (split == 0) continue;
    keep[split % n] = 1;
    stack.push_back({lo, split});
    stack.push_back({split, hi});
  }
}

// The line smoothed (Gaussian, sigma scaled by f), each vertex's move capped, then thinned by
// Douglas-Peucker within what the cap leaves.
Polyline smoothed_and_thinned(const ContourLine& l, const std::vector<double>& arc,
                              const std::vector<double>& cap_in, const Tolerances& t, double f) {
  const std::size_t n = l.ground.size();
  std::vector<double> cap(cap_in);
  for (double& c : cap) c *= f;
  Polyline moved = smooth(l, arc, t.sigma_m * f);
  std::vector<double> allowed(n);
  for (std::size_t i = 0; i < n; ++i) {
    Point d = moved[i] - l.ground[i];
    double len = length(d);
    if (len > cap[i]) moved[i] = l.ground[i] + d * (cap[i] / len);
    allowed[i] = std::min(t.simplify_m * f, std::max(0.0, cap[i] - std::min(len, cap[i])));
  }
  std::vector<char> keep(n, 0);
  if (!l.closed) {
    keep[0] = keep[n - 1] = 1;
    simplify_range(moved, allowed, 0, n - 1, keep);
  } else {
    // Split the loop at vertex 0 and the vertex farthest from it.
    std::size_t far = 0;
    double far_d = -1;
    for (std::size_t i = 1; i < n; ++i) {
      double d = distance(moved[i], moved[0]);
      if (d > far_d) far_d = d, far = i;
    }
    keep[0] = keep[far] = 1;
    simplify_range(moved, allowed, 0, far, keep);
    simplify_range(moved, allowed, far, n, keep);
  }
  Polyline out;
  out.reserve(n);
  for (std::size_t i = 0; i < n; ++i)
    if (keep[i]) out.push_back(moved[i]);
  if (l.closed && out.size() < 3) out = moved;
  return out;
}

void prepare_line(std::vector<ContourLine>& lines, std::size_t li, const SegmentGrid& grid,
                  const Tolerances& t, std::vector<Polyline>& result) {
  const ContourLine& l = lines[li];
  std::size_t n = l.ground.size();
  auto arc = arclengths(l);
  auto clear = segment_clearance(lines, li, arc, grid, t);
  std::size_t ns = clear.size();
  std::vector<double> cap(n, t.cap_m);
  for (std::size_t i = 0; i < n; ++i) {
    double c = t.reach_m;
    if (i < ns) c = std::min(c, clear[i]);
    if (i > 0) c = std::min(c, clear[i - 1]);
    if (l.closed && i == 0 && ns > 0) c = std::min(c, clear[ns - 1]);
    cap[i] = std::min(t.cap_m, kClearanceShare * c);
  }
  // A tight bend of one line (a narrow spur or re-entrant) can fold over itself when smoothed:
  // its own nearby segments are neighbours, not obstacles, in the clearance. Such a line is
  // smoothed again with half the tolerance, twice at most, before its raw geometry is kept.
  for (double f : {1.0, 0.5, 0.25}) {
    Polyline out = smoothed_and_thinned(l, arc, cap, t, f);
    ContourLine candidate;
    candidate.closed = l.closed;
    candidate.ground = out;
    if (find_crossings({candidate}).empty()) {
      result[li] = std::move(out);
      return;
    }
  }
  result[li] = l.ground;
}

}  // namespace

double line_length(const ContourLine& line) {
  const Polyline& p = line.ground;
  double s = 0;
  for (std::size_t i = 1; i < p.size(); ++i) s += distance(p[i - 1], p[i]);
  if (line.closed && p.size() > 2) s += distance(p.back(), p.front());
  return s;
}

std::vector<Crossing> find_crossings(const std::vector<ContourLine>& lines) {
  double mean = 0;
  std::size_t count = 0;
  for (const auto& l : lines) {
    mean += line_length(l);
    count += segment_count(l);
  }
  if (count == 0) return {};
  SegmentGrid grid(lines, 2 * mean / static_cast<double>(count));
  std::vector<std::vector<Crossing>> found(lines.size());
  parallel_for(lines.size(), [&](std::size_t li) {
    const ContourLine& l = lines[li];
    std::size_t ns = segment_count(l);
    std::vector<std::size_t> partners;
    for (std::size_t s = 0; s < ns; ++s) {
      Point a = detail::seg_a(l, s), b = detail::seg_b(l, s);
      grid.query(Box::of(a.x, a.y, b.x, b.y), [&](SegRef r) {
        if (r.line < li) return;  // each pair once, from its lower line
        if (r.line == li) {
          // Adjacent segments share a vertex by construction.
          std::size_t d = r.seg > s ? r.seg - s : s - r.seg;
          if (d <= 1 || (l.closed && d == ns - 1)) return;
        }
        const ContourLine& o = lines[r.line];
        if (detail::segments_intersect(a, b, detail::seg_a(o, r.seg), detail::seg_b(o, r.seg)))
          partners.push_back(r.line);
      });
    }
    std::sort(partners.begin(), partners.end());
    partners.erase(std::unique(partners.begin(), partners.end()), partners.end());
    for (std::size_t p : partners) found[li].push_back({li, p});
  });
  std::vector<Crossing> all;
  for (auto& f : found) all.insert(all.end(), f.begin(), f.end());
  return all;
}

PrepareStats prepare_for_print(std::vector<ContourLine>& lines, const ContourParams& params,
                               double cell_m) {
  PrepareStats stats;
  stats.lines_in = static_cast<long>(lines.size());
  double m_per_mm = params.scale_denominator / 1000.0;
  double min_loop_m = params.min_loop_mm * m_per_mm;
  std::erase_if(lines, [&](const ContourLine& l) {
    bool drop = l.ground.size() < 2 || (l.closed && line_length(l) < min_loop_m);
    stats.loops_dropped += drop;
    return drop;
  });
  for (const auto& l : lines) {
    stats.vertices_in += static_cast<long>(l.ground.size());
    stats.length_in_m += line_length(l);
  }
  Tolerances t;
  double tol_m = params.smoothing_mm * m_per_mm;
  (void)cell_m;
  t.sigma_m = tol_m / 2;
  t.cap_m = tol_m;
  t.simplify_m = tol_m / 5;
  t.reach_m = t.cap_m / kClearanceShare;
  t.self_gap_m = 6 * t.sigma_m + 2 * t.reach_m;
  if (tol_m > 0 && !lines.empty()) {
    SegmentGrid grid(lines, t.reach_m * 2);
    std::vector<Polyline> result(lines.size());
    parallel_for(lines.size(), [&](std::size_t i) { prepare_line(lines, i, grid, t, result); });
    // Keep the raw geometry until the crossing check has passed.
    for (std::size_t i = 0; i < lines.size(); ++i) std::swap(lines[i].ground, result[i]);
    for (int round = 0; round < 8; ++round) {
      auto crossings = find_crossings(lines);
      if (crossings.empty()) break;
      long self = std::count_if(crossings.begin(), crossings.end(),
                                [](const Crossing& c) { return c.a == c.b; });
      log::debug("contours: round {}: {} crossings after smoothing ({} of a line with itself)",
                 round, crossings.size(), self);
      for (const auto& c : crossings) {
        for (std::size_t i : {c.a, c.b}) {
          if (!result[i].empty()) {
            std::swap(lines[i].ground, result[i]);
            result[i].clear();
            ++stats.lines_restored;
          }
        }
      }
    }
  }
  for (const auto& l : lines) {
    stats.vertices_out += static_cast<long>(l.ground.size());
    stats.length_out_m += line_length(l);
  }
  return stats;
}

}  // namespace sheetmill::contours
