// Line displacement (see displace.hpp). Each yielding line is resampled, then relaxed in rounds:
// every vertex closer to a line of higher priority than the two half-widths gets the shift that
// makes them touch, the shifts are spread along the line with a raised-cosine taper (the
// transition), added up, and held to the line's limit.
#include "sheetmill/features/displace.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "features/segment_index.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::features {

namespace {

using detail::Segment;
using detail::SegmentIndex;

constexpr double kTouchMm = 1e-9;
constexpr double kCrossingSin = 0.5;  // lines meeting at 30 degrees or more cross  // a deficit
                                      // below this is touching (rounding of doubles)

struct Need {
  Point shift;  // the move that would make the symbols touch
  double size = 0;
  std::size_t obstacle = 0;
  // From the nearest obstacle segment: its left normal, the vertex's signed distance along it,
  // and the clearance (sum of half-widths). normal is zero when not known.
  Point normal;
  double signed_mm = 0;
  double clearance_mm = 0;
};

void keep_larger(Need& have, const Need& offer) {
  if (offer.size > have.size) have = offer;
}

// `line` resampled so no segment is longer than `step_mm`; `original[i]` says whether vertex i
// was in the input.
Polyline resample(const Polyline& line, double step_mm, std::vector<bool>& original) {
  Polyline out;
  original.clear();
  for (std::size_t i = 0; i < line.size(); ++i) {
    if (i > 0) {
      const Point a = line[i - 1], b = line[i];
      const int pieces = static_cast<int>(std::ceil(distance(a, b) / step_mm));
      for (int k = 1; k < pieces; ++k) {
        out.push_back(a + (b - a) * (static_cast<double>(k) / pieces));
        original.push_back(false);
      }
    }
    out.push_back(line[i]);
    original.push_back(true);
  }
  return out;
}

std::vector<double> arc_lengths(const Polyline& l) {
  std::vector<double> a(l.size(), 0);
  for (std::size_t i = 1; i < l.size(); ++i) a[i] = a[i - 1] + distance(l[i - 1], l[i]);
  return a;
}

// How free each vertex is to move, 0 to 1 (a share of the line's limit). 0 near a crossing with
// an obstacle or at an end lying on one: along a line crossing at angle theta, the stretch within
// the half-width sum c of the other line is c / sin(theta) long either side and overlaps by
// nature (the crossing symbol); from 30 degrees up that is at most 2c. Beyond, the freedom rises
// as a raised cosine over the transition length for a shift of c.
std::vector<double> freedom_near_crossings(const Polyline& l, const std::vector<double>& arc,
                                           const SegmentIndex& index,
                                           const std::vector<DisplacedLine>& lines,
                                           double own_half_mm, const DisplacementParams& params) {
  std::vector<double> freedom(l.size(), 1.0);
  struct Crossing {
    double at_arc, clearance, zone;
  };
  std::vector<Crossing> crossings;
  for (std::size_t i = 0; i + 1 < l.size(); ++i) {
    Box box;
    box.add(l[i]);
    box.add(l[i + 1]);
    index.near(box, [&](const Segment& s) {
      Point at;
      if (!detail::segments_cross(l[i], l[i + 1], s.a, s.b, at)) return;
      const Point u = l[i + 1] - l[i], v = s.b - s.a;
      const double sin_angle = std::abs(cross(u, v)) / (length(u) * length(v));
      // Shallower than 30 degrees the lines run together (or weave across each other) rather
      // than cross: that is a stretch to displace, to one side (see needs()).
      if (sin_angle < kCrossingSin) return;
      const double c = own_half_mm + lines[s.owner].half_width_mm;
      crossings.push_back(
          {arc[i] + distance(l[i], at), c, std::min(c / std::max(sin_angle, 1e-3), 2 * c)});
    });
  }
  // An end on the other line (a station approach, a road ending at a river): keep it there.
  for (std::size_t end : {std::size_t{0}, l.size() - 1}) {
    double c_near = 0;
    index.near(Box::of(l[end].x, l[end].y, l[end].x, l[end].y).expanded(0.01),
               [&](const Segment& s) {
                 if (distance(l[end], detail::nearest_on_segment(l[end], s.a, s.b)) < 0.01)
                   c_near = std::max(c_near, own_half_mm + lines[s.owner].half_width_mm);
               });
    if (c_near > 0) crossings.push_back({arc[end], c_near, 2 * c_near});
  }
  for (const Crossing& c : crossings) {
    const double taper =
        std::max(params.min_transition_mm, params.transition_per_shift * c.clearance);
    for (std::size_t i = 0; i < l.size(); ++i) {
      const double x = std::abs(arc[i] - c.at_arc) - c.zone;
      const double f = x <= 0 ? 0 : x >= taper ? 1 : 0.5 * (1 - std::cos(kPi * x / taper));
      freedom[i] = std::min(freedom[i], f);
    }
  }
  return freedom;
}

// What each vertex of `l` needs to clear the obstacles: its own distance to their segments, and
// the obstacles' vertices against its segments (the closest approach of two segments is at an
// end of one of them, so both checks together see every overlap).
std::vector<Need> needs(const Polyline& l, const std::vector<bool>& fixed, double own_half_mm,
                        const SegmentIndex& index, const std::vector<DisplacedLine>& lines,
                        double reach_mm) {
  std::vector<Need> need(l.size());
  for (std::size_t i = 0; i < l.size(); ++i) {
    if (fixed[i]) continue;
    const Point p = l[i];
    index.near(Box::of(p.x, p.y, p.x, p.y).expanded(reach_mm), [&](const Segment& s) {
      const double c = own_half_mm + lines[s.owner].half_width_mm;
      const Point q = detail::nearest_on_segment(p, s.a, s.b);
      const double d = distance(p, q);
      if (d >= c - kTouchMm) return;
      const Point t = s.b - s.a;
      const Point n = length(t) > 0 ? Point{-t.y, t.x} * (1 / length(t)) : Point{0, 0};
      const Point away = d > 1e-12 ? (p - q) * (1 / d) : n;
      keep_larger(need[i], {away * (c - d), c - d, s.owner, n, dot(p - q, n), c});
    });
  }
  for (std::size_t i = 0; i + 1 < l.size(); ++i) {
    if (fixed[i] || fixed[i + 1]) continue;
    Box box;
    box.add(l[i]);
    box.add(l[i + 1]);
    index.near(box.expanded(reach_mm), [&](const Segment& s) {
      const double c = own_half_mm + lines[s.owner].half_width_mm;
      for (Point o : {s.a, s.b}) {
        const Point q = detail::nearest_on_segment(o, l[i], l[i + 1]);
        const double d = distance(o, q);
        if (d >= c - kTouchMm || d <= 1e-12) continue;
        const Need n{(q - o) * ((c - d) / d), c - d, s.owner, {}, 0, 0};
        keep_larger(need[i], n);
        keep_larger(need[i + 1], n);
      }
    });
  }
  // One side per stretch: lines that run together weave across each other's centre line, and
  // a stretch pushed vertex by vertex would zigzag. In a stretch along one obstacle, a vertex
  // more than half the clearance off the other centre line keeps its side; the vertices nearer
  // it take the side of the nearest such vertex along the line, or, with none in the stretch,
  // the side most of the stretch lies on. A shallow crossing so becomes a steep one.
  for (std::size_t i = 0; i < need.size();) {
    if (need[i].size <= 0 || length(need[i].normal) == 0) {
      ++i;
      continue;
    }
    std::size_t end = i;
    double side = 0;
    for (; end < need.size() && need[end].size > 0 && need[end].obstacle == need[i].obstacle &&
           length(need[end].normal) > 0;
         ++end)
      side += need[end].signed_mm;
    std::vector<double> sign(end - i, side >= 0 ? 1 : -1);
    auto decided = [&](std::size_t k) {
      return std::abs(need[k].signed_mm) >= need[k].clearance_mm / 2;
    };
    for (std::size_t k = i; k < end; ++k) {
      std::size_t best = end, gap = end;
      for (std::size_t m = i; m < end; ++m) {
        const std::size_t g = m > k ? m - k : k - m;
        if (decided(m) && g < gap) {
          gap = g;
          best = m;
        }
      }
      if (best < end) sign[k - i] = need[best].signed_mm >= 0 ? 1 : -1;
    }
    for (std::size_t k = i; k < end; ++k) {
      Need& n = need[k];
      const double want = sign[k - i];
      if (n.signed_mm * want > 0) continue;
      const double move = want * n.clearance_mm - n.signed_mm;  // to signed distance +-c
      n.shift = n.normal * move;
      n.size = std::abs(move);
    }
    i = end;
  }
  return need;
}

// The raised-cosine transition: each needed shift reaches out along the line, fading to nothing
// over `transition` mm; a vertex takes the largest shift that reaches it.
std::vector<Point> spread(const std::vector<Need>& need, const std::vector<double>& arc,
                          const std::vector<bool>& fixed, const DisplacementParams& params) {
  std::vector<Point> shift(need.size());
  std::vector<double> size(need.size(), 0);
  for (std::size_t j = 0; j < need.size(); ++j) {
    if (need[j].size <= 0) continue;
    const double reach =
        std::max(params.min_transition_mm, params.transition_per_shift * need[j].size);
    auto offer = [&](std::size_t i) {
      const double x = std::abs(arc[i] - arc[j]);
      if (x >= reach) return false;
      const double w = 0.5 * (1 + std::cos(kPi * x / reach));
      if (!fixed[i] && need[j].size * w > size[i]) {
        size[i] = need[j].size * w;
        shift[i] = need[j].shift * w;
      }
      return true;
    };
    for (std::size_t i = j; offer(i) && i > 0;) --i;
    for (std::size_t i = j + 1; i < need.size() && offer(i);) ++i;
  }
  return shift;
}

// Moves one line away from the obstacles in `index`; appends its conflicts.
void displace_one(std::size_t which, std::vector<DisplacedLine>& lines, const SegmentIndex& index,
                  double reach_mm, const DisplacementParams& params,
                  std::vector<DisplacementConflict>& conflicts) {
  DisplacedLine& dl = lines[which];
  if (dl.line_mm.size() < 2) return;
  std::vector<bool> original;
  const Polyline start = resample(dl.line_mm, params.sample_mm, original);
  const std::vector<double> arc = arc_lengths(start);
  const std::vector<double> freedom =
      freedom_near_crossings(start, arc, index, lines, dl.half_width_mm, params);
  std::vector<bool> fixed(start.size());
  for (std::size_t i = 0; i < start.size(); ++i) fixed[i] = freedom[i] <= 0;
  std::vector<Point> total(start.size());
  Polyline now = start;
  bool moved = false;
  for (int round = 0; round < params.rounds; ++round) {
    const std::vector<Need> need = needs(now, fixed, dl.half_width_mm, index, lines, reach_mm);
    if (std::none_of(need.begin(), need.end(), [](const Need& n) { return n.size > 0; })) break;
    const std::vector<Point> step = spread(need, arc, fixed, params);
    for (std::size_t i = 0; i < now.size(); ++i) {
      total[i] = total[i] + step[i];
      const double len = length(total[i]), most = dl.max_shift_mm * freedom[i];
      if (len > most) total[i] = total[i] * (most / len);
      now[i] = start[i] + total[i];
    }
    moved = true;
  }
  if (!moved) return;
  // What is left over: one conflict per stretch of overlapping vertices, at its worst point
  // (the approaches to a crossing overlap by nature).
  // A stretch moved across the other line crosses it there, steeply: that is a crossing too.
  std::vector<Need> left = needs(now, fixed, dl.half_width_mm, index, lines, reach_mm);
  const std::vector<double> crossed =
      freedom_near_crossings(now, arc_lengths(now), index, lines, dl.half_width_mm, params);
  for (std::size_t i = 0; i < left.size(); ++i)
    if (freedom[i] < 1 || crossed[i] < 1) left[i] = {};
  for (std::size_t i = 0; i < left.size();) {
    if (left[i].size <= 1e-6) {
      ++i;
      continue;
    }
    std::size_t worst = i;
    for (; i < left.size() && left[i].size > 1e-6; ++i)
      if (left[i].size > left[worst].size) worst = i;
    conflicts.push_back({which, left[worst].obstacle, now[worst], left[worst].size});
  }
  // Resampled vertices that did not move add nothing to the drawing.
  Polyline out;
  for (std::size_t i = 0; i < now.size(); ++i)
    if (original[i] || length(total[i]) > 0) out.push_back(now[i]);
  dl.line_mm = std::move(out);
}

}  // namespace

