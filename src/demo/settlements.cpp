#include "sheetmill/demo/settlements.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/log.hpp"
#include "sheetmill/demo/route.hpp"
#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

double slope_at(const FloatGrid& dem, Point p) {
  double d = std::max(5.0, dem.spec.cell_m);
  double dx = sample(dem, {p.x + d, p.y}) - sample(dem, {p.x - d, p.y});
  double dy = sample(dem, {p.x, p.y + d}) - sample(dem, {p.x, p.y - d});
  return std::hypot(dx, dy) / (2 * d);
}

namespace {

// Cost rises as (grade / comfortable)^8: at 1.5 times the comfortable grade a metre costs 26
// times as much, so routes wind rather than climb steeply.
constexpr RouteCost kMain{0.05, 8, 3};
constexpr RouteCost kSecondary{0.06, 8, 3};
constexpr RouteCost kMinor{0.065, 8, 3};
constexpr RouteCost kTrack{0.12, 4, 2};
constexpr RouteCost kPath{0.18, 3, 1.5};
constexpr RouteCost kRail{0.012, 4, 2.5};

struct Layout {
  const Scenario& s;
  const FloatGrid& dem;
  const Hydrography& water;
  Random rng;

  double water_distance(Point p) const {
    double d = std::numeric_limits<double>::infinity();
    for (const WaterLine& w : water.lines) {
      // Cheap reject on the bounding box before the exact distance.
      Box b;
      for (const Point& q : w.line) b.add(q);
      if (!b.expanded(std::min(d, 400.0)).contains(p)) continue;
      d = std::min(d, distance_to_polyline(w.line, p));
    }
    return d;
  }

  // The gentlest of `tries` random spots within radius_m of `around` that keeps clear of
  // water, the lake and the given places.
  Point site(Point around, double radius_m, double clear_m, const std::vector<Place>& others,
             double apart_m, int tries = 80) {
    Point best = around;
    double best_score = std::numeric_limits<double>::infinity();
    Box area = s.dem.bounds().expanded(-300);
    for (int i = 0; i < tries; ++i) {
      double a = rng.uniform(0, 6.283185307179586);
      double r = radius_m * std::sqrt(rng.uniform());
      Point p{around.x + r * std::cos(a), around.y + r * std::sin(a)};
      if (!area.contains(p) || s.lake_shape(p) < 0.35) continue;
      bool crowded = false;
      for (const Place& o : others) crowded = crowded || distance(o.at, p) < apart_m;
      if (crowded || water_distance(p) < clear_m) continue;
      double score = slope_at(dem, p) + 0.00002 * r;
      if (score < best_score) {
        best_score = score;
        best = p;
      }
    }
    return best;
  }
};

Point snap_to_line(const Polyline& line, Point p) {
  Point best = p;
  double bd = std::numeric_limits<double>::infinity();
  for (std::size_t i = 1; i < line.size(); ++i) {
    double t = 0;
    double d = distance_to_segment(p, line[i - 1], line[i], &t);
    if (d < bd) {
      bd = d;
      best = line[i - 1] + (line[i] - line[i - 1]) * t;
    }
  }
  return best;
}

}  // namespace

