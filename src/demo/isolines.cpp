#include "sheetmill/demo/isolines.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

namespace {

// The field on the grid padded by one cell on every side (padded indices I = col + 1).
struct Padded {
  const FloatGrid& f;
  int pw, ph;

  double value(int I, int J) const {
    int col = I - 1, row = J - 1;
    if (f.spec.inside(col, row)) return f.at(col, row);
    // Mirror the nearest inside value to its negative: the crossing falls on the grid edge.
    double v = f.at(std::clamp(col, 0, f.spec.width - 1), std::clamp(row, 0, f.spec.height - 1));
    return -std::max(v, 0.0);
  }
  Point at(int I, int J) const { return f.spec.centre(I - 1, J - 1); }
  int h_edge(int I, int J) const { return J * pw + I; }
  int v_edge(int I, int J) const { return pw * ph + J * pw + I; }
};

struct Crossing {
  int edge;
  Point p;
  bool enter;
};

struct Segment {
  int to_edge;
  Point from;
};

// The crossing on the edge between padded corners (I0, J0) and (I1, J1), computed from the
// corner with the lower index so both cells sharing the edge get the same point.
Point crossing_point(const Padded& g, int I0, int J0, int I1, int J1) {
  if (J1 < J0 || (J1 == J0 && I1 < I0)) {
    std::swap(I0, I1);
    std::swap(J0, J1);
  }
  double v0 = g.value(I0, J0), v1 = g.value(I1, J1);
  double t = v0 / (v0 - v1);
  Point a = g.at(I0, J0), b = g.at(I1, J1);
  return a + (b - a) * t;
}

}  // namespace

std::vector<Polyline> region_rings(const FloatGrid& field) {
  Padded g{field, field.spec.width + 2, field.spec.height + 2};
  std::vector<int> from_edge(static_cast<std::size_t>(2) * g.pw * g.ph, -1);
  std::vector<Segment> segs;
  for (int J = 0; J + 1 < g.ph; ++J) {
    for (int I = 0; I + 1 < g.pw; ++I) {
      // Corners clockwise in the ground frame: top-left, top-right, bottom-right, bottom-left.
      const int ci[4] = {I, I + 1, I + 1, I};
      const int cj[4] = {J, J, J + 1, J + 1};
      const int edge[4] = {g.h_edge(I, J), g.v_edge(I + 1, J), g.h_edge(I, J + 1), g.v_edge(I, J)};
      double v[4];
      bool in[4];
      int n_in = 0;
      for (int k = 0; k < 4; ++k) {
        v[k] = g.value(ci[k], cj[k]);
        in[k] = v[k] > 0;
        n_in += in[k];
      }
      if (n_in == 0 || n_in == 4) continue;
      Crossing cr[4];
      int n = 0;
      for (int k = 0; k < 4; ++k) {
        int k1 = (k + 1) % 4;
        if (in[k] == in[k1]) continue;
        cr[n++] = {edge[k], crossing_point(g, ci[k], cj[k], ci[k1], cj[k1]), in[k1]};
      }
      // Each entering crossing joins the next leaving one clockwise, except in a saddle whose
      // centre is inside, where it joins the previous one (the two inside corners connect).
      bool centre_in = (v[0] + v[1] + v[2] + v[3]) / 4 > 0;
      for (int k = 0; k < n; ++k) {
        if (!cr[k].enter) continue;
        int to = n == 4 && centre_in ? (k + n - 1) % n : (k + 1) % n;
        from_edge[cr[k].edge] = static_cast<int>(segs.size());
        segs.push_back({cr[to].edge, cr[k].p});
      }
    }
  }
  std::vector<Polyline> rings;
  std::vector<char> used(segs.size(), 0);
  for (std::size_t s = 0; s < segs.size(); ++s) {
    if (used[s]) continue;
    Polyline ring;
    for (int cur = static_cast<int>(s); cur >= 0 && !used[cur];
         cur = from_edge[segs[cur].to_edge]) {
      used[cur] = 1;
      if (ring.empty() || distance(ring.back(), segs[cur].from) > 1e-9) {
        ring.push_back(segs[cur].from);
      }
    }
    if (ring.size() >= 3) rings.push_back(std::move(ring));
  }
  return rings;
}

Polyline chaikin_closed(const Polyline& ring, int passes) {
  Polyline cur = ring;
  for (int p = 0; p < passes && cur.size() >= 3; ++p) {
    Polyline next;
    next.reserve(cur.size() * 2);
    for (std::size_t i = 0; i < cur.size(); ++i) {
      Point a = cur[i], b = cur[(i + 1) % cur.size()];
      next.push_back(a * 0.75 + b * 0.25);
      next.push_back(a * 0.25 + b * 0.75);
    }
    cur.swap(next);
  }
  return cur;
}

double signed_area(const Polyline& ring) {
  double a = 0;
  for (std::size_t i = 0; i < ring.size(); ++i) {
    const Point& p = ring[i];
    const Point& q = ring[(i + 1) % ring.size()];
    a += p.x * q.y - q.x * p.y;
  }
  return a / 2;
}

std::vector<std::vector<Polyline>> assemble_polygons(std::vector<Polyline> rings,
                                                     double min_area_m2, double min_hole_m2) {
  struct Outer {
    Polyline ring;
    Box box;
    double area;
    std::vector<Polyline> holes;
  };
  std::vector<Outer> outers;
  std::vector<Polyline> holes;
  for (Polyline& r : rings) {
    double a = signed_area(r);
    if (a >= min_area_m2) {
      Box b;
      for (const Point& p : r) b.add(p);
      outers.push_back({std::move(r), b, a, {}});
    } else if (-a >= min_hole_m2) {
      holes.push_back(std::move(r));
    }
  }
  for (Polyline& h : holes) {
    Outer* best = nullptr;
    for (Outer& o : outers) {
      if (!o.box.contains(h.front()) || (best && best->area <= o.area)) continue;
      if (point_in_ring(o.ring, h.front())) best = &o;
    }
    if (best) best->holes.push_back(std::move(h));
  }
  std::vector<std::vector<Polyline>> out;
  for (Outer& o : outers) {
    std::vector<Polyline> poly{std::move(o.ring)};
    for (Polyline& h : o.holes) poly.push_back(std::move(h));
    out.push_back(std::move(poly));
  }
  return out;
}

}  // namespace sheetmill::demo
