// The adjoining-sheets diagram (this sheet and its eight neighbours) and the location diagram
// (this sheet over its DEM's footprint, among the tile index's sheets, with the graticule).
#include <algorithm>

#include "sheet/typeset.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/collar.hpp"

namespace sheetmill::sheet {

namespace {

void set_ink(cairo_t* cr, const Colour& c, double alpha_scale = 1) {
  cairo_set_source_rgba(cr, c.r, c.g, c.b, c.a * alpha_scale);
}

void adjoining(cairo_t* cr, const Box& box, const style::Style& style, const SheetInfo& info,
               text::FontCache& fonts) {
  const auto& fur = style.furniture;
  Box head = draw_label(cr, fonts, fur.small, "Adjoining sheets", {box.min_x, box.min_y},
                        HAlign::left, VAlign::top);
  double top = head.max_y + 1.5;
  double cell = std::min(box.width() / 3, (box.max_y - top) / 3);
  if (cell < 4) return;
  cairo_save(cr);
  cairo_set_line_width(cr, 0.15);
  for (int r = -1; r <= 1; ++r) {
    for (int c = -1; c <= 1; ++c) {
      double x = box.min_x + (c + 1) * cell, y = top + (r + 1) * cell;
      cairo_rectangle(cr, x, y, cell, cell);
      if (r == 0 && c == 0) {
        set_ink(cr, fur.ink, 0.18);
        cairo_fill_preserve(cr);
      }
      set_ink(cr, fur.ink);
      cairo_stroke(cr);
      std::string id;
      if (r == 0 && c == 0) {
        id = info.sheet_id;
      } else {
        for (const auto& n : info.neighbours) {
          if (n.row == r && n.column == c) id = n.id;
        }
      }
      if (!id.empty()) {
        draw_label(cr, fonts, fur.small, id, {x + cell / 2, y + cell / 2}, HAlign::centre,
                   VAlign::middle);
      }
    }
  }
  cairo_restore(cr);
}

// The sheet (filled) over the DEM's footprint (shaded), among the index sheets, with parallels
// and meridians, over info.location_area and clipped to it.
void location(cairo_t* cr, const Box& box, const Layout& layout, const style::Style& style,
              const SheetInfo& info, text::FontCache& fonts) {
  const auto& fur = style.furniture;
  Box head = draw_label(cr, fonts, fur.small, "Location", {box.min_x, box.min_y}, HAlign::left,
                        VAlign::top);
  double caption_pt = fur.small.size_pt * 0.85;
  double top = head.max_y + 1.5;
  // The caption wraps under the diagram; measure it first so the square fits above it.
  auto lines = wrap_words(fonts, fur.small, info.location_caption, box.width(), caption_pt);
  double caption_mm = static_cast<double>(lines.size()) * caption_pt * kMmPerPt * 1.25;
  double side = std::min(box.width(), box.max_y - top - caption_mm - 1.5);
  const Box& g = info.location_area;
  if (side < 5 || g.empty()) return;
  Box area = Box::of(box.min_x, top, box.min_x + side, top + side);
  double s = side / std::max(g.width(), g.height());
  Point c = area.centre(), gc = g.centre();
  auto map = [&](Point p) { return Point{c.x + (p.x - gc.x) * s, c.y - (p.y - gc.y) * s}; };
  auto path = [&](const std::vector<Point>& ring, bool close) {
    for (std::size_t i = 0; i < ring.size(); ++i) {
      Point p = map(ring[i]);
      if (i == 0)
        cairo_move_to(cr, p.x, p.y);
      else
        cairo_line_to(cr, p.x, p.y);
    }
    if (close) cairo_close_path(cr);
  };
  cairo_save(cr);
  cairo_rectangle(cr, area.min_x, area.min_y, area.width(), area.height());
  cairo_clip(cr);
  if (info.dem_footprint.size() >= 3) {
    path(info.dem_footprint, true);
    set_ink(cr, fur.ink, 0.12);
    cairo_fill(cr);
  }
  cairo_set_line_width(cr, 0.08);
  set_ink(cr, fur.ink, 0.45);
  for (const auto& l : info.location_graticule) path(l, false);
  cairo_stroke(cr);
  cairo_set_line_width(cr, 0.12);
  set_ink(cr, fur.ink);
  for (const auto& o : info.index_outlines) path(o, true);
  cairo_stroke(cr);
  path(layout.frame.neatline, true);
  set_ink(cr, fur.accent);
  cairo_fill(cr);
  cairo_restore(cr);
  cairo_save(cr);
  cairo_set_line_width(cr, 0.15);
  set_ink(cr, fur.ink);
  cairo_rectangle(cr, area.min_x, area.min_y, area.width(), area.height());
  cairo_stroke(cr);
  cairo_restore(cr);
  double y = area.max_y + 1.5;
  draw_paragraph(cr, fonts, fur.small, info.location_caption, {box.min_x, y}, box.width(),
                 caption_pt);
}

}  // namespace

void draw_diagrams(cairo_t* cr, const Box& box, const Layout& layout, const style::Style& style,
                   const SheetInfo& info, text::FontCache& fonts) {
  double half = box.width() / 2;
  Box left = Box::of(box.min_x, box.min_y, box.min_x + half - 2, box.max_y);
  Box right = Box::of(box.min_x + half + 2, box.min_y, box.max_x, box.max_y);
  if (!info.neighbours.empty() || !info.sheet_id.empty()) {
    adjoining(cr, left, style, info, fonts);
    location(cr, right, layout, style, info, fonts);
  } else {
    location(cr, box, layout, style, info, fonts);
  }
}

}  // namespace sheetmill::sheet
