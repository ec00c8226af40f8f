#include "sheetmill/demo/buildings.hpp"

#include <cmath>

#include "sheetmill/core/units.hpp"
#include "sheetmill/demo/random.hpp"
#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

namespace {

struct Placer {
  const Scenario& s;
  const FloatGrid& dem;
  const Hydrography& water;
  const Settlements& settled;
  std::vector<Polyline> water_lines;
  std::vector<Polyline> way_lines;  // roads and railway
  std::vector<Building> out;
  std::vector<std::pair<Point, double>> taken;  // centre, radius

  bool clear_of(const std::vector<Polyline>& lines, Point c, double d) const {
    for (const Polyline& l : lines) {
      Box b;
      for (const Point& p : l) b.add(p);
      if (b.expanded(d).contains(c) && distance_to_polyline(l, c) < d) return false;
    }
    return true;
  }

  bool try_add(Point c, double length_m, double width_m, double angle, const char* kind) {
    double radius = std::hypot(length_m, width_m) / 2;
    if (!s.dem.bounds().expanded(-20).contains(c)) return false;
    if (s.lake_shape(c) < 0.1 || slope_at(dem, c) > 0.2) return false;
    for (const auto& [q, r] : taken) {
      if (distance(q, c) < r + radius + 3) return false;
    }
    if (!clear_of(water_lines, c, radius + 12)) return false;
    if (!clear_of(way_lines, c, radius + 5)) return false;
    out.push_back({rotated_rectangle(c, length_m, width_m, angle), kind});
    taken.push_back({c, radius});
    return true;
  }
};

}  // namespace

std::vector<Building> place_buildings(const Scenario& s, const FloatGrid& dem,
                                      const Hydrography& water, const Settlements& settled) {
  Placer P{s, dem, water, settled, {}, {}, {}, {}};
  for (const WaterLine& w : water.lines) P.water_lines.push_back(w.line);
  for (const Road& r : settled.roads) P.way_lines.push_back(r.line);
  for (const Railway& r : settled.railways) P.way_lines.push_back(r.line);
  Random rng = Random(s.seed).fork(5);
  for (const Place& place : settled.places) {
    if (place.kind == "farm") {
      // Farmhouse and one or two barns around a yard, sharing an orientation.
      double a = rng.uniform(0, kPi);
      Point u{std::cos(a), std::sin(a)};
      Point v{-u.y, u.x};
      P.try_add(place.at, 14, 9, a, "farm");
      P.try_add(place.at + v * 22, 24, 12, a, "barn");
      if (rng.uniform() < 0.6) P.try_add(place.at + u * 26 + v * 6, 18, 10, a + kPi / 2, "barn");
      continue;
    }
    if (place.kind != "village" && place.kind != "hamlet") continue;
    bool village = place.kind == "village";
    double radius = village ? 420 + place.population / 6.0 : 160;
    if (village) {
      // The church stands back from the road near the centre.
      for (int tries = 0; tries < 40; ++tries) {
        Point c = place.at + Point{rng.uniform(-60, 60), rng.uniform(-60, 60)};
        if (P.try_add(c, 26, 11, rng.uniform(-0.3, 0.3), "church")) break;
      }
    }
    // Houses along every road inside the settlement, on both sides, parallel to the road.
    for (const Road& road : settled.roads) {
      Polyline line = densify(road.line, 5);
      double since = 0;
      for (std::size_t i = 1; i < line.size(); ++i) {
        since += distance(line[i - 1], line[i]);
        double d = distance(line[i], place.at);
        if (d > radius || since < rng.uniform(14, 24)) continue;
        // Denser at the centre.
        if (rng.uniform() > 1.05 - d / radius) continue;
        since = 0;
        Point dir = line[i] - line[i - 1];
        double a = std::atan2(dir.y, dir.x);
        Point n{-std::sin(a), std::cos(a)};
        for (double side : {1.0, -1.0}) {
          double len = rng.uniform(9, 15), wid = rng.uniform(7, 10);
          double off = rng.uniform(11, 17) + wid / 2;
          P.try_add(line[i] + n * (side * off), len, wid, a + rng.uniform(-0.08, 0.08),
                    rng.uniform() < 0.06 ? "barn" : "house");
        }
      }
    }
  }
  // Works beside the railway near the two larger villages.
  for (const Railway& rail : settled.railways) {
    for (std::size_t v = 0; v < 2 && v < settled.places.size(); ++v) {
      Point at = settled.places[v].at;
      Polyline line = densify(rail.line, 10);
      std::size_t best = 1;
      for (std::size_t i = 1; i < line.size(); ++i) {
        if (distance(line[i], at) < distance(line[best], at)) best = i;
      }
      Point dir = line[best] - line[best - 1];
      double a = std::atan2(dir.y, dir.x);
      Point n{-std::sin(a), std::cos(a)};
      for (double off : {38.0, -38.0, 55.0, -55.0}) {
        if (P.try_add(line[best] + n * off, 46, 24, a, "works")) break;
      }
    }
  }
  return std::move(P.out);
}

}  // namespace sheetmill::demo
