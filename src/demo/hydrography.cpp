#include "sheetmill/demo/hydrography.hpp"

#include <algorithm>
#include <cmath>
#include <iterator>
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

ChannelProfile stream_profile(const StreamLine& line, double fine_cell_m) {
  double area_km2 = line.area_km2;
  ChannelProfile p;
  // The floor is at least as wide as a fine cell diagonal, so the cells bilinear sampling
  // reads at a vertex all lie on the floor.
  p.floor_half_width_m =
      std::max(std::min(9.0, 3.5 + 1.2 * std::sqrt(area_km2)), fine_cell_m * 0.75);
  p.bank_height_m = 0.8;
  p.bank_width_m = 2;
  p.side_slope = 0.32;
  double incision = std::max(line.max_incision_m, std::min(30.0, 2.0 + 6.5 * std::sqrt(area_km2)));
  // A gorge has steeper walls than an open valley.
  if (incision > 25) p.side_slope = 0.55;
  p.reach_m = p.floor_half_width_m + 2 + (incision + 15) / p.side_slope;
  return p;
}

}  // namespace

int trim_stream_heads(Hydrography& h, const FloatGrid& dem, double threshold_m2) {
  FlowRouting flow = route_flow(dem, {});
  const GridSpec& g = dem.spec;
  auto gathered = [&](Point p) {
    int col = static_cast<int>(std::floor((p.x - g.x0) / g.cell_m));
    int row = static_cast<int>(std::floor((g.y_top - p.y) / g.cell_m));
    for (int r = row - 1; r <= row + 1; ++r) {
      for (int c = col - 1; c <= col + 1; ++c) {
        if (g.inside(c, r) && flow.area_m2[dem.index(c, r)] > threshold_m2) return true;
      }
    }
    return false;
  };
  std::size_t n = h.streams.size();
  std::size_t first = h.river_parts.size();  // h.lines: the river's parts, then the streams
  std::vector<char> fed(n, 0), keep(n, 1);
  for (const StreamLine& l : h.streams) {
    if (l.receiver_line >= 0) fed[l.receiver_line] = 1;
  }
  int removed = 0;
  for (std::size_t i = 0; i < n; ++i) {
    if (fed[i]) continue;
    StreamLine& l = h.streams[i];
    std::size_t k = 0;
    while (k < l.line.size() && !gathered(l.line[k])) ++k;
    if (k + 1 >= l.line.size()) {
      keep[i] = 0;
      removed += static_cast<int>(l.line.size());
      continue;
    }
    l.line.erase(l.line.begin(), l.line.begin() + static_cast<long>(k));
    l.bed_m.erase(l.bed_m.begin(), l.bed_m.begin() + static_cast<long>(k));
    h.lines[first + i].line = l.line;
    removed += static_cast<int>(k);
  }
  // Drop the emptied lines and renumber the references between lines.
  std::vector<int> new_index(n, -1);
  std::vector<StreamLine> streams;
  std::vector<WaterLine> lines(h.lines.begin(), h.lines.begin() + static_cast<long>(first));
  for (std::size_t i = 0; i < n; ++i) {
    if (!keep[i]) continue;
    new_index[i] = static_cast<int>(streams.size());
    streams.push_back(std::move(h.streams[i]));
    lines.push_back(std::move(h.lines[first + i]));
  }
  for (StreamLine& l : streams) {
    if (l.receiver_line >= 0) l.receiver_line = new_index[l.receiver_line];
    if (l.main_stem >= 0) l.main_stem = new_index[l.main_stem];
  }
  lines.insert(lines.end(), std::make_move_iterator(h.lines.begin() + static_cast<long>(first + n)),
               std::make_move_iterator(h.lines.end()));
  h.streams = std::move(streams);
  h.lines = std::move(lines);
  // Strahler (1957) orders again, since dropped heads may have been one of two equal-order
  // lines meeting at a junction. Lines come upstream first, so feeders are done before the
  // line they join; a line's order comes from the lines meeting at its first vertex and is
  // never below that of a tributary joining it further down.
  std::vector<int> top(h.streams.size(), 0), top_count(h.streams.size(), 0),
      below(h.streams.size(), 1);
  int top_order = 1;
  for (std::size_t i = 0; i < h.streams.size(); ++i) {
    StreamLine& l = h.streams[i];
    int order = top[i] == 0 ? 1 : (top_count[i] >= 2 ? top[i] + 1 : top[i]);
    l.strahler = std::max(order, below[i]);
    h.lines[first + i].strahler = l.strahler;
    top_order = std::max(top_order, l.strahler);
    int r = l.receiver_line;
    if (r < 0) continue;
    const Point& head = h.streams[static_cast<std::size_t>(r)].line.front();
    if (distance(l.line.back(), head) < 1e-9) {
      if (l.strahler > top[r]) {
        top[r] = l.strahler;
        top_count[r] = 1;
      } else if (l.strahler == top[r]) {
        ++top_count[r];
      }
    } else {
      below[r] = std::max(below[r], l.strahler);
    }
  }
  for (std::size_t i = 0; i < first; ++i) h.lines[i].strahler = top_order + 1;
  return removed;
}

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
  join_parallel_flows(flow, 60000);

  StreamInputs in;
  in.flow = &flow;
  in.sinks = &sinks;
  in.ground = &dem;
  in.river_point = [&](Point p) { return nearest_on(h.river_parts, p); };
  in.river_bed_m = [&](Point p) { return s.river_bed_m(p.x); };
  in.lake_level_m = s.lake_level_m;
  in.threshold_m2 = kChannelThresholdM2;
  in.seed = s.seed;
  h.streams = extract_streams(in);
  for (const StreamLine& line : h.streams) {
    carve_channel(dem, line.line, line.bed_m, stream_profile(line, dem.spec.cell_m));
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