double distance_to_polyline(Point p, const Polyline& line) {
  double best = std::numeric_limits<double>::infinity();
  if (line.size() == 1) return distance(p, line[0]);
  for (std::size_t i = 0; i + 1 < line.size(); ++i)
    best = std::min(best, distance(p, detail::nearest_on_segment(p, line[i], line[i + 1])));
  return best;
}

namespace {

// An end of one line lying on another line of its group (a junction of a road network).
struct Junction {
  std::size_t line, end, on;
};

std::vector<Junction> junctions(const std::vector<DisplacedLine>& lines) {
  std::vector<Segment> segments;
  for (std::size_t k = 0; k < lines.size(); ++k)
    for (std::size_t i = 0; i + 1 < lines[k].line_mm.size(); ++i)
      segments.push_back({lines[k].line_mm[i], lines[k].line_mm[i + 1], k});
  std::vector<Junction> out;
  if (segments.empty()) return out;
  const SegmentIndex index(std::move(segments), 2.0);
  for (std::size_t k = 0; k < lines.size(); ++k) {
    const Polyline& l = lines[k].line_mm;
    if (l.size() < 2) continue;
    for (std::size_t end : {std::size_t{0}, l.size() - 1}) {
      const Point e = l[end];
      index.near(Box::of(e.x, e.y, e.x, e.y).expanded(0.01), [&](const Segment& s) {
        if (s.owner == k || lines[s.owner].group != lines[k].group) return;
        if (distance(e, detail::nearest_on_segment(e, s.a, s.b)) < 0.01)
          out.push_back({k, end, s.owner});
      });
    }
  }
  return out;
}

}  // namespace

