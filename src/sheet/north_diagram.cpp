#include "sheetmill/sheet/north_diagram.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

#include "sheet/typeset.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/dms.hpp"

namespace sheetmill::sheet {

namespace {

void set_ink(cairo_t* cr, const Colour& c) {
  cairo_set_source_rgba(cr, c.r, c.g, c.b, c.a);
}

Point direction(double deg_cw_from_up) {
  double a = deg_cw_from_up * kDegToRad;
  return {std::sin(a), -std::cos(a)};
}

}  // namespace

NorthDrawing north_drawing(const NorthInfo& n, double min_deg) {
  // Three directions from grid north (drawn straight up, fixed at 0): true north at
  // -convergence and, with a declination, magnetic north at the grid-magnetic angle. Sorted by
  // true angle, each line east of grid north is pushed east until it stands `min_deg` from its
  // western neighbour, and each line west of it pushed west likewise: the drawn order, and so
  // every sign relative to grid and to each other, is the true one. Lines at exactly the same
  // true angle stay together (they do coincide); any true difference is drawn apart.
  struct Dir {
    double true_deg;
    double* drawn;
  };
  NorthDrawing d;
  std::vector<Dir> east, west;
  auto sort_in = [&](double t, double* drawn) {
    *drawn = t;
    if (t > 0) east.push_back({t, drawn});
    if (t < 0) west.push_back({t, drawn});
  };
  sort_in(-n.grid_convergence_deg, &d.true_deg);
  auto gm = n.grid_magnetic_angle_deg();
  if (gm) sort_in(*gm, &d.magnetic_deg);
  std::sort(east.begin(), east.end(), [](auto& a, auto& b) { return a.true_deg < b.true_deg; });
  std::sort(west.begin(), west.end(), [](auto& a, auto& b) { return a.true_deg > b.true_deg; });
  double prev_true = 0, prev_drawn = 0;
  for (auto& e : east) {
    if (e.true_deg > prev_true)
      *e.drawn = std::max(e.true_deg, prev_drawn + min_deg);
    else
      *e.drawn = prev_drawn;
    prev_true = e.true_deg;
    prev_drawn = *e.drawn;
  }
  prev_true = 0, prev_drawn = 0;
  for (auto& w : west) {
    if (w.true_deg < prev_true)
      *w.drawn = std::min(w.true_deg, prev_drawn - min_deg);
    else
      *w.drawn = prev_drawn;
    prev_true = w.true_deg;
    prev_drawn = *w.drawn;
  }
  d.exaggerated = std::abs(d.true_deg + n.grid_convergence_deg) > 1e-9 ||
                  (gm && std::abs(d.magnetic_deg - *gm) > 1e-9);
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
