// Text along a line, chord by chord (see layout_on_path in shaping.hpp).
//
// Placing each glyph's centre on the line and turning it to the local segment (the earlier
// method) lets neighbours overlap or drift apart wherever the line wiggles on the scale of a
// letter: two glyphs on a zigzag are closer in a straight line than along it. Here every glyph's
// advance is a chord of a smoothed baseline, so neighbouring glyphs meet exactly at their pen
// positions and the text keeps its shaped spacing.

#include <algorithm>
#include <cmath>
#include <optional>

#include "sheetmill/core/units.hpp"
#include "sheetmill/text/shaping.hpp"

namespace sheetmill::text {

namespace {

// Cumulative arclength of a polyline.
std::vector<double> arclength(const Polyline& p) {
  std::vector<double> s(p.size(), 0);
  for (std::size_t i = 1; i < p.size(); ++i) s[i] = s[i - 1] + distance(p[i - 1], p[i]);
  return s;
}

Point point_at(const Polyline& p, const std::vector<double>& s, double at) {
  auto it = std::upper_bound(s.begin(), s.end(), at);
  std::size_t i = it == s.begin() ? 0 : static_cast<std::size_t>(it - s.begin()) - 1;
  if (i + 1 >= p.size()) return p.back();
  const double seg = s[i + 1] - s[i];
  return seg > 0 ? p[i] + (p[i + 1] - p[i]) * ((at - s[i]) / seg) : p[i];
}

// The path over arclength [from, to] resampled every `step_mm` and smoothed by two passes of a
// moving average of half-width `radius_mm` (close to a Gaussian; the window shrinks at the ends
// so they stay put), then moved `shift_mm` to the left of its direction.
Polyline baseline(const Polyline& path, const std::vector<double>& s, double from, double to,
                  double step_mm, double radius_mm, double shift_mm) {
  const int n = std::max(2, static_cast<int>(std::ceil((to - from) / step_mm)) + 1);
  Polyline pts(static_cast<std::size_t>(n));
  for (int i = 0; i < n; ++i) pts[i] = point_at(path, s, from + (to - from) * i / (n - 1));
  const int r = std::max(0, static_cast<int>(std::round(radius_mm / step_mm)));
  for (int pass = 0; pass < 2 && r > 0; ++pass) {
    Polyline out(pts.size());
    for (int i = 0; i < n; ++i) {
      const int k = std::min({r, i, n - 1 - i});
      Point sum{0, 0};
      for (int j = i - k; j <= i + k; ++j) sum = sum + pts[j];
      out[i] = sum * (1.0 / (2 * k + 1));
    }
    pts = std::move(out);
  }
  if (shift_mm == 0) return pts;
  Polyline shifted(pts.size());
  for (int i = 0; i < n; ++i) {
    const Point d = pts[std::min(i + 1, n - 1)] - pts[std::max(i - 1, 0)];
    const double len = length(d);
    const Point left = len > 0 ? Point{d.y / len, -d.x / len} : Point{0, -1};
    shifted[i] = pts[i] + left * shift_mm;
  }
  return shifted;
}

// The first point on `line`, from segment `seg` on, at straight distance `chord` from `o` (where
// a circle about `o` crosses the line); advances `seg`. False when the line ends first.
bool chord_end(const Polyline& line, std::size_t& seg, Point o, double chord, Point& end) {
  for (; seg + 1 < line.size(); ++seg) {
    const Point a = line[seg], b = line[seg + 1];
    if (distance(o, b) < chord) continue;
    // |a + t (b - a) - o| = chord, the larger root in [0, 1].
    const Point d = b - a, f = a - o;
    const double qa = dot(d, d), qb = 2 * dot(f, d), qc = dot(f, f) - chord * chord;
    if (qa <= 0) continue;
    const double disc = std::max(0.0, qb * qb - 4 * qa * qc);
    const double t = std::clamp((-qb + std::sqrt(disc)) / (2 * qa), 0.0, 1.0);
    end = a + d * t;
    return true;
  }
  return false;
}

// Lays the text on the baseline built from path arclength [from, to]. Empty when a bend between
// neighbouring chords is too sharp; nullopt when the baseline ends before the text does.
std::optional<std::vector<PlacedGlyph>> layout_on_baseline(const ShapedText& text,
                                                           const Polyline& path,
                                                           const std::vector<double>& s,
                                                           double from, double to, double start_mm,
                                                           double max_turn_deg, double shift_mm) {
  const double em_mm = text.size_pt * kMmPerPt;
  const double step_mm = 0.1;
  const Polyline line = baseline(path, s, from, to, step_mm, em_mm / 2, shift_mm);
  // The baseline is resampled evenly in the path's arclength: index i is at from + i * step.
  const double at = (start_mm - from) / (to - from) * static_cast<double>(line.size() - 1);
  std::size_t seg = std::min(static_cast<std::size_t>(at), line.size() - 2);
  Point o = line[seg] + (line[seg + 1] - line[seg]) * (at - static_cast<double>(seg));

  // Chords start at the pen position of every glyph with an advance.
  struct Chord {
    double pen_mm;
    Point origin, dir;
  };
  std::vector<double> pens;
  for (const auto& run : text.runs)
    for (const auto& g : run.glyphs)
      if (g.advance_mm > 0) pens.push_back(g.pen_mm);
  pens.push_back(text.width_mm);
  std::vector<Chord> chords;
  for (std::size_t i = 0; i + 1 < pens.size(); ++i) {
    const double chord = pens[i + 1] - pens[i];
    if (chord <= 0) {
      chords.push_back({pens[i], o, chords.empty() ? Point{1, 0} : chords.back().dir});
      continue;
    }
    Point e;
    if (!chord_end(line, seg, o, chord, e)) return std::nullopt;
    const Point dir = (e - o) * (1.0 / chord);
    if (!chords.empty()) {
      const Point p = chords.back().dir;
      const double turn = std::atan2(cross(p, dir), dot(p, dir));
      if (std::abs(turn) > max_turn_deg * kDegToRad) return std::vector<PlacedGlyph>{};
    }
    chords.push_back({pens[i], o, dir});
    o = e;
  }
  std::vector<PlacedGlyph> out;
  if (chords.empty()) return out;
  std::size_t c = 0;
  for (std::size_t r = 0; r < text.runs.size(); ++r) {
    const auto& run = text.runs[r];
    for (std::size_t g = 0; g < run.glyphs.size(); ++g) {
      const ShapedGlyph& gl = run.glyphs[g];
      // The chord this glyph belongs to: the last one starting at or before its pen (marks
      // without an advance ride on their base's chord).
      while (c + 1 < chords.size() && chords[c + 1].pen_mm <= gl.pen_mm) ++c;
      const Chord& ch = chords[c];
      const Point up{ch.dir.y, -ch.dir.x};
      const Point origin = ch.origin + ch.dir * (gl.x_mm - ch.pen_mm) + up * (-gl.y_mm);
      out.push_back({r, g, origin, std::atan2(ch.dir.y, ch.dir.x)});
    }
  }
  return out;
}

}  // namespace

std::vector<PlacedGlyph> layout_on_path(const ShapedText& text, const Polyline& path,
                                        double start_mm, double max_turn_deg,
                                        double baseline_shift_mm) {
  if (path.size() < 2 || text.empty()) return {};
  const std::vector<double> s = arclength(path);
  const double end_mm = start_mm + text.width_mm;
  if (start_mm < 0 || end_mm > s.back()) return {};
  const double em_mm = text.size_pt * kMmPerPt;
  if (em_mm <= 0) return {};
  // Smoothing over half an em: wiggles shorter than a letter leave the baseline, bends as long
  // as a word stay. The baseline starts an em before the text so its start is not bent by the
  // shrinking window, and runs on far enough for the text: a wiggling line is longer than its
  // smoothed baseline, so a short stretch is tried first, then the rest of the path.
  const double from = std::max(0.0, start_mm - em_mm);
  for (double to : {std::min(s.back(), end_mm + 2 * text.width_mm + em_mm), s.back()}) {
    auto placed =
        layout_on_baseline(text, path, s, from, to, start_mm, max_turn_deg, baseline_shift_mm);
    if (placed || to >= s.back()) return placed.value_or(std::vector<PlacedGlyph>{});
  }
  return {};
}

}  // namespace sheetmill::text
