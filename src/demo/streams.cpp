#include "sheetmill/demo/streams.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "sheetmill/demo/random.hpp"

namespace sheetmill::demo {

namespace {

// Incision below the filled surface: a few metres for a spring, tens of metres for a stream
// draining tens of square kilometres (a common rule of thumb: depth grows with the square root
// of area).
double incision_m(double area_km2) {
  return std::min(30.0, 2.0 + 6.5 * std::sqrt(area_km2));
}

// Extra incision where the stream falls steeply (grade along the flow path): up to 35 m for a
// stream of a few square kilometres crossing the escarpment, so it runs in a gorge.
double gorge_m(double grade, double area_km2) {
  return 35 * std::clamp((grade - 0.08) / 0.25, 0.0, 1.0) *
         std::min(1.0, std::sqrt(area_km2) / 1.5);
}

// The least fall of a bed per metre of channel (0.5 m/km): enough for D8 to follow the
// channel on the DEM's Float32 heights, small enough to stay below a floodplain's surface.
constexpr double kMinFall = 0.0005;

// The lowest ground within about 20 m of p (a 5 x 5 pattern at 10 m): a bed below it sits below
// any hollow beside the line, so no pit next to the channel is lower than the channel.
double lowest_ground(const FloatGrid& ground, Point p) {
  double z = std::numeric_limits<double>::infinity();
  for (int dy = -2; dy <= 2; ++dy) {
    for (int dx = -2; dx <= 2; ++dx) {
      if (dx * dx + dy * dy > 5) continue;
      z = std::min(z, sample(ground, {p.x + 10.0 * dx, p.y + 10.0 * dy}));
    }
  }
  return z;
}

// One pass of the four-point scheme (Dyn, Levin & Gregory 1987): original vertices stay, a
// new one goes between each pair; ends are extended by reflection. Beds are interpolated
// linearly, so they still never rise.
void refine(Polyline& line, std::vector<double>& bed) {
  if (line.size() < 3) return;
  Polyline out;
  std::vector<double> out_bed;
  std::size_t n = line.size();
  auto at = [&](long i) {
    if (i < 0) return line[0] * 2 - line[1];
    if (i >= static_cast<long>(n)) return line[n - 1] * 2 - line[n - 2];
    return line[static_cast<std::size_t>(i)];
  };
  for (std::size_t i = 0; i + 1 < n; ++i) {
    long k = static_cast<long>(i);
    out.push_back(line[i]);
    out_bed.push_back(bed[i]);
    Point mid = (at(k) + at(k + 1)) * (9.0 / 16) - (at(k - 1) + at(k + 2)) * (1.0 / 16);
    out.push_back(mid);
    out_bed.push_back(0.5 * (bed[i] + bed[i + 1]));
  }
  out.push_back(line.back());
  out_bed.push_back(bed.back());
  line.swap(out);
  bed.swap(out_bed);
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
  // Meanders: the phase advances by 2 pi per wavelength along the channel from its mouth, so it
  // is continuous through every confluence; two incommensurate waves keep bends irregular.
  {
    std::vector<double> phase(n, 0);
    std::vector<Point> moved = pos;
    Random rng = Random(in.seed).fork(11);
    double phi = rng.uniform(0, 6.283185307179586);
    for (std::int32_t c : f.order) {
      if (!is_stream[c]) continue;
      std::int32_t r = f.receiver[c];
      bool down = r >= 0 && is_stream[r];
      double area_km2 = f.area_m2[c] / 1e6;
      double wavelength = 140 + 40 * std::sqrt(area_km2);
      double step = down ? distance(pos[c], pos[r]) : 0;
      phase[c] = (down ? phase[r] : 0) + 6.283185307179586 * step / wavelength;
      std::int32_t d = main_donor[c];
      Point a = d >= 0 ? pos[d] : pos[c];
      Point b = down ? pos[r] : pos[c];
      Point t = b - a;
      double len = length(t);
      if (len <= 0) continue;
      double grade = down ? (f.filled[c] - f.filled[r]) / std::max(step, 1.0) : 0;
      double amp = 0.1 * wavelength / (1 + std::pow(grade / 0.06, 2));
      double wave = 0.7 * std::sin(phase[c] + phi) + 0.45 * std::sin(1.754 * phase[c] + 2 * phi);
      moved[c] = pos[c] + Point{-t.y / len, t.x / len} * (amp * wave);
    }
    pos.swap(moved);
  }
  // Where each stream ends, and the floor its beds keep to, downstream first.
  constexpr double kNone = -std::numeric_limits<double>::infinity();
  std::vector<double> floor(n, kNone);
  std::vector<double> to_mouth(n, 0);  // metres along the channel to where it ends
  std::vector<Point> end_point(n);
  for (std::int32_t c : f.order) {
    if (!is_stream[c]) continue;
    std::int32_t r = f.receiver[c];
    if (r >= 0 && is_stream[r]) {
      floor[c] = floor[r];
      to_mouth[c] = to_mouth[r] + distance(pos[c], pos[r]);
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
    if (!(r >= 0 && is_stream[r])) to_mouth[c] = distance(pos[c], end_point[c]);
  }
  // Beds, upstream first.
  std::vector<double> bed(n, std::numeric_limits<double>::infinity());
  for (auto it = f.order.rbegin(); it != f.order.rend(); ++it) {
    std::int32_t c = *it;
    if (!is_stream[c]) continue;
    std::int32_t down = f.receiver[c];
    double grade = 0;
    if (down >= 0) {
      grade = (f.filled[c] - f.filled[down]) / std::max(distance(centre(c), centre(down)), 1.0);
    }
    double area_km2 = f.area_m2[c] / 1e6;
    // Below both the filled surface and the ground under the (meandering) vertex, so the
    // channel is incised wherever the line runs.
    double own = std::min(static_cast<double>(f.filled[c]), lowest_ground(*in.ground, pos[c])) -
                 incision_m(area_km2) - gorge_m(grade, area_km2);
    // Strictly falling: at least kMinFall per metre below every bed upstream, and above the
    // floor by kMinFall per metre still to go, so no reach is a flat.
    bed[c] = std::max(std::min(bed[c], own), floor[c] + kMinFall * to_mouth[c]);
    std::int32_t r = f.receiver[c];
    if (r >= 0 && is_stream[r]) {
      bed[r] = std::min(bed[r], bed[c] - kMinFall * distance(pos[c], pos[r]));
    }
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
    refine(s.line, s.bed_m);
    refine(s.line, s.bed_m);
    for (std::size_t k = 0; k < s.line.size(); ++k) {
      s.max_incision_m = std::max(s.max_incision_m, sample(*in.ground, s.line[k]) - s.bed_m[k]);
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
