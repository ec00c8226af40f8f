#include "sheetmill/draw/line.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <set>

#include "sheetmill/config/bounds.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/draw/point.hpp"

namespace sheetmill::draw {

namespace {

Polyline distinct_points(const Polyline& line) {
  Polyline out;
  out.reserve(line.size());
  for (const Point& p : line)
    if (out.empty() || distance(out.back(), p) > 1e-9) out.push_back(p);
  return out;
}

Point unit(Point v) {
  double l = length(v);
  return l > 0 ? v * (1 / l) : Point{0, 0};
}

// Left of the direction of travel as seen on a y-down page.
Point left_normal(Point d) {
  return {d.y, -d.x};
}

void path_of(cairo_t* cr, const Polyline& line) {
  if (line.size() < 2) return;
  cairo_move_to(cr, line[0].x, line[0].y);
  for (std::size_t i = 1; i < line.size(); ++i) cairo_line_to(cr, line[i].x, line[i].y);
}

}  // namespace

double polyline_length(const Polyline& line) {
  double s = 0;
  for (std::size_t i = 1; i < line.size(); ++i) s += distance(line[i - 1], line[i]);
  return s;
}

Polyline offset_polyline(const Polyline& input, double offset_mm, style::LineJoin join,
                         double miter_limit) {
  Polyline line = distinct_points(input);
  if (line.size() < 2 || offset_mm == 0) return line;
  const std::size_t n = line.size();
  std::vector<Point> dir(n - 1), nrm(n - 1);
  for (std::size_t i = 0; i + 1 < n; ++i) {
    dir[i] = unit(line[i + 1] - line[i]);
    nrm[i] = left_normal(dir[i]) * offset_mm;
  }
  const double r = std::abs(offset_mm);
  const double side = offset_mm > 0 ? 1 : -1;
  Polyline out;
  out.push_back(line[0] + nrm[0]);
  for (std::size_t i = 1; i + 1 < n; ++i) {
    const Point v = line[i];
    const Point a = v + nrm[i - 1];  // end of the previous offset segment
    const Point b = v + nrm[i];      // start of the next one
    const double c = cross(dir[i - 1], dir[i]);
    if (std::abs(c) < 1e-12) {  // straight on (or exactly back: treat as a bevel)
      out.push_back(a);
      if (dot(dir[i - 1], dir[i]) < 0) out.push_back(b);
      continue;
    }
    // Intersection of the two offset lines: a + s dir[i-1] = b + t dir[i].
    const double s = cross(b - a, dir[i]) / c;
    const Point m = a + dir[i - 1] * s;
    // The next segment turning toward the offset side makes this the inner corner.
    const bool inner = dot(dir[i], left_normal(dir[i - 1])) * side > 0;
    if (inner) {
      out.push_back(m);
      continue;
    }
    switch (join) {
      case style::LineJoin::miter:
        if (distance(m, v) <= miter_limit * r) {
          out.push_back(m);
        } else {
          out.push_back(a);
          out.push_back(b);
        }
        break;
      case style::LineJoin::bevel:
        out.push_back(a);
        out.push_back(b);
        break;
      case style::LineJoin::round: {
        double a0 = std::atan2(a.y - v.y, a.x - v.x);
        double a1 = std::atan2(b.y - v.y, b.x - v.x);
        double sweep = a1 - a0;
        while (sweep > kPi) sweep -= 2 * kPi;
        while (sweep < -kPi) sweep += 2 * kPi;
        // Chord error at most 0.5 % of the radius: steps of about 11 degrees.
        int steps = std::max(1, static_cast<int>(std::ceil(std::abs(sweep) / 0.2)));
        for (int k = 0; k <= steps; ++k) {
          double t = a0 + sweep * k / steps;
          out.push_back({v.x + r * std::cos(t), v.y + r * std::sin(t)});
        }
        break;
      }
    }
  }
  out.push_back(line[n - 1] + nrm[n - 2]);
  return out;
}

void apply_stroke(cairo_t* cr, const style::Stroke& st) {
  cairo_set_source_rgba(cr, st.colour.r, st.colour.g, st.colour.b, st.colour.a);
  cairo_set_line_width(cr, st.width_mm);
  switch (st.cap) {
    case style::LineCap::butt:
      cairo_set_line_cap(cr, CAIRO_LINE_CAP_BUTT);
      break;
    case style::LineCap::round:
      cairo_set_line_cap(cr, CAIRO_LINE_CAP_ROUND);
      break;
    case style::LineCap::square:
      cairo_set_line_cap(cr, CAIRO_LINE_CAP_SQUARE);
      break;
  }
  switch (st.join) {
    case style::LineJoin::miter:
      cairo_set_line_join(cr, CAIRO_LINE_JOIN_MITER);
      cairo_set_miter_limit(cr, 4.0);
      break;
    case style::LineJoin::round:
      cairo_set_line_join(cr, CAIRO_LINE_JOIN_ROUND);
      break;
    case style::LineJoin::bevel:
      cairo_set_line_join(cr, CAIRO_LINE_JOIN_BEVEL);
      break;
  }
  // Cairo rejects a dash of all zeros or negative entries; such a dash means solid.
  bool usable =
      !st.dash_mm.empty() &&
      std::all_of(st.dash_mm.begin(), st.dash_mm.end(), [](double d) { return d >= 0; }) &&
      std::any_of(st.dash_mm.begin(), st.dash_mm.end(), [](double d) { return d > 0; });
  if (usable)
    cairo_set_dash(cr, st.dash_mm.data(), static_cast<int>(st.dash_mm.size()), st.dash_offset_mm);
  else
    cairo_set_dash(cr, nullptr, 0, 0);
}

void stroke_polyline(cairo_t* cr, const Polyline& line, const style::Stroke& stroke) {
  cairo_new_path(cr);
  path_of(cr, stroke.offset_mm != 0 ? offset_polyline(line, stroke.offset_mm, stroke.join) : line);
  apply_stroke(cr, stroke);
  cairo_stroke(cr);
}

std::vector<int> passes_of(const style::LineSymbol& symbol) {
  std::set<int> p;
  for (const auto& s : symbol.strokes) p.insert(s.pass);
  if (p.empty()) p.insert(0);
  return {p.begin(), p.end()};
}

void draw_line_pass(cairo_t* cr, const std::vector<Polyline>& lines,
                    const style::LineSymbol& symbol, int pass) {
  cairo_save(cr);
  for (const style::Stroke& st : symbol.strokes) {
    if (st.pass != pass || st.width_mm <= 0) continue;
    cairo_new_path(cr);
    for (const Polyline& l : lines)
      path_of(cr, st.offset_mm != 0 ? offset_polyline(l, st.offset_mm, st.join) : l);
    apply_stroke(cr, st);
    cairo_stroke(cr);
  }
  if (!symbol.marks.empty() && pass == passes_of(symbol).back())
    for (const Polyline& l : lines)
      for (const style::LineMarks& m : symbol.marks) draw_line_marks(cr, l, m);
  cairo_restore(cr);
}

void draw_line_marks(cairo_t* cr, const Polyline& input, const style::LineMarks& marks) {
  Polyline line = distinct_points(input);
  if (line.size() < 2 || marks.spacing_mm <= 0) return;
  double length_mm = 0;
  for (std::size_t i = 0; i + 1 < line.size(); ++i) length_mm += distance(line[i], line[i + 1]);
  // Refuses, before any is drawn, more marks than one feature may generate.
  if (!(length_mm / marks.spacing_mm <= config::bounds::max_symbols_per_feature)) {
    throw_input_error(
        SourceLocation{},
        fmt::format("a line's marks would number {:.3g}, more than the {} one "
                    "feature may generate on a sheet; widen the marks' spacing",
                    length_mm / marks.spacing_mm, config::bounds::max_symbols_per_feature));
  }
  cairo_save(cr);
  cairo_new_path(cr);
  bool any_tick = false;
  double next = std::max(0.0, marks.start_mm);
  double walked = 0;
  for (std::size_t i = 0; i + 1 < line.size(); ++i) {
    const Point a = line[i], b = line[i + 1];
    const double seg = distance(a, b);
    const Point d = unit(b - a);
    while (next <= walked + seg) {
      const Point p = a + d * (next - walked);
      if (marks.symbol) {
        draw_point_symbol(cr, p, *marks.symbol, std::atan2(d.y, d.x) * kRadToDeg);
      } else {
        const Point nl = left_normal(d) * marks.length_mm;
        const Point from = marks.side == style::LineMarks::Side::right ? p : p + nl;
        const Point to = marks.side == style::LineMarks::Side::left ? p : p - nl;
        cairo_move_to(cr, from.x, from.y);
        cairo_line_to(cr, to.x, to.y);
        any_tick = true;
      }
      next += marks.spacing_mm;
    }
    walked += seg;
  }
  if (any_tick) {
    style::Stroke st = marks.stroke;
    apply_stroke(cr, st);
    cairo_stroke(cr);
  }
  cairo_new_path(cr);
  cairo_restore(cr);
}

}  // namespace sheetmill::draw
