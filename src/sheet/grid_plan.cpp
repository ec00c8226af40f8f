#include <algorithm>
#include <cmath>
#include <limits>

#include "sheetmill/sheet/grid.hpp"

namespace sheetmill::sheet {

namespace {

std::vector<Point> page_ring(const Layout& L) {
  std::vector<Point> ring;
  for (Point g : L.frame.neatline) ring.push_back(L.frame.to_page(g));
  return ring;
}

// The lowest and highest crossing of the line {axis coordinate = v} with the ring (page mm).
// vertical: the line x = v, returns y range; otherwise y = v, returns x range.
bool crossing_range(const std::vector<Point>& ring, double v, bool vertical, double& lo,
                    double& hi) {
  lo = std::numeric_limits<double>::infinity();
  hi = -lo;
  for (std::size_t i = 0; i < ring.size(); ++i) {
    Point a = ring[i], b = ring[(i + 1) % ring.size()];
    double a_on = vertical ? a.x : a.y, b_on = vertical ? b.x : b.y;
    double a_off = vertical ? a.y : a.x, b_off = vertical ? b.y : b.x;
    if ((a_on - v) * (b_on - v) > 0 || a_on == b_on) continue;
    double t = (v - a_on) / (b_on - a_on);
    double off = a_off + t * (b_off - a_off);
    lo = std::min(lo, off);
    hi = std::max(hi, off);
  }
  return lo < hi;
}

}  // namespace

GridPlan plan_projected_grid(const Layout& L, double interval_m) {
  GridPlan plan;
  plan.interval_m = interval_m;
  const MapFrame& f = L.frame;
  auto ring = page_ring(L);
  // A tolerance of a thousandth of a millimetre on paper decides what lies on the frame's edge.
  const double eps = 1e-6 * f.metres_per_mm();
  for (int axis = 0; axis < 2; ++axis) {
    bool easting = axis == 0;
    double lo = easting ? f.ground.min_x : f.ground.min_y;
    double hi = easting ? f.ground.max_x : f.ground.max_y;
    long first = static_cast<long>(std::ceil((lo - eps) / interval_m));
    long last = static_cast<long>(std::floor((hi + eps) / interval_m));
    std::vector<GridLabel> near_side, far_side;
    for (long k = first; k <= last; ++k) {
      double v = k * interval_m;
      Point p = f.to_page(easting ? Point{v, f.ground.min_y} : Point{f.ground.min_x, v});
      double page_v = easting ? p.x : p.y;
      // Lines on the frame's edge are the neatline itself and get no label: the corners belong
      // to the geographic corner values, the full grid values go to the first interior lines.
      if (std::abs(v - lo) < eps || std::abs(v - hi) < eps) continue;
      double a = 0, b = 0;
      if (!crossing_range(ring, page_v, easting, a, b)) continue;
      plan.lines.push_back(easting ? Polyline{{page_v, a}, {page_v, b}}
                                   : Polyline{{a, page_v}, {b, page_v}});
      if (easting) {
        near_side.push_back({v, Side::top, {page_v, a}, false});
        far_side.push_back({v, Side::bottom, {page_v, b}, false});
      } else {
        // Page y grows downwards: the larger page x is the right side.
        near_side.push_back({v, Side::left, {a, page_v}, false});
        far_side.push_back({v, Side::right, {b, page_v}, false});
      }
    }
    for (auto* side : {&near_side, &far_side}) {
      if (!side->empty()) {
        side->front().full = true;
        side->back().full = true;
      }
      plan.labels.insert(plan.labels.end(), side->begin(), side->end());
    }
  }
  return plan;
}

GridLabelText grid_label_text(double value_m, double interval_m, bool full, bool easting) {
  GridLabelText t;
  long long v = std::llround(value_m);
  bool negative = v < 0;
  if (negative) v = -v;
  long long km = v / 1000, rest = v % 1000;
  char buf[32];
  std::snprintf(buf, sizeof buf, "%02lld", km % 100);
  t.principal = buf;
  if (km >= 100) t.prefix = std::to_string(km / 100);
  if (negative) t.prefix = "-" + t.prefix;
  bool fine = interval_m < 1000 || rest != 0;
  if (full || fine) {
    std::snprintf(buf, sizeof buf, "%03lld", rest);
    t.suffix = buf;
  }
  if (full) t.suffix += easting ? "m E" : "m N";
  return t;
}

}  // namespace sheetmill::sheet
