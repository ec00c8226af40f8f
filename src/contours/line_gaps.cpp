#include "sheetmill/contours/line_gaps.hpp"

#include <algorithm>
#include <utility>

namespace sheetmill::contours {

namespace {

// Parameter interval [t0, t1] of segment ab inside the convex quad q (Cyrus and Beck 1978);
// false when the segment misses it.
bool segment_in_quad(Point a, Point b, const text::Quad& q, double& t0, double& t1) {
  double area = 0;
  for (int i = 0; i < 4; ++i) area += cross(q[i], q[(i + 1) % 4]);
  double wind = area >= 0 ? 1 : -1;  // inside is to the left of each edge for +1
  t0 = 0;
  t1 = 1;
  Point d = b - a;
  for (int i = 0; i < 4; ++i) {
    Point e0 = q[i], e = q[(i + 1) % 4] - q[i];
    // inside when wind * cross(e, p - e0) >= 0, p = a + t d
    double num = wind * cross(e, a - e0);
    double den = wind * cross(e, d);
    if (den == 0) {
      if (num < 0) return false;
      continue;
    }
    double t = -num / den;
    if (den > 0) {
      t0 = std::max(t0, t);
    } else {
      t1 = std::min(t1, t);
    }
    if (t0 > t1) return false;
  }
  return true;
}

double polyline_length(const Polyline& p) {
  double s = 0;
  for (std::size_t i = 1; i < p.size(); ++i) s += distance(p[i - 1], p[i]);
  return s;
}

}  // namespace

std::vector<Polyline> cut_out_quads(const Polyline& line, bool closed,
                                    const std::vector<text::Quad>& quads, double min_piece) {
  Polyline path = line;
  if (closed && line.size() > 2) path.push_back(line.front());
  std::vector<Polyline> out;
  if (path.size() < 2) return out;
  Box bounds;
  for (const auto& p : path) bounds.add(p);
  std::vector<const text::Quad*> near;
  for (const auto& q : quads) {
    Box qb;
    for (const auto& p : q) qb.add(p);
    if (qb.intersects(bounds)) near.push_back(&q);
  }
  if (near.empty()) return {path};

  Polyline piece{path.front()};
  bool inside_at_start = false;
  std::vector<std::pair<double, double>> cuts;
  for (std::size_t i = 0; i + 1 < path.size(); ++i) {
    Point a = path[i], b = path[i + 1];
    cuts.clear();
    for (const auto* q : near) {
      double t0, t1;
      if (segment_in_quad(a, b, *q, t0, t1)) cuts.push_back({t0, t1});
    }
    std::sort(cuts.begin(), cuts.end());
    double t = 0;  // how far along this segment has been emitted or skipped
    for (auto [c0, c1] : cuts) {
      if (c1 <= t) continue;
      if (c0 > t) {
        if (piece.empty()) piece.push_back(a + (b - a) * t);
        piece.push_back(a + (b - a) * c0);
      }
      if (i == 0 && c0 <= 0) inside_at_start = true;
      if (piece.size() >= 2) out.push_back(piece);
      piece.clear();
      t = std::max(t, c1);
    }
    if (t < 1) {
      if (piece.empty()) piece.push_back(a + (b - a) * t);
      piece.push_back(b);
    }
  }
  if (piece.size() >= 2) out.push_back(piece);
  // Rejoin the seam of a ring: the last piece runs on into the first.
  if (closed && out.size() >= 2 && !inside_at_start &&
      distance(out.back().back(), path.front()) == 0 &&
      distance(out.front().front(), path.front()) == 0) {
    Polyline joined = out.back();
    joined.insert(joined.end(), out.front().begin() + 1, out.front().end());
    out.front() = std::move(joined);
    out.pop_back();
  }
  if (min_piece > 0)
    std::erase_if(out, [&](const Polyline& p) { return polyline_length(p) < min_piece; });
  return out;
}

}  // namespace sheetmill::contours
