#include <cmath>

#include "sheet/graticule.hpp"
#include "sheet/typeset.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/draw/line.hpp"
#include "sheetmill/sheet/grid.hpp"
#include "sheetmill/sheet/nice_numbers.hpp"

namespace sheetmill::sheet {

namespace {

constexpr double kLabelGapMm = 0.8;  // between a tick's end and its label

void neatline_path(cairo_t* cr, const Layout& L) {
  bool first = true;
  for (Point g : L.frame.neatline) {
    Point p = L.frame.to_page(g);
    if (first)
      cairo_move_to(cr, p.x, p.y);
    else
      cairo_line_to(cr, p.x, p.y);
    first = false;
  }
  cairo_close_path(cr);
}

// Outward unit vector of a label side (page, y down).
Point outward(Side s) {
  switch (s) {
    case Side::top:
      return {0, -1};
    case Side::bottom:
      return {0, 1};
    case Side::left:
      return {-1, 0};
    case Side::right:
      return {1, 0};
  }
  return {0, 0};
}

void draw_grid_label(cairo_t* cr, text::FontCache& fonts, const style::GridStyle& gs,
                     const GridLabel& label, double interval_m) {
  bool easting = label.side == Side::top || label.side == Side::bottom;
  GridLabelText t = grid_label_text(label.value_m, interval_m, label.full, easting);
  double small = gs.label.size_pt, large = gs.label_major_size_pt;
  SetLine pre = set_line(fonts, gs.label, {{t.prefix, small}});
  SetLine pri = set_line(fonts, gs.label, {{t.principal, large}});
  SetLine line =
      set_line(fonts, gs.label, {{t.prefix, small}, {t.principal, large}, {t.suffix, small}});
  Point tip = label.line_end_mm + outward(label.side) * (gs.tick_mm + kLabelGapMm);
  // Principal digits centred on the line. Eastings read across the page; northings read up the
  // page on both sides, so full values fit in a narrow side collar.
  double centre_offset = pre.width_mm + pri.width_mm / 2;
  switch (label.side) {
    case Side::top:
      draw_set_line(cr, line, gs.label, {tip.x - centre_offset, tip.y - line.descent_mm});
      break;
    case Side::bottom:
      draw_set_line(cr, line, gs.label, {tip.x - centre_offset, tip.y + line.ascent_mm});
      break;
    case Side::left:
      draw_set_line(cr, line, gs.label, {tip.x - line.descent_mm, tip.y + centre_offset}, -kPi / 2);
      break;
    case Side::right:
      draw_set_line(cr, line, gs.label, {tip.x + line.ascent_mm, tip.y + centre_offset}, -kPi / 2);
      break;
  }
}

}  // namespace

void draw_neatline_and_grid(cairo_t* cr, const Layout& L, const style::Style& style,
                            text::FontCache& fonts, const GridOptions& options) {
  const auto& gs = style.grid;
  const auto& fur = style.furniture;
  double interval =
      options.interval_m > 0 ? options.interval_m : grid_interval_m(L.frame.scale_denominator);
  GridPlan plan = plan_projected_grid(L, interval);

  cairo_save(cr);
  // Grid lines across the map, or ticks inside the neatline only.
  draw::apply_stroke(cr, gs.line);
  for (const auto& line : plan.lines) {
    if (gs.lines_across) {
      cairo_move_to(cr, line.front().x, line.front().y);
      cairo_line_to(cr, line.back().x, line.back().y);
    } else {
      Point d = line.back() - line.front();
      Point u = d * (1.0 / length(d));
      Point a = line.front() + u * gs.tick_mm, b = line.back() - u * gs.tick_mm;
      cairo_move_to(cr, line.front().x, line.front().y);
      cairo_line_to(cr, a.x, a.y);
      cairo_move_to(cr, line.back().x, line.back().y);
      cairo_line_to(cr, b.x, b.y);
    }
  }
  // Ticks in the collar, continuing each line outward to its label.
  for (const auto& label : plan.labels) {
    Point a = label.line_end_mm, b = a + outward(label.side) * gs.tick_mm;
    cairo_move_to(cr, a.x, a.y);
    cairo_line_to(cr, b.x, b.y);
  }
  cairo_stroke(cr);

  if (options.graticule) draw_graticule(cr, L, style, fonts);
  if (options.second_grid_crs) {
    draw_second_grid(cr, L, style, fonts, *options.second_grid_crs, options.second_interval_m);
  }

  draw::apply_stroke(cr, fur.neatline);
  neatline_path(cr, L);
  cairo_stroke(cr);
  draw::apply_stroke(cr, fur.frame_outer);
  const Box& c = L.collar_box_mm;
  cairo_rectangle(cr, c.min_x, c.min_y, c.width(), c.height());
  cairo_stroke(cr);

  for (const auto& label : plan.labels) draw_grid_label(cr, fonts, gs, label, interval);
  cairo_restore(cr);
}

std::vector<Box> grid_labels_in_frame(const Layout& L, const style::Style& style,
                                      text::FontCache& fonts, const GridOptions& options) {
  // The very drawing code sets them, into a recording that is thrown away, so the boxes are
  // the drawn labels' own.
  CairoSurfacePtr scratch(cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, nullptr));
  CairoPtr cr(cairo_create(scratch.get()));
  std::vector<Box> boxes;
  if (options.graticule) draw_graticule(cr.get(), L, style, fonts, &boxes);
  if (options.second_grid_crs) {
    double interval = options.second_interval_m;
    draw_second_grid(cr.get(), L, style, fonts, *options.second_grid_crs, interval, &boxes);
  }
  std::erase_if(boxes, [&](const Box& b) { return !b.intersects(L.frame.page_box_mm()); });
  return boxes;
}

}  // namespace sheetmill::sheet
