#include "sheetmill/demo/streams.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

namespace sheetmill::demo {

namespace {

// Incision below the filled surface: a few metres for a spring, tens of metres for a stream
// draining tens of square kilometres (a common rule of thumb: depth grows with the square root
// of area).
double incision_m(double area_km2) {
  return std::min(30.0, 2.0 + 6.5 * std::sqrt(area_km2));
}

}  // namespace

std::vector<StreamLine> extract_streams(const StreamInputs& in) {
  const FlowRouting& f = *in.flow;
  const GridSpec& g = f.spec;
  const std::vector<Sink>& sinks = *in.sinks;
  const std::size_t n = g.size();
  std::vector<char> is_stream(n, 0);
  for (std::size_t i = 0; i < n; ++i) {
    is_stream[i] = f.area_m2[i] >= in.threshold_m2 && sinks[i] == Sink::none;
  }
  // Strahler order and main donor, upstream first (reverse flood order).
  std::vector<int> order(n, 0), top(n, 0), top_count(n, 0);
  std::vector<std::int32_t> main_donor(n, -1);
  for (auto it = f.order.rbegin(); it != f.order.rend(); ++it) {
    std::int32_t c = *it;
    if (!is_stream[c]) continue;
    order[c] = top[c] == 0 ? 1 : (top_count[c] >= 2 ? top[c] + 1 : top[c]);
    std::int32_t r = f.receiver[c];
    if (r < 0 || !is_stream[r]) continue;
    if (order[c] > top[r]) {
      top[r] = order[c];
      top_count[r] = 1;
    } else if (order[c] == top[r]) {
      ++top_count[r];
    }
    if (main_donor[r] < 0 || f.area_m2[c] > f.area_m2[main_donor[r]]) main_donor[r] = c;
  }
  // Smoothed positions: three passes of [1/4, 1/2, 1/4] along the main stem (about a 1.2-cell
  // Gaussian), which turns the D8 staircase into lines at any angle.
  std::vector<Point> pos(n), next(n);
  auto centre = [&](std::int32_t c) { return g.centre(c % g.width, c / g.width); };
  for (std::size_t i = 0; i < n; ++i) pos[i] = centre(static_cast<std::int32_t>(i));
  for (int pass = 0; pass < 3; ++pass) {
    next = pos;
    for (std::size_t i = 0; i < n; ++i) {
      if (!is_stream[i]) continue;
      std::int32_t r = f.receiver[i];
      std::int32_t d = main_donor[i];
      if (r >= 0 && is_stream[r] && d >= 0) next[i] = pos[d] * 0.25 + pos[i] * 0.5 + pos[r] * 0.25;
    }
    pos.swap(next);
  }
  // Where each stream ends, and the floor its beds keep to, downstream first.
  constexpr double kNone = -std::numeric_limits<double>::infinity();
  std::vector<double> floor(n, kNone);
  std::vector<Point> end_point(n);
  for (std::int32_t c : f.order) {
    if (!is_stream[c]) continue;
    std::int32_t r = f.receiver[c];
    if (r >= 0 && is_stream[r]) {
      floor[c] = floor[r];
    } else if (r >= 0 && sinks[r] == Sink::river) {
      end_point[c] = in.river_point(pos[c]);
      floor[c] = in.river_bed_m(end_point[c]);
    } else if (r >= 0 && sinks[r] == Sink::lake) {
      end_point[c] = centre(r);
      floor[c] = in.lake_level_m;
    } else {
      // The grid edge: the outermost fine-cell centre beyond the last stream cell.
      Point p = centre(c);
      double half = in.ground->spec.cell_m / 2;
      Box b = g.bounds();
      int col = c % g.width, row = c / g.width;
      if (col == 0)
        p.x = b.min_x + half;
      else if (col == g.width - 1)
        p.x = b.max_x - half;
      else if (row == 0)
        p.y = b.max_y - half;
      else
        p.y = b.min_y + half;
      end_point[c] = p;
    }
  }
  // Beds, upstream first.
  std::vector<double> bed(n, std::numeric_limits<double>::infinity());
  for (auto it = f.order.rbegin(); it != f.order.rend(); ++it) {
    std::int32_t c = *it;
    if (!is_stream[c]) continue;
    double own = std::min(static_cast<double>(f.filled[c]) - incision_m(f.area_m2[c] / 1e6),
                          sample(*in.ground, pos[c]));
    bed[c] = std::max(std::min(bed[c], own), floor[c]);
    std::int32_t r = f.receiver[c];
    if (r >= 0 && is_stream[r]) bed[r] = std::min(bed[r], bed[c]);
  }
  // Lines: start at sources and where the order rises; follow while the order holds.
  std::vector<StreamLine> lines;
  std::vector<int> line_of(n, -1);
  std::vector<std::int32_t> first_cell;
  for (auto it = f.order.rbegin(); it != f.order.rend(); ++it) {
    std::int32_t c = *it;
    if (!is_stream[c] || line_of[c] >= 0) continue;
    StreamLine s;
    s.strahler = order[c];
    int id = static_cast<int>(lines.size());
    std::int32_t cur = c;
    for (;;) {
      line_of[cur] = id;
      s.line.push_back(pos[cur]);
      s.bed_m.push_back(bed[cur]);
      s.area_km2 = f.area_m2[cur] / 1e6;
      std::int32_t r = f.receiver[cur];
      if (r >= 0 && is_stream[r]) {
        if (order[r] == s.strahler) {
          cur = r;
          continue;
        }
        s.line.push_back(pos[r]);
        s.bed_m.push_back(bed[r]);
        s.receiver_line = r;  // a cell for now; resolved to a line below
      } else {
        s.line.push_back(end_point[cur]);
        s.bed_m.push_back(floor[cur] == kNone ? bed[cur] : std::min(bed[cur], floor[cur]));
      }
      break;
    }
    lines.push_back(std::move(s));
    first_cell.push_back(c);
  }
  // Resolve receivers to lines, and find at each line's first vertex its largest contributor.
  std::vector<int> up_main(lines.size(), -1);
  for (std::size_t i = 0; i < lines.size(); ++i) {
    StreamLine& s = lines[i];
    if (s.receiver_line < 0) continue;
    std::int32_t junction = s.receiver_line;
    s.receiver_line = line_of[junction];
    if (first_cell[s.receiver_line] != junction) continue;  // joins part-way: a tributary
    int& best = up_main[s.receiver_line];
    if (best < 0 || lines[best].area_km2 < s.area_km2) best = static_cast<int>(i);
  }
  // Main stems: follow each line down while it is the main contributor of the next.
  for (std::size_t i = 0; i < lines.size(); ++i) {
    int cur = static_cast<int>(i);
    while (lines[cur].receiver_line >= 0 && up_main[lines[cur].receiver_line] == cur) {
      cur = lines[cur].receiver_line;
    }
    lines[i].main_stem = cur;
  }
  return lines;
}

}  // namespace sheetmill::demo
