#include "sheetmill/contours/water_clip.hpp"

#include <algorithm>

#include "contours/segment_grid.hpp"

namespace sheetmill::contours {

namespace {

using detail::SegRef;

// The rings of every polygon as closed lines, with the polygon each belongs to.
struct RingSet {
  std::vector<ContourLine> rings;
  std::vector<std::size_t> polygon;
  std::vector<Box> polygon_box;
};

RingSet ring_set(const std::vector<std::vector<Polyline>>& polygons) {
  RingSet r;
  for (std::size_t p = 0; p < polygons.size(); ++p) {
    Box b;
    for (const auto& ring : polygons[p]) {
      if (ring.size() < 3) continue;
      ContourLine l;
      l.closed = true;
      l.ground = ring;
      r.rings.push_back(std::move(l));
      r.polygon.push_back(p);
      for (const auto& pt : ring) b.add(pt);
    }
    r.polygon_box.push_back(b);
  }
  return r;
}

// Even-odd test against every polygon: a ray towards +x, counted per polygon.
bool inside_water(Point p, const RingSet& rs, const detail::SegmentGrid& grid, double max_x) {
  std::vector<SegRef> hits;
  grid.query(Box::of(p.x, p.y, max_x, p.y), [&](SegRef r) { hits.push_back(r); });
  std::sort(hits.begin(), hits.end(),
            [](SegRef a, SegRef b) { return a.line != b.line ? a.line < b.line : a.seg < b.seg; });
  hits.erase(std::unique(hits.begin(), hits.end(),
                         [](SegRef a, SegRef b) { return a.line == b.line && a.seg == b.seg; }),
             hits.end());
  std::vector<int> count(rs.polygon_box.size(), 0);
  for (SegRef h : hits) {
    const ContourLine& ring = rs.rings[h.line];
    Point a = detail::seg_a(ring, h.seg), b = detail::seg_b(ring, h.seg);
    if ((a.y > p.y) == (b.y > p.y)) continue;  // half-open rule
    double x = a.x + (p.y - a.y) / (b.y - a.y) * (b.x - a.x);
    if (x > p.x) ++count[rs.polygon[h.line]];
  }
  return std::any_of(count.begin(), count.end(), [](int c) { return c % 2 == 1; });
}

// Parameters along ab where it crosses a ring edge, sorted, with 0 and 1 added.
std::vector<double> split_params(Point a, Point b, const RingSet& rs,
                                 const detail::SegmentGrid& grid) {
  std::vector<double> ts{0.0, 1.0};
  Point d = b - a;
  grid.query(Box::of(a.x, a.y, b.x, b.y), [&](SegRef r) {
    const ContourLine& ring = rs.rings[r.line];
    Point c = detail::seg_a(ring, r.seg), e = detail::seg_b(ring, r.seg) - c;
    double den = cross(d, e);
    if (den == 0) return;
    double t = cross(c - a, e) / den, u = cross(c - a, d) / den;
    if (t > 0 && t < 1 && u >= 0 && u <= 1) ts.push_back(t);
  });
  std::sort(ts.begin(), ts.end());
  ts.erase(std::unique(ts.begin(), ts.end()), ts.end());
  return ts;
}

}  // namespace

void clip_out_polygons(std::vector<ContourLine>& lines,
                       const std::vector<std::vector<Polyline>>& polygons) {
  RingSet rs = ring_set(polygons);
  if (rs.rings.empty()) return;
  Box water;
  for (const auto& b : rs.polygon_box) {
    if (b.empty()) continue;
    water.add({b.min_x, b.min_y});
    water.add({b.max_x, b.max_y});
  }
  detail::SegmentGrid grid(rs.rings, 0);
  std::vector<ContourLine> out;
  out.reserve(lines.size());
  for (auto& l : lines) {
    Box lb;
    for (const auto& p : l.ground) lb.add(p);
    if (!lb.intersects(water)) {
      out.push_back(std::move(l));
      continue;
    }
    Polyline path = l.ground;
    if (l.closed) path.push_back(l.ground.front());
    std::vector<Polyline> pieces;
    Polyline piece;
    bool any_cut = false;
    bool wet = inside_water(path.front(), rs, grid, water.max_x);
    bool start_wet = wet;
    if (!wet) piece.push_back(path.front());
    for (std::size_t i = 0; i + 1 < path.size(); ++i) {
      Point a = path[i], b = path[i + 1];
      auto ts = split_params(a, b, rs, grid);
      for (std::size_t k = 0; k + 1 < ts.size(); ++k) {
        if (ts.size() > 2)
          wet = inside_water(a + (b - a) * ((ts[k] + ts[k + 1]) / 2), rs, grid, water.max_x);
        Point q0 = a + (b - a) * ts[k], q1 = a + (b - a) * ts[k + 1];
        if (wet) {
          any_cut = true;
          if (piece.size() >= 2) pieces.push_back(piece);
          piece.clear();
        } else {
          if (piece.empty()) piece.push_back(q0);
          piece.push_back(q1);
        }
      }
    }
    if (piece.size() >= 2) pieces.push_back(piece);
    if (!any_cut && !start_wet) {
      out.push_back(std::move(l));
      continue;
    }
    // A cut ring whose seam is dry: the last piece runs on into the first.
    if (l.closed && !start_wet && pieces.size() >= 2) {
      Polyline joined = pieces.back();
      joined.insert(joined.end(), pieces.front().begin() + 1, pieces.front().end());
      pieces.front() = std::move(joined);
      pieces.pop_back();
    }
    for (auto& p : pieces) {
      ContourLine c = l;
      c.closed = false;
      c.ground = std::move(p);
      out.push_back(std::move(c));
    }
  }
  lines = std::move(out);
}

}  // namespace sheetmill::contours
