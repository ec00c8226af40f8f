#include "sheetmill/demo/hollows.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/units.hpp"
#include "sheetmill/demo/random.hpp"
#include "sheetmill/demo/settlements.hpp"
#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

namespace {

double clearance(const std::vector<Polyline>& lines, Point p, double enough) {
  double d = std::numeric_limits<double>::infinity();
  for (const Polyline& l : lines) {
    Box b;
    for (const Point& q : l) b.add(q);
    if (!b.expanded(enough).contains(p)) continue;
    d = std::min(d, distance_to_polyline(l, p));
  }
  return d;
}

}  // namespace

std::vector<Sinkhole> dig_sinkholes(const Scenario& s, FloatGrid& dem,
                                    const std::vector<Polyline>& water_lines, int count) {
  Random rng = Random(s.seed).fork(11);
  std::vector<Sinkhole> out;
  for (int tries = 0; tries < 600 && static_cast<int>(out.size()) < count; ++tries) {
    double x = rng.uniform(kAreaWest + 800, kAreaWest + kAreaWidthM - 800);
    double esc = s.escarpment_y(x);
    double y = rng.uniform(esc + 1000, kAreaSouth + kAreaHeightM - 700);
    Point c{x, y};
    if (y <= esc + 1000 || slope_at(dem, c) > 0.06) continue;
    if (clearance(water_lines, c, 300) < 250) continue;
    bool crowded = false;
    for (const Sinkhole& h : out) crowded = crowded || distance(h.centre, c) < 500;
    if (crowded) continue;
    out.push_back({c, rng.uniform(55, 80), rng.uniform(16, 24)});
  }
  const GridSpec& g = dem.spec;
  for (const Sinkhole& h : out) {
    int c0 = g.col_clamped(h.centre.x - h.radius_m), c1 = g.col_clamped(h.centre.x + h.radius_m);
    int r0 = g.row_clamped(h.centre.y + h.radius_m), r1 = g.row_clamped(h.centre.y - h.radius_m);
    for (int r = r0; r <= r1; ++r) {
      for (int c = c0; c <= c1; ++c) {
        double q = distance(g.centre(c, r), h.centre) / h.radius_m;
        if (q >= 1) continue;
        // A smooth bowl: depth (1 - q^2)^2 has zero slope at the rim and at the bottom.
        dem.at(c, r) -= static_cast<float>(h.depth_m * (1 - q * q) * (1 - q * q));
      }
    }
  }
  return out;
}

std::vector<WaterArea> dig_ponds(const Scenario& s, FloatGrid& dem,
                                 const std::vector<Place>& places,
                                 const std::vector<Polyline>& keep_clear, int count) {
  Random rng = Random(s.seed).fork(13);
  std::vector<WaterArea> out;
  for (const Place& p : places) {
    if (static_cast<int>(out.size()) >= count) break;
    if (p.kind != "farm") continue;
    double a = rng.uniform(0, 2 * kPi);
    Point c = p.at + Point{std::cos(a), std::sin(a)} * 70;
    double r = rng.uniform(18, 30);
    if (slope_at(dem, c) > 0.05 || clearance(keep_clear, c, 200) < r + 40) continue;
    Polyline ring;
    for (int k = 0; k < 24; ++k) {
      double th = 2 * kPi * k / 24;
      double rr = r * (1 + 0.12 * std::sin(2 * th + a) + 0.06 * std::sin(3 * th));
      ring.push_back(c + Point{std::cos(th) * rr * 1.3, std::sin(th) * rr});
    }
    float level = std::numeric_limits<float>::infinity();
    for_cells_in_ring(dem.spec, ring,
                      [&](int col, int row) { level = std::min(level, dem.at(col, row)); });
    if (!std::isfinite(level)) continue;
    level = static_cast<float>(std::round((level - 0.3) * 100) / 100);
    for_cells_in_ring(dem.spec, ring, [&](int col, int row) { dem.at(col, row) = level; });
    out.push_back({ring, "pond", "", level});
  }
  return out;
}

}  // namespace sheetmill::demo
