#include "sheetmill/draw/area.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "sheetmill/config/bounds.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/draw/line.hpp"
#include "sheetmill/draw/point.hpp"

namespace sheetmill::draw {

namespace {

// Smallest overlap of a pattern symbol's ink box with the area's bounds worth drawing: 10 um,
// far below what a print shows, far above Cairo's 1/256 pt fixed-point step.
constexpr double kMinInkOverlapMm = 0.01;

void rings_path(cairo_t* cr, const std::vector<Polyline>& rings) {
  cairo_new_path(cr);
  for (const Polyline& r : rings) {
    if (r.size() < 3) continue;
    cairo_move_to(cr, r[0].x, r[0].y);
    for (std::size_t i = 1; i < r.size(); ++i) cairo_line_to(cr, r[i].x, r[i].y);
    cairo_close_path(cr);
  }
}

// `box` within the current clip's bounds. Cairo rounds cairo_clip_extents out to whole device
// units (a point on a PDF page), which alone would keep symbols up to 0.35 mm outside; a clip of
// rectangles (a swatch, an upright map frame) is read back exactly instead.
Box clip_box_within(cairo_t* cr, const Box& box) {
  Box clip;
  cairo_rectangle_list_t* list = cairo_copy_clip_rectangle_list(cr);
  if (list->status == CAIRO_STATUS_SUCCESS) {
    for (int i = 0; i < list->num_rectangles; ++i) {
      const cairo_rectangle_t& r = list->rectangles[i];
      clip.add({r.x, r.y});
      clip.add({r.x + r.width, r.y + r.height});
    }
  } else {
    double x0 = 0, y0 = 0, x1 = 0, y1 = 0;
    cairo_clip_extents(cr, &x0, &y0, &x1, &y1);
    clip = Box::of(x0, y0, x1, y1);
  }
  cairo_rectangle_list_destroy(list);
  if (clip.empty()) return clip;
  return Box::of(std::max(clip.min_x, box.min_x), std::max(clip.min_y, box.min_y),
                 std::min(clip.max_x, box.max_x), std::min(clip.max_y, box.max_y));
}

// Whether any of nine points of `ink` (corners, edge middles, centre; page mm) lies in the clip:
// the box test alone keeps symbols in a polygon's notches, outside the ring itself.
bool ink_box_in_clip(cairo_t* cr, const Box& ink) {
  const double xs[3] = {ink.min_x, (ink.min_x + ink.max_x) / 2, ink.max_x};
  const double ys[3] = {ink.min_y, (ink.min_y + ink.max_y) / 2, ink.max_y};
  for (double x : xs)
    for (double y : ys)
      if (cairo_in_clip(cr, x, y)) return true;
  return false;
}

Box bounds_of(const std::vector<Polyline>& rings) {
  Box b;
  for (const auto& r : rings)
    for (const Point& p : r) b.add(p);
  return b;
}

// Refuses, before any is made, more symbols than one feature may generate.
void check_symbol_count(double count, const std::string& what, const std::string& remedy) {
  if (!(count <= static_cast<double>(config::bounds::max_symbols_per_feature))) {
    throw_input_error(SourceLocation{},
                      fmt::format("{} would need {:.3g}, more than the {} one feature may generate "
                                  "on a sheet; {}",
                                  what, count, config::bounds::max_symbols_per_feature, remedy));
  }
}

}  // namespace

std::vector<std::pair<Point, Point>> hatch_segments(const Box& box, const style::Hatch& hatch) {
  std::vector<std::pair<Point, Point>> out;
  if (box.empty() || hatch.spacing_mm <= 0) return out;
  // Direction counter-clockwise from the page x axis as seen on a y-down page.
  const double a = hatch.angle_deg * kDegToRad;
  const Point u{std::cos(a), -std::sin(a)};
  const Point n{std::sin(a), std::cos(a)};  // unit normal to u
  const Point corners[4] = {{box.min_x, box.min_y},
                            {box.max_x, box.min_y},
                            {box.max_x, box.max_y},
                            {box.min_x, box.max_y}};
  double n0 = INFINITY, n1 = -INFINITY, u0 = INFINITY, u1 = -INFINITY;
  for (const Point& c : corners) {
    n0 = std::min(n0, dot(c, n));
    n1 = std::max(n1, dot(c, n));
    u0 = std::min(u0, dot(c, u));
    u1 = std::max(u1, dot(c, u));
  }
  check_symbol_count((n1 - n0) / hatch.spacing_mm, "an area's hatching lines",
                     "widen the hatching spacing");
  for (long k = static_cast<long>(std::floor(n0 / hatch.spacing_mm));
       k <= static_cast<long>(std::ceil(n1 / hatch.spacing_mm)); ++k) {
    const Point base = n * (k * hatch.spacing_mm);
    out.push_back({base + u * u0, base + u * u1});
  }
  return out;
}

std::vector<Point> pattern_points(const Box& box, const style::PatternFill& p) {
  std::vector<Point> out;
  if (box.empty() || p.spacing_x_mm <= 0 || p.spacing_y_mm <= 0) return out;
  check_symbol_count((box.width() / p.spacing_x_mm + 2) * (box.height() / p.spacing_y_mm + 2),
                     "an area's pattern symbols", "widen the pattern spacing");
  const long j0 = static_cast<long>(std::floor(box.min_y / p.spacing_y_mm));
  const long j1 = static_cast<long>(std::ceil(box.max_y / p.spacing_y_mm));
  for (long j = j0; j <= j1; ++j) {
    const double shift = p.staggered && (j % 2 != 0) ? p.spacing_x_mm / 2 : 0;
    const long i0 = static_cast<long>(std::floor((box.min_x - shift) / p.spacing_x_mm));
    const long i1 = static_cast<long>(std::ceil((box.max_x - shift) / p.spacing_x_mm));
    for (long i = i0; i <= i1; ++i) {
      const Point q{i * p.spacing_x_mm + shift, j * p.spacing_y_mm};
      // The rounded-out lattice reaches up to a spacing past the box: keep only points inside.
      if (q.x > box.min_x && q.x < box.max_x && q.y > box.min_y && q.y < box.max_y)
        out.push_back(q);
    }
  }
  return out;
}

void draw_area(cairo_t* cr, const std::vector<Polyline>& rings, const style::AreaSymbol& symbol) {
  if (rings.empty()) return;
  cairo_save(cr);
  cairo_set_fill_rule(cr, CAIRO_FILL_RULE_EVEN_ODD);
  if (symbol.fill) {
    rings_path(cr, rings);
    const Colour& c = *symbol.fill;
    cairo_set_source_rgba(cr, c.r, c.g, c.b, c.a);
    cairo_fill(cr);
  }
  if (!symbol.hatches.empty() || symbol.pattern) {
    cairo_save(cr);
    Box box = bounds_of(rings);
    // Measured before the ring joins the clip: a clip of rectangles reads back exactly.
    const Box c = clip_box_within(cr, box);
    rings_path(cr, rings);
    cairo_clip(cr);
    for (const style::Hatch& h : symbol.hatches) {
      cairo_new_path(cr);
      for (const auto& [a, b] : hatch_segments(box.expanded(h.stroke.width_mm), h)) {
        cairo_move_to(cr, a.x, a.y);
        cairo_line_to(cr, b.x, b.y);
      }
      style::Stroke st = h.stroke;
      apply_stroke(cr, st);
      cairo_stroke(cr);
    }
    if (symbol.pattern) {
      // Only symbols whose ink reaches into the clip (the ring's box within any clip set before) by
      // a visible amount. Cairo 1.16's PDF writer reports a drawing that its clip removes
      // entirely as "nothing to do", and its analysis pass takes that status for an
      // unsupported operation: the whole region around it becomes a fallback image, text and
      // paths included. Measured on the symbol's ink box, not its radius: a thin dash is far
      // shorter across than along.
      const auto& sym = symbol.pattern->symbol;
      const Box ink = point_symbol_ink_box_mm(cr, sym, sym.rotation_deg);
      const double m = kMinInkOverlapMm;
      const Box anchors = Box::of(c.min_x - ink.max_x + m, c.min_y - ink.max_y + m,
                                  c.max_x - ink.min_x - m, c.max_y - ink.min_y - m);
      if (!ink.empty() && !c.empty())
        for (const Point& p : pattern_points(anchors, *symbol.pattern))
          if (ink_box_in_clip(
                  cr, Box::of(p.x + ink.min_x, p.y + ink.min_y, p.x + ink.max_x, p.y + ink.max_y)))
            draw_point_symbol(cr, p, sym, sym.rotation_deg);
    }
    cairo_restore(cr);
  }
  if (symbol.outline && symbol.outline->width_mm > 0) {
    rings_path(cr, rings);
    apply_stroke(cr, *symbol.outline);
    cairo_stroke(cr);
  }
  cairo_new_path(cr);
  cairo_restore(cr);
}

}  // namespace sheetmill::draw
