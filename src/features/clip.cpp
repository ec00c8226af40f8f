#include "sheetmill/features/clip.hpp"

namespace sheetmill::features {

namespace {

// Liang-Barsky: clips segment a->b to the box; returns false when it lies outside.
bool clip_segment(Point a, Point b, const Box& box, double& t0, double& t1) {
  t0 = 0;
  t1 = 1;
  const double dx = b.x - a.x, dy = b.y - a.y;
  const double p[4] = {-dx, dx, -dy, dy};
  const double q[4] = {a.x - box.min_x, box.max_x - a.x, a.y - box.min_y, box.max_y - a.y};
  for (int i = 0; i < 4; ++i) {
    if (p[i] == 0) {
      if (q[i] < 0) return false;
      continue;
    }
    double r = q[i] / p[i];
    if (p[i] < 0) {
      if (r > t1) return false;
      if (r > t0) t0 = r;
    } else {
      if (r < t0) return false;
      if (r < t1) t1 = r;
    }
  }
  return true;
}

Point lerp(Point a, Point b, double t) {
  return {a.x + (b.x - a.x) * t, a.y + (b.y - a.y) * t};
}

}  // namespace

void clip_polyline(const Polyline& line, const Box& box, std::vector<Polyline>& out) {
  if (line.size() < 2) return;
  Polyline current;
  auto flush = [&] {
    if (current.size() >= 2) out.push_back(std::move(current));
    current.clear();
  };
  for (std::size_t i = 0; i + 1 < line.size(); ++i) {
    Point a = line[i], b = line[i + 1];
    double t0, t1;
    if (!clip_segment(a, b, box, t0, t1)) {
      flush();
      continue;
    }
    Point ca = t0 > 0 ? lerp(a, b, t0) : a;
    Point cb = t1 < 1 ? lerp(a, b, t1) : b;
    if (current.empty()) current.push_back(ca);
    current.push_back(cb);
    if (t1 < 1) flush();  // the segment leaves the box
  }
  flush();
}

Polyline clip_ring(const Polyline& ring, const Box& box) {
  if (ring.size() < 3) return {};
  // Fast paths: entirely inside, or bounding boxes apart.
  Box bb;
  for (const Point& p : ring) bb.add(p);
  if (!bb.intersects(box)) return {};
  if (bb.min_x >= box.min_x && bb.max_x <= box.max_x && bb.min_y >= box.min_y &&
      bb.max_y <= box.max_y)
    return ring;

  // Sutherland-Hodgman, one box edge at a time.
  Polyline in = ring, out;
  auto pass = [&](auto inside, auto intersect) {
    out.clear();
    if (in.empty()) return;
    Point s = in.back();
    for (const Point& e : in) {
      if (inside(e)) {
        if (!inside(s)) out.push_back(intersect(s, e));
        out.push_back(e);
      } else if (inside(s)) {
        out.push_back(intersect(s, e));
      }
      s = e;
    }
    in.swap(out);
  };
  auto at_x = [](double x) {
    return [x](Point a, Point b) { return lerp(a, b, (x - a.x) / (b.x - a.x)); };
  };
  auto at_y = [](double y) {
    return [y](Point a, Point b) { return lerp(a, b, (y - a.y) / (b.y - a.y)); };
  };
  pass([&](Point p) { return p.x >= box.min_x; }, at_x(box.min_x));
  pass([&](Point p) { return p.x <= box.max_x; }, at_x(box.max_x));
  pass([&](Point p) { return p.y >= box.min_y; }, at_y(box.min_y));
  pass([&](Point p) { return p.y <= box.max_y; }, at_y(box.max_y));
  if (in.size() < 3) return {};
  return in;
}

bool clip_polygon(Polygon& polygon, const Box& box) {
  polygon.outer = clip_ring(polygon.outer, box);
  if (polygon.outer.empty()) {
    polygon.holes.clear();
    return false;
  }
  std::vector<Polyline> holes;
  for (const Polyline& h : polygon.holes) {
    Polyline c = clip_ring(h, box);
    if (!c.empty()) holes.push_back(std::move(c));
  }
  polygon.holes = std::move(holes);
  return true;
}

}  // namespace sheetmill::features