Settlements lay_out_settlements(const Scenario& s, const FloatGrid& dem, const Hydrography& water,
                                const std::vector<Summit>& summits, NameMaker& names) {
  Settlements out;
  Layout L{s, dem, water, Random(s.seed).fork(3)};
  std::vector<Place>& places = out.places;
  const double W = kAreaWidthM;
  auto X = [&](double f) { return kAreaWest + f * W; };
  auto terrace = [&](double x, double side) {
    return Point{x, s.valley_axis_y(x) + side * (s.floodplain_half_width_m(x) + 260)};
  };

  // Villages on the terraces above the floodplain.
  const double village_at[3][2] = {{0.16, 1}, {0.45, -1}, {0.84, 1}};
  const int population[3] = {1480, 860, 610};
  for (int i = 0; i < 3; ++i) {
    Point p = L.site(terrace(X(village_at[i][0]), village_at[i][1]), 380, 70, places, 2500);
    places.push_back({p, names.settlement(), "village", population[i]});
  }
  // Hamlets: two on the plateau, one in the foothills, two in the southern hills.
  auto esc = [&](double f, double above) { return Point{X(f), s.escarpment_y(X(f)) + above}; };
  const Point hamlet_near[5] = {
      esc(0.34, 1500),
      esc(0.68, 2300),
      {X(0.58), 0.5 * (s.escarpment_y(X(0.58)) + s.valley_axis_y(X(0.58)))},
      {X(0.28), kAreaSouth + 2100},
      {X(0.72), kAreaSouth + 1900}};
  for (const Point& near : hamlet_near) {
    Point p = L.site(near, 700, 60, places, 1500);
    places.push_back({p, names.settlement(), "hamlet", 40 + L.rng.below(90)});
  }
  // Farms anywhere gentle, apart from each other and from the settlements.
  for (int tries = 0; tries < 400 && places.size() < 8 + 13; ++tries) {
    Point near{L.rng.uniform(X(0.04), X(0.96)),
               L.rng.uniform(kAreaSouth + 600, kAreaSouth + 14400)};
    if (slope_at(dem, near) > 0.12) continue;
    Point p = L.site(near, 250, 60, places, 900, 25);
    if (slope_at(dem, p) > 0.07) continue;
    bool crowded = false;
    for (const Place& o : places) crowded = crowded || distance(o.at, p) < 900;
    if (crowded) continue;
    places.push_back({p, names.farm(), "farm", 3 + L.rng.below(9)});
  }

  // The routing grid: water is crossed on bridges, the lake is impassable.
  double cell = std::max(25.0, dem.spec.cell_m * 1.25);
  RouteGrid grid(dem, cell);
  // Only the channel itself is bridged; its valley sides are ground a route has to climb.
  for (const StreamLine& st : water.streams) {
    grid.mark_line(st.line, std::min(16.0, 9 + std::sqrt(st.area_km2)), NodeKind::bridge);
  }
  for (const Polyline& part : water.river_parts) grid.mark_line(part, 25, NodeKind::bridge);
  for (int n = 0; n < grid.spec().width * grid.spec().height; ++n) {
    if (s.lake_shape(grid.position(n)) < 0.04) grid.set_kind(n, NodeKind::blocked);
  }
  RouteGrid rail_grid = grid;

  std::vector<char> on_road(grid.spec().size(), 0);
  auto add_road = [&](std::vector<Point> stops, const RouteCost& cost, std::string cls,
                      std::string ref, std::string name) {
    std::vector<int> nodes;
    for (std::size_t i = 1; i < stops.size(); ++i) {
      std::vector<int> leg = grid.route(grid.node_at(stops[i - 1]), grid.node_at(stops[i]), cost);
      if (leg.empty()) continue;
      if (!nodes.empty()) leg.erase(leg.begin());
      nodes.insert(nodes.end(), leg.begin(), leg.end());
    }
    if (nodes.size() < 2) return;
    for (int n : nodes) {
      on_road[n] = 1;
      grid.set_discount(n, 0.45f);
    }
    out.roads.push_back(
        {path_to_line(grid, nodes, dem), std::move(cls), std::move(ref), std::move(name)});
  };
  auto edge_point = [&](double x, double side) {
    Point p = terrace(x, side);
    return p;
  };
  const Place& v1 = places[0];
  const Place& v2 = places[1];
  const Place& v3 = places[2];
  add_road({edge_point(kAreaWest + 10, 1), v1.at, v2.at, v3.at, edge_point(kAreaWest + W - 10, 1)},
           kMain, "main", "M 4", "");
  Point north_exit{places[3].at.x + 400, kAreaSouth + kAreaHeightM - 10};
  add_road({v2.at, places[5].at, places[3].at, north_exit}, kSecondary, "secondary", "S 12", "");
  add_road({v3.at, places[7].at, Point{places[7].at.x + 300, kAreaSouth + 10}}, kSecondary,
           "secondary", "S 31", "");

  // Minor roads: every other settlement to the nearest road.
  for (std::size_t i = 0; i < places.size(); ++i) {
    if (i < 3 || i == 3 || i == 5 || i == 7) continue;
    const Place& p = places[i];
    std::vector<int> nodes = grid.route_to_any(grid.node_at(p.at), on_road, kMinor);
    if (nodes.size() < 2) continue;
    Polyline line = path_to_line(grid, nodes, dem);
    // End exactly on the road it joins.
    for (const Road& r : out.roads) {
      Point q = snap_to_line(r.line, line.back());
      if (distance(q, line.back()) < cell * 1.5) {
        line.back() = q;
        break;
      }
    }
    std::reverse(line.begin(), line.end());
    std::string name = p.kind == "farm" ? "" : p.name + " Lane";
    for (int n : nodes) {
      on_road[n] = 1;
      grid.set_discount(n, 0.45f);
    }
    out.roads.push_back({line, "minor", "", name});
  }

  // Tracks from farms out into their land; paths up the three highest summits.
  for (const Place& p : places) {
    if (p.kind != "farm") continue;
    double a = L.rng.uniform(0, 6.283185307179586);
    double r = L.rng.uniform(700, 1500);
    Point end{p.at.x + r * std::cos(a), p.at.y + r * std::sin(a)};
    if (!s.dem.bounds().expanded(-100).contains(end) || s.lake_shape(end) < 0.3) continue;
    std::vector<int> nodes = grid.route(grid.node_at(p.at), grid.node_at(end), kTrack);
    if (nodes.size() > 3) out.tracks.push_back({path_to_line(grid, nodes, dem), "track"});
  }
  for (std::size_t i = 0; i < summits.size() && i < 3; ++i) {
    std::vector<int> nodes = grid.route_to_any(grid.node_at(summits[i].at), on_road, kPath);
    if (nodes.size() < 3) continue;
    Polyline line = path_to_line(grid, nodes, dem);
    line.front() = summits[i].at;
    out.tracks.push_back({line, "path"});
  }

  // The railway keeps to the valley floor and its terraces.
  std::vector<int> rail;
  Point stops[4] = {terrace(kAreaWest + 10, 1), Point{v1.at.x, v1.at.y - 150},
                    Point{v2.at.x, v2.at.y + 150}, terrace(kAreaWest + W - 10, -1)};
  for (int i = 1; i < 4; ++i) {
    std::vector<int> leg =
        rail_grid.route(rail_grid.node_at(stops[i - 1]), rail_grid.node_at(stops[i]), kRail);
    if (!rail.empty() && !leg.empty()) leg.erase(leg.begin());
    rail.insert(rail.end(), leg.begin(), leg.end());
  }
  if (rail.size() > 2) {
    Polyline line = chaikin_open(simplify(path_to_line(rail_grid, rail, dem), 6), 3);
    out.railways.push_back({line, "rail", "Harrowmere Valley Line"});
  }
  log::debug("demo-area: {} places, {} roads, {} tracks", places.size(), out.roads.size(),
             out.tracks.size());
  return out;
}

}  // namespace sheetmill::demo
