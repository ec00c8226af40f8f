#include "sheetmill/sheet/north_diagram.hpp"

#include <cmath>

#include "sheet/typeset.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/dms.hpp"

namespace sheetmill::sheet {

namespace {

double open_out(double deg, double min_deg) {
  if (std::abs(deg) >= min_deg) return deg;
  return deg < 0 ? -min_deg : min_deg;
}

void set_ink(cairo_t* cr, const Colour& c) {
  cairo_set_source_rgba(cr, c.r, c.g, c.b, c.a);
}

Point direction(double deg_cw_from_up) {
  double a = deg_cw_from_up * kDegToRad;
  return {std::sin(a), -std::cos(a)};
}

}  // namespace

NorthDrawing north_drawing(const NorthInfo& n, double min_deg) {
  NorthDrawing d;
  // True north lies at -convergence from grid north (convergence is true -> grid, east +).
  double t = -n.grid_convergence_deg;
  d.true_deg = open_out(t, min_deg);
  d.exaggerated = d.true_deg != t;
  if (auto gm = n.grid_magnetic_angle_deg()) {
    double m = open_out(*gm, min_deg);
    // Keep magnetic apart from true north when both lie on the same side.
    if (std::abs(m - d.true_deg) < min_deg) {
      double side = (*gm >= t) ? 1 : -1;
      m = d.true_deg + side * min_deg;
    }
    d.exaggerated = d.exaggerated || std::abs(m - *gm) > 1e-9;
    d.magnetic_deg = m;
  }
  return d;
}

void draw_north_diagram(cairo_t* cr, const Box& box, const NorthInfo& n, const style::Style& style,
                        text::FontCache& fonts) {
  const auto& fur = style.furniture;
  NorthDrawing d = north_drawing(n, 10);
  double len = std::min(box.height() * 0.62, 28.0);
  Point base{box.min_x + 14, box.min_y + 4 + len};
  cairo_save(cr);
  cairo_set_line_width(cr, 0.2);
  set_ink(cr, fur.ink);
  auto line_to = [&](double deg, double l) {
    Point tip = base + direction(deg) * l;
    cairo_move_to(cr, base.x, base.y);
    cairo_line_to(cr, tip.x, tip.y);
    cairo_stroke(cr);
    return tip;
  };
  // Grid north: straight up, labelled GN.
  Point gn = line_to(0, len);
  draw_label(cr, fonts, fur.small, "GN", gn - Point{0, 0.8}, HAlign::centre, VAlign::bottom);
  // Labels beyond the tips, pushed to the outer side of each line.
  auto side_of = [](double deg) { return deg < 0 ? HAlign::right : HAlign::left; };
  // True north: a star (a small five-pointed mark) at the tip.
  Point tn = line_to(d.true_deg, len * 0.92);
  cairo_save(cr);
  for (int i = 0; i < 10; ++i) {
    double r = i % 2 == 0 ? 1.3 : 0.5;
    double a = i * kPi / 5;
    Point p = tn + Point{r * std::sin(a), -r * std::cos(a)};
    if (i == 0)
      cairo_move_to(cr, p.x, p.y);
    else
      cairo_line_to(cr, p.x, p.y);
  }
  cairo_close_path(cr);
  cairo_fill(cr);
  cairo_restore(cr);
  draw_label(cr, fonts, fur.small, "TN", tn + Point{d.true_deg < 0 ? -1.6 : 1.6, 0},
             side_of(d.true_deg), VAlign::middle);
  if (n.declination_deg) {
    set_ink(cr, fur.accent);
    Point mn = line_to(d.magnetic_deg, len * 0.85);
    // Half arrowhead, the usual mark of magnetic north.
    Point back = mn - direction(d.magnetic_deg) * 2.2;
    Point side = back + direction(d.magnetic_deg + 90) * 0.9;
    cairo_move_to(cr, mn.x, mn.y);
    cairo_line_to(cr, side.x, side.y);
    cairo_line_to(cr, back.x, back.y);
    cairo_close_path(cr);
    cairo_fill(cr);
    style::LabelStyle mls = fur.small;
    mls.colour = fur.accent;
    draw_label(cr, fonts, mls, "MN", mn + Point{d.magnetic_deg < 0 ? -1.2 : 1.2, 0},
               side_of(d.magnetic_deg), VAlign::middle);
  }
  cairo_restore(cr);

  // The statements, with true values.
  double x = box.min_x + 30, w = box.max_x - x;
  double y = box.min_y + 1;
  const auto& body = fur.small;
  y = draw_paragraph(cr, fonts, body,
                     "Grid north is " + format_east_west(n.grid_convergence_deg, 2) +
                         " of true north at the sheet centre.",
                     {x, y}, w) +
      1;
  if (n.declination_deg) {
    std::string change;
    if (n.annual_change_deg) {
      change = ", changing " + format_east_west(*n.annual_change_deg, 2) + " a year";
    }
    y = draw_paragraph(cr, fonts, body,
                       "Magnetic declination " + n.date + ": " +
                           format_east_west(*n.declination_deg, 2) + change + " (" + n.source +
                           ").",
                       {x, y}, w) +
        1;
    double gm = *n.grid_magnetic_angle_deg();
    y = draw_paragraph(cr, fonts, body,
                       "Grid-magnetic angle " + n.date + ": " + format_east_west(gm, 2) +
                           " (magnetic north " + (gm >= 0 ? "east" : "west") + " of grid north).",
                       {x, y}, w) +
        1;
  } else {
    y = draw_paragraph(cr, fonts, body, "Magnetic declination not stated.", {x, y}, w) + 1;
  }
  if (d.exaggerated) {
    draw_paragraph(cr, fonts, body, "Diagram angles exaggerated; values true.", {x, y}, w);
  }
}

}  // namespace sheetmill::sheet