std::vector<DisplacementConflict> displace_lines(std::vector<DisplacedLine>& lines,
                                                 const DisplacementParams& params) {
  std::vector<DisplacementConflict> conflicts;
  // Junctions stay joined: an end on another line of its group follows that line if it moved.
  const std::vector<Junction> joined = junctions(lines);
  std::vector<Polyline> before;
  for (const DisplacedLine& l : lines) before.push_back(l.line_mm);
  std::vector<int> priorities;
  for (const DisplacedLine& l : lines) priorities.push_back(l.priority);
  std::sort(priorities.begin(), priorities.end());
  priorities.erase(std::unique(priorities.begin(), priorities.end()), priorities.end());
  double widest = 0;
  for (const DisplacedLine& l : lines) widest = std::max(widest, l.half_width_mm);
  // From the top priority down: a line yields to lines already in their final place.
  for (auto level = priorities.rbegin(); level != priorities.rend(); ++level) {
    std::vector<std::size_t> yielding;
    for (std::size_t i = 0; i < lines.size(); ++i)
      if (lines[i].priority == *level && lines[i].max_shift_mm > 0) yielding.push_back(i);
    if (yielding.empty()) continue;
    // Obstacles per group of this level: lines of a higher priority and another group.
    std::vector<int> groups;
    for (std::size_t i : yielding) groups.push_back(lines[i].group);
    std::sort(groups.begin(), groups.end());
    groups.erase(std::unique(groups.begin(), groups.end()), groups.end());
    for (int group : groups) {
      std::vector<Segment> segments;
      for (std::size_t k = 0; k < lines.size(); ++k) {
        if (lines[k].priority <= *level || lines[k].group == group) continue;
        const Polyline& l = lines[k].line_mm;
        for (std::size_t i = 0; i + 1 < l.size(); ++i) segments.push_back({l[i], l[i + 1], k});
      }
      if (segments.empty()) continue;
      const SegmentIndex index(std::move(segments), 2.0);
      for (std::size_t i : yielding) {
        if (lines[i].group != group) continue;
        const double reach = lines[i].half_width_mm + widest;
        displace_one(i, lines, index, reach, params, conflicts);
      }
    }
  }
  for (const Junction& j : joined) {
    const Polyline& on = lines[j.on].line_mm;
    const bool kept = on.size() == before[j.on].size() &&
                      std::equal(on.begin(), on.end(), before[j.on].begin(),
                                 [](Point a, Point b) { return a.x == b.x && a.y == b.y; });
    if (on.size() < 2 || kept) continue;  // the line it ends on kept its place
    Polyline& l = lines[j.line].line_mm;
    const std::size_t end = j.end == 0 ? 0 : l.size() - 1;
    Point best = l[end];
    double d_best = std::numeric_limits<double>::infinity();
    for (std::size_t i = 0; i + 1 < on.size(); ++i) {
      const Point q = detail::nearest_on_segment(l[end], on[i], on[i + 1]);
      if (distance(q, l[end]) < d_best) {
        d_best = distance(q, l[end]);
        best = q;
      }
    }
    l[end] = best;
  }
  return conflicts;
}

}  // namespace sheetmill::features
