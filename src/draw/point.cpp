#include "sheetmill/draw/point.hpp"

#include <charconv>
#include <cmath>

#include "sheetmill/draw/line.hpp"
#include "sheetmill/draw/path_data.hpp"

namespace sheetmill::draw {

namespace {

void set_colour(cairo_t* cr, const Colour& c) {
  cairo_set_source_rgba(cr, c.r, c.g, c.b, c.a);
}

// Builds the part's outline as the current path, in the symbol's (scaled) space.
void part_path(cairo_t* cr, const style::ShapePart& part, double s) {
  const double size = part.size_mm * s;
  const Point o = part.offset_mm * s;
  using K = style::ShapePart::Kind;
  switch (part.kind) {
    case K::circle:
      cairo_new_sub_path(cr);
      cairo_arc(cr, o.x, o.y, size / 2, 0, 2 * kPi);
      cairo_close_path(cr);
      break;
    case K::square:
      cairo_rectangle(cr, o.x - size / 2, o.y - size / 2, size, size);
      break;
    case K::triangle: {
      // Equilateral, side `size`: circumradius size / sqrt(3), centroid at the anchor.
      const double r = size / std::sqrt(3.0);
      for (int i = 0; i < 3; ++i) {
        double a = -kPi / 2 + i * 2 * kPi / 3;
        double x = o.x + r * std::cos(a), y = o.y + r * std::sin(a);
        i == 0 ? cairo_move_to(cr, x, y) : cairo_line_to(cr, x, y);
      }
      cairo_close_path(cr);
      break;
    }
    case K::cross:
      cairo_move_to(cr, o.x - size / 2, o.y);
      cairo_line_to(cr, o.x + size / 2, o.y);
      cairo_move_to(cr, o.x, o.y - size / 2);
      cairo_line_to(cr, o.x, o.y + size / 2);
      break;
    case K::path:
      for (const PathCommand& c : parse_path_data(part.path_data)) {
        auto P = [&](int i) { return o + c.p[i] * s; };
        switch (c.kind) {
          case PathCommand::Kind::move:
            cairo_move_to(cr, P(0).x, P(0).y);
            break;
          case PathCommand::Kind::line:
            cairo_line_to(cr, P(0).x, P(0).y);
            break;
          case PathCommand::Kind::curve:
            cairo_curve_to(cr, P(0).x, P(0).y, P(1).x, P(1).y, P(2).x, P(2).y);
            break;
          case PathCommand::Kind::close:
            cairo_close_path(cr);
            break;
        }
      }
      break;
  }
}

double part_extent(const style::ShapePart& part, double s) {
  using K = style::ShapePart::Kind;
  double r = 0;
  switch (part.kind) {
    case K::circle:
    case K::cross:
      r = part.size_mm * s / 2;
      break;
    case K::square:
      r = part.size_mm * s * std::sqrt(0.5);
      break;
    case K::triangle:
      r = part.size_mm * s / std::sqrt(3.0);
      break;
    case K::path:
      for (const PathCommand& c : parse_path_data(part.path_data)) {
        int n = c.kind == PathCommand::Kind::curve ? 3 : c.kind == PathCommand::Kind::close ? 0 : 1;
        for (int i = 0; i < n; ++i) r = std::max(r, length(c.p[i] * s));
      }
      break;
  }
  double ink = part.outline ? part.outline->width_mm / 2
                            : (part.kind == K::cross ? part.size_mm * s / 12 : 0);
  return length(part.offset_mm * s) + r + ink;
}

}  // namespace

void draw_point_symbol(cairo_t* cr, Point at_mm, const style::PointSymbol& symbol,
                       double rotation_deg) {
  cairo_save(cr);
  cairo_translate(cr, at_mm.x, at_mm.y);
  if (rotation_deg != 0) cairo_rotate(cr, rotation_deg * kDegToRad);
  const double s = symbol.scale;
  for (const style::ShapePart& part : symbol.parts) {
    cairo_new_path(cr);
    part_path(cr, part, s);
    const bool is_cross = part.kind == style::ShapePart::Kind::cross;
    if (part.fill && !is_cross) {
      set_colour(cr, *part.fill);
      cairo_set_fill_rule(cr, CAIRO_FILL_RULE_EVEN_ODD);
      if (part.outline)
        cairo_fill_preserve(cr);
      else
        cairo_fill(cr);
    }
    if (part.outline) {
      style::Stroke st = *part.outline;
      st.offset_mm = 0;
      apply_stroke(cr, st);
      cairo_stroke(cr);
    } else if (is_cross && part.fill) {
      set_colour(cr, *part.fill);
      cairo_set_line_width(cr, part.size_mm * s / 6);
      cairo_set_line_cap(cr, CAIRO_LINE_CAP_BUTT);
      cairo_set_dash(cr, nullptr, 0, 0);
      cairo_stroke(cr);
    }
    cairo_new_path(cr);
  }
  cairo_restore(cr);
}

Box point_symbol_ink_box_mm(cairo_t* cr, const style::PointSymbol& symbol, double rotation_deg) {
  Box ink;
  auto add = [&](void (*extents)(cairo_t*, double*, double*, double*, double*)) {
    double x0 = 0, y0 = 0, x1 = 0, y1 = 0;
    extents(cr, &x0, &y0, &x1, &y1);
    if (x1 > x0 || y1 > y0) {
      ink.add({x0, y0});
      ink.add({x1, y1});
    }
  };
  cairo_save(cr);
  for (const style::ShapePart& part : symbol.parts) {
    // The path is built under the rotation and kept in device space past the restore, so the
    // extents come back in the unrotated page frame.
    cairo_new_path(cr);
    cairo_save(cr);
    if (rotation_deg != 0) cairo_rotate(cr, rotation_deg * kDegToRad);
    part_path(cr, part, symbol.scale);
    cairo_restore(cr);
    const bool is_cross = part.kind == style::ShapePart::Kind::cross;
    if (part.fill && !is_cross) {
      cairo_set_fill_rule(cr, CAIRO_FILL_RULE_EVEN_ODD);
      add(cairo_fill_extents);
    }
    if (part.outline) {
      style::Stroke st = *part.outline;
      st.offset_mm = 0;
      apply_stroke(cr, st);
      add(cairo_stroke_extents);
    } else if (is_cross && part.fill) {
      cairo_set_line_width(cr, part.size_mm * symbol.scale / 6);
      cairo_set_line_cap(cr, CAIRO_LINE_CAP_BUTT);
      cairo_set_dash(cr, nullptr, 0, 0);
      add(cairo_stroke_extents);
    }
  }
  cairo_new_path(cr);
  cairo_restore(cr);
  return ink;
}

double point_symbol_radius_mm(const style::PointSymbol& symbol) {
  double r = 0;
  for (const auto& part : symbol.parts) r = std::max(r, part_extent(part, symbol.scale));
  return r;
}

double symbol_rotation_deg(const style::PointSymbol& symbol, const std::string* field_value) {
  if (!symbol.rotation_field.empty() && field_value) {
    double v = 0;
    const char* b = field_value->data();
    const char* e = b + field_value->size();
    while (b < e && *b == ' ') ++b;
    auto [end, ec] = std::from_chars(b, e, v);
    if (ec == std::errc() && std::isfinite(v)) return v;
  }
  return symbol.rotation_deg;
}

}  // namespace sheetmill::draw
