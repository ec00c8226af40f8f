#include "sheetmill/demo/streets.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/demo/settlements.hpp"
#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

namespace {

constexpr RouteCost kStreet{0.07, 8, 3};

Point gradient(const FloatGrid& dem, Point p) {
  double d = std::max(8.0, dem.spec.cell_m);
  return {(sample(dem, {p.x + d, p.y}) - sample(dem, {p.x - d, p.y})) / (2 * d),
          (sample(dem, {p.x, p.y + d}) - sample(dem, {p.x, p.y - d})) / (2 * d)};
}

double water_distance(const Hydrography& water, Point p, double within) {
  double best = within;
  for (const WaterLine& w : water.lines) {
    Box b;
    for (const Point& q : w.line) b.add(q);
    if (!b.expanded(best).contains(p)) continue;
    best = std::min(best, distance_to_polyline(w.line, p));
  }
  return best;
}

// One way of a contour line: steps of 10 m across the slope, each corrected back to the
// starting height along the gradient (a Newton step).
Polyline trace_one_way(const Scenario& s, const FloatGrid& dem, const Hydrography& water,
                       Point start, Point heading, double max_m) {
  const double step = 10;
  double z0 = sample(dem, start);
  double side = s.river_y(start.x) < start.y ? 1 : -1;
  Box area = s.dem.bounds().expanded(-60);
  Polyline out{start};
  Point p = start, dir = heading;
  for (double run = 0; run < max_m; run += step) {
    Point g = gradient(dem, p);
    double gl = length(g);
    if (gl > 0.004) {
      Point t{-g.y / gl, g.x / gl};
      if (dot(t, dir) < 0) t = t * -1;
      dir = t;
    }
    Point q = p + dir * step;
    for (int k = 0; k < 2; ++k) {
      Point gq = gradient(dem, q);
      double g2 = dot(gq, gq);
      if (g2 < 1e-6) break;
      double dz = z0 - sample(dem, q);
      Point shift = gq * (dz / g2);
      double sl = length(shift);
      if (sl > 4) shift = shift * (4 / sl);
      q = q + shift;
    }
    if (!area.contains(q) || s.lake_shape(q) < 0.2 || slope_at(dem, q) > 0.16) break;
    if ((s.river_y(q.x) < q.y ? 1 : -1) != side) break;
    if (water_distance(water, q, 25) < 25) break;
    dir = (q - p) * (1 / std::max(distance(q, p), 1e-9));
    out.push_back(q);
    p = q;
  }
  return out;
}

void add_street(StreetContext& ctx, Polyline line, std::vector<Road>& roads) {
  if (line.size() < 3 || polyline_length(line) < 80) return;
  for (const Point& p : densify(line, ctx.grid.spec().cell_m / 2)) {
    int n = ctx.grid.node_at(p);
    ctx.on_road[n] = 1;
    ctx.grid.set_discount(n, 0.45f);
  }
  roads.push_back({std::move(line), "minor", "", ""});
}

}  // namespace

Polyline trace_contour(const Scenario& s, const FloatGrid& dem, const Hydrography& water,
                       Point start, double half_length_m) {
  Point g = gradient(dem, start);
  double gl = length(g);
  Point t = gl > 0 ? Point{-g.y / gl, g.x / gl} : Point{1, 0};
  Polyline a = trace_one_way(s, dem, water, start, t, half_length_m);
  Polyline b = trace_one_way(s, dem, water, start, t * -1, half_length_m);
  Polyline line(b.rbegin(), b.rend());
  line.insert(line.end(), a.begin() + 1, a.end());
  return line;
}

void lay_out_streets(StreetContext& ctx, const Place& village, Random& rng,
                     std::vector<Road>& roads) {
  const Scenario& s = ctx.s;
  const FloatGrid& dem = ctx.dem;
  double side = s.river_y(village.at.x) < village.at.y ? 1 : -1;
  // The back street: about 70-110 m up the slope from the centre, along the contour.
  Point up = village.at;
  double climb = rng.uniform(70, 110);
  for (double run = 0; run < climb; run += 10) {
    Point g = gradient(dem, up);
    double gl = length(g);
    // On near-flat ground, head away from the river.
    Point d = gl > 0.01 ? g * (1 / gl) : Point{0, side};
    up = up + d * 10;
  }
  Polyline back = trace_contour(s, dem, ctx.water, up, rng.uniform(260, 420));
  if (back.size() >= 3) {
    back = chaikin_open(simplify(back, 2), 2);
    add_street(ctx, back, roads);
    // The link from the centre up to the back street.
    std::vector<int> link =
        ctx.grid.route(ctx.grid.node_at(village.at), ctx.grid.node_at(up), kStreet);
    if (link.size() >= 2) {
      Polyline line = path_to_line(ctx.grid, link, dem);
      line.front() = village.at;
      line.back() = up;
      add_street(ctx, line, roads);
    }
  }
  // A lane up the nearest side valley on the village's side of the river.
  const StreamLine* best = nullptr;
  double best_d = 900;
  std::size_t best_k = 0;
  for (const StreamLine& st : ctx.water.streams) {
    for (std::size_t k = 0; k < st.line.size(); ++k) {
      const Point& p = st.line[k];
      if ((s.river_y(p.x) < p.y ? 1 : -1) != side) continue;
      double d = distance(p, village.at);
      if (d < best_d) best_d = d, best = &st, best_k = k;
    }
  }
  if (!best) return;
  // 350-550 m upstream from where the stream passes closest, or its source.
  double want = rng.uniform(350, 550), run = 0;
  std::size_t k = best_k;
  while (k > 0 && run < want) {
    run += distance(best->line[k], best->line[k - 1]);
    --k;
  }
  Point head = best->line[k];
  // Beside the stream, not on it: step 30 m across the valley towards the village side.
  Point dir = best->line[std::min(k + 1, best->line.size() - 1)] - head;
  double dl = length(dir);
  if (dl > 0) {
    Point n{-dir.y / dl, dir.x / dl};
    if (dot(n, village.at - head) < 0) n = n * -1;
    head = head + n * 30;
  }
  std::vector<int> lane =
      ctx.grid.route(ctx.grid.node_at(village.at), ctx.grid.node_at(head), kStreet);
  if (lane.size() >= 3) {
    Polyline line = path_to_line(ctx.grid, lane, dem);
    line.front() = village.at;
    for (const Point& p : line) {
      if ((s.river_y(p.x) < p.y ? 1 : -1) != side) return;  // would cross the river
    }
    // The lane ends where the valley steepens (a street does not zigzag up a slope).
    std::size_t end = 1;
    while (end < line.size() && slope_at(dem, line[end]) < 0.09) ++end;
    line.resize(end);
    add_street(ctx, line, roads);
  }
}

}  // namespace sheetmill::demo
