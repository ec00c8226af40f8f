#include "sheetmill/demo/hydrography.hpp"

#include <algorithm>
#include <cmath>
#include <map>

#include "sheetmill/core/log.hpp"
#include "sheetmill/demo/carve.hpp"
#include "sheetmill/demo/drainage.hpp"
#include "sheetmill/demo/shapes.hpp"
#include "sheetmill/demo/terrain.hpp"

namespace sheetmill::demo {

namespace {

// The river centreline from the east edge to the west edge, cut where it crosses the lake.
std::vector<Polyline> river_parts(const Scenario& s) {
  Polyline full;
  double half = s.dem.cell_m / 2;
  for (double x = kAreaWest + kAreaWidthM - half; x >= kAreaWest + half; x -= 10) {
    full.push_back({x, s.river_y(x)});
  }
  full.push_back({kAreaWest + half, s.river_y(kAreaWest + half)});
  std::size_t in = full.size(), out = 0;
  for (std::size_t i = 0; i < full.size(); ++i) {
    if (point_in_ring(s.lake_ring, full[i])) {
      in = std::min(in, i);
      out = std::max(out, i);
    }
  }
  if (in == full.size()) return {full};
  return {Polyline(full.begin(), full.begin() + static_cast<long>(in) + 1),
          Polyline(full.begin() + static_cast<long>(out), full.end())};
}

Point nearest_on(const std::vector<Polyline>& parts, Point p) {
  Point best = p;
  double best_d = std::numeric_limits<double>::infinity();
  for (const Polyline& line : parts) {
    for (std::size_t i = 1; i < line.size(); ++i) {
      double t = 0;
      double d = distance_to_segment(p, line[i - 1], line[i], &t);
      if (d < best_d) {
        best_d = d;
        best = line[i - 1] + (line[i] - line[i - 1]) * t;
      }
    }
  }
  return best;
}

ChannelProfile stream_profile(double area_km2, double fine_cell_m) {
  ChannelProfile p;
  // The floor is at least as wide as a fine cell diagonal, so the cells bilinear sampling
  // reads at a vertex all lie on the floor.
  p.floor_half_width_m =
      std::max(std::min(9.0, 3.5 + 1.2 * std::sqrt(area_km2)), fine_cell_m * 0.75);
  p.bank_height_m = 0.8;
  p.bank_width_m = 2;
  p.side_slope = 0.32;
  double incision = std::min(30.0, 2.0 + 6.5 * std::sqrt(area_km2));
  p.reach_m = p.floor_half_width_m + 2 + (incision + 15) / p.side_slope;
  return p;
}

}  // namespace

std::vector<char> lake_mask(const Scenario& s, const GridSpec& spec) {
  std::vector<char> mask(spec.size(), 0);
  for_cells_in_ring(spec, s.lake_ring, [&](int col, int row) {
    mask[static_cast<std::size_t>(row) * spec.width + col] = 1;
  });
  return mask;
}

Hydrography carve_hydrography(const Scenario& s, FloatGrid& dem, NameMaker& names) {
  Hydrography h;
  h.river_parts = river_parts(s);
  ChannelProfile river;
  river.floor_half_width_m = std::max(9.0, dem.spec.cell_m);
  river.bank_height_m = 1.2;
  river.bank_width_m = 3;
  river.side_slope = 0.4;
  river.reach_m = 30;
  for (const Polyline& part : h.river_parts) {
    std::vector<double> bed;
    for (const Point& p : part) bed.push_back(s.river_bed_m(p.x));
    carve_channel(dem, part, bed, river);
  }
  flatten_lake(s, dem);

  // Flow on a coarse grid (about 20 m): river and lake cells are sinks.
  int factor = std::max(1, static_cast<int>(std::lround(20.0 / dem.spec.cell_m)));
  FloatGrid coarse = downsample(dem, factor);
  const GridSpec& cg = coarse.spec;
  std::vector<Sink> sinks(cg.size(), Sink::none);
  for (const Polyline& part : h.river_parts) {
    for (const Point& p : densify(part, cg.cell_m / 3)) {
      sinks[coarse.index(cg.col_clamped(p.x), cg.row_clamped(p.y))] = Sink::river;
    }
  }
  for_cells_in_ring(cg, s.lake_ring,
                    [&](int col, int row) { sinks[coarse.index(col, row)] = Sink::lake; });
  std::vector<char> sink_mask(cg.size());
  for (std::size_t i = 0; i < cg.size(); ++i) sink_mask[i] = sinks[i] != Sink::none;
  FlowRouting flow = route_flow(coarse, sink_mask);

  StreamInputs in;
  in.flow = &flow;
  in.sinks = &sinks;
  in.ground = &dem;
  in.river_point = [&](Point p) { return nearest_on(h.river_parts, p); };
  in.river_bed_m = [&](Point p) { return s.river_bed_m(p.x); };
  in.lake_level_m = s.lake_level_m;
  in.threshold_m2 = 250000;
  h.streams = extract_streams(in);
  for (const StreamLine& line : h.streams) {
    carve_channel(dem, line.line, line.bed_m, stream_profile(line.area_km2, dem.spec.cell_m));
  }
  flatten_lake(s, dem);

  // Names: the river, the lake, and the larger watercourses (by area at their mouths).
  int top_order = 1;
  for (const StreamLine& l : h.streams) top_order = std::max(top_order, l.strahler);
  std::string river_name = names.river();
  for (const Polyline& part : h.river_parts) {
    h.lines.push_back({part, "river", river_name, top_order + 1});
  }
  h.areas.push_back({s.lake_ring, "lake", "Harrowmere", s.lake_level_m});
  std::map<int, double> stem_area;
  for (const StreamLine& l : h.streams) {
    if (l.receiver_line < 0 || l.main_stem == static_cast<int>(&l - h.streams.data())) {
      stem_area[l.main_stem] = std::max(stem_area[l.main_stem], l.area_km2);
    }
  }
  std::vector<std::pair<double, int>> big;
  for (auto [stem, area] : stem_area) {
    if (area >= 2.0) big.push_back({-area, stem});
  }
  std::sort(big.begin(), big.end());
  std::map<int, std::string> stem_name;
  for (std::size_t i = 0; i < big.size() && i < 14; ++i) stem_name[big[i].second] = names.stream();
  for (const StreamLine& l : h.streams) {
    auto it = stem_name.find(l.main_stem);
    h.lines.push_back({l.line, "stream", it == stem_name.end() ? "" : it->second, l.strahler});
  }
  log::debug("demo-area: {} stream lines, {} named watercourses", h.streams.size(),
             stem_name.size());
  return h;
}

}  // namespace sheetmill::demo
