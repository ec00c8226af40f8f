// Scale bar and north arrow of an exhibit (declared in furniture.hpp). Our own small versions:
// the sheet stage's collar diagrams are designed for field sheets, not for reading across a room.
#include <fmt/format.h>

#include <cmath>

#include "exhibit/text_helpers.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/exhibit/furniture.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"

namespace sheetmill::exhibit {

using detail::Align;
using detail::put_text;

namespace {
constexpr Colour kInk{0.1, 0.1, 0.1, 1};
double mm(double pt) {
  return pt * kMmPerPt;
}

// The largest number of the form {1, 2, 5} x 10^k not above x (Heckbert's 1990 nice numbers,
// rounded down so the bar fits its box).
double nice_floor(double x) {
  const double e = std::pow(10.0, std::floor(std::log10(x)));
  const double f = x / e;
  return (f >= 5 ? 5 : f >= 2 ? 2 : 1) * e;
}

std::string distance_label(double m, bool km) {
  return km ? fmt::format("{:g}", m / 1000) : fmt::format("{:g}", m);
}

std::string grouped(double n) {
  std::string s = fmt::format("{:.0f}", n);
  for (int i = static_cast<int>(s.size()) - 3; i > 0; i -= 3)
    s.insert(static_cast<std::size_t>(i), "\u2009");
  return s;
}
}  // namespace

double draw_scale_bar(cairo_t* cr, const Box& box, const MapFrame& frame, const TypeScale& type,
                      text::FontCache& fonts) {
  double y = box.min_y + mm(type.heading_pt);
  put_text(cr, fonts, detail::bold(), type.heading_pt, "Scale", {box.min_x, y}, Align::left, kInk);
  const double pad = mm(type.body_pt) * 1.2;
  const double target_mm = box.width() - 2 * pad;
  const double length_m = nice_floor(target_mm * frame.metres_per_mm());
  const double bar_mm = length_m * frame.mm_per_metre();
  const bool km = length_m >= 1000;
  const double top = y + mm(type.heading_pt) * 0.7;
  const double h = mm(type.body_pt) * 0.7;
  const double x0 = box.min_x + pad;
  cairo_set_line_width(cr, 0.3 * type.factor);
  for (int i = 0; i < 4; ++i) {
    cairo_rectangle(cr, x0 + bar_mm * i / 4, top, bar_mm / 4, h);
    if (i % 2 == 0) {
      cairo_set_source_rgb(cr, kInk.r, kInk.g, kInk.b);
    } else {
      cairo_set_source_rgb(cr, 1, 1, 1);
    }
    cairo_fill_preserve(cr);
    cairo_set_source_rgb(cr, kInk.r, kInk.g, kInk.b);
    cairo_stroke(cr);
  }
  const double label_base = top + h + mm(type.body_pt) * 1.2;
  for (int i = 0; i <= 4; i += 2) {
    std::string label = distance_label(length_m * i / 4, km);
    if (i == 4) label += km ? " km" : " m";
    put_text(cr, fonts, detail::regular(), type.body_pt, label, {x0 + bar_mm * i / 4, label_base},
             Align::centre, kInk);
  }
  put_text(cr, fonts, detail::regular(), type.fine_pt,
           "1:" + grouped(frame.scale_denominator) + " at printed size",
           {box.min_x, label_base + mm(type.fine_pt) * 1.6}, Align::left, kInk);
  return length_m;
}

double draw_north_arrow(cairo_t* cr, const Box& box, const MapFrame& frame, const TypeScale& type,
                        text::FontCache& fonts) {
  // The arrow points to true north: the sheet CRS's grid convergence at the frame centre
  // (sheet/sheet_crs.hpp, PROJ's meridian convergence: positive when grid north lies east of
  // true north) turned the other way, from grid north (page up) to true north.
  const sheet::SheetCrs crs = sheet::SheetCrs::resolve(frame.crs_wkt);
  const double convergence_deg =
      -crs.factors_at(crs.to_lonlat(frame.ground.centre())).grid_convergence_deg;
  const double size = std::min(box.width() * 0.35, box.height() * 0.3);
  const Point centre{box.max_x - size * 0.6, box.max_y - size * 0.75};
  cairo_save(cr);
  cairo_translate(cr, centre.x, centre.y);
  cairo_rotate(cr, convergence_deg * kDegToRad);
  const double hw = size * 0.22, hh = size * 0.5;
  // Left half filled, right half outlined: reads as an arrow at any size.
  cairo_move_to(cr, 0, -hh);
  cairo_line_to(cr, -hw, hh);
  cairo_line_to(cr, 0, hh * 0.55);
  cairo_close_path(cr);
  cairo_set_source_rgb(cr, kInk.r, kInk.g, kInk.b);
  cairo_fill(cr);
  cairo_move_to(cr, 0, -hh);
  cairo_line_to(cr, hw, hh);
  cairo_line_to(cr, 0, hh * 0.55);
  cairo_close_path(cr);
  cairo_set_line_width(cr, 0.4 * type.factor);
  cairo_set_line_join(cr, CAIRO_LINE_JOIN_MITER);
  cairo_stroke(cr);
  put_text(cr, fonts, detail::bold(), type.heading_pt, "N", {0, -hh - mm(type.heading_pt) * 0.3},
           Align::centre, kInk);
  cairo_restore(cr);
  const std::string caption =
      std::abs(convergence_deg) < 0.05
          ? "True north"
          : fmt::format("True north ({:.1f}\u00b0 {} of grid north)", std::abs(convergence_deg),
                        convergence_deg > 0 ? "east" : "west");
  auto lines = wrap_text(fonts, detail::regular(), type.fine_pt, caption, box.width() - size * 1.3);
  double y = centre.y - mm(type.fine_pt) * 0.6 * static_cast<double>(lines.size());
  for (const std::string& l : lines) {
    put_text(cr, fonts, detail::regular(), type.fine_pt, l, {box.min_x, y}, Align::left, kInk);
    y += mm(type.fine_pt) * 1.25;
  }
  return convergence_deg;
}

}  // namespace sheetmill::exhibit
