// The adjoining-sheets diagram (this sheet and its eight neighbours) and the location diagram
// (this sheet among the tile index's sheets, or within its one-degree cell).
#include "sheet/typeset.hpp"
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

void location(cairo_t* cr, const Box& box, const Layout& layout, const style::Style& style,
              const SheetInfo& info, text::FontCache& fonts) {
  const auto& fur = style.furniture;
  Box head = draw_label(cr, fonts, fur.small, "Location", {box.min_x, box.min_y}, HAlign::left,
                        VAlign::top);
  double top = head.max_y + 1.5;
  Box area = Box::of(box.min_x, top, box.max_x, box.max_y - 4);
  Box all;
  for (const auto& o : info.index_outlines) {
    for (Point p : o) all.add(p);
  }
  for (Point p : layout.frame.neatline) all.add(p);
  if (all.empty() || area.width() < 5 || area.height() < 5) return;
  double s = std::min(area.width() / all.width(), area.height() / all.height()) * 0.95;
  Point c = area.centre(), gc = all.centre();
  auto map = [&](Point g) { return Point{c.x + (g.x - gc.x) * s, c.y - (g.y - gc.y) * s}; };
  auto path = [&](const std::vector<Point>& ring) {
    for (std::size_t i = 0; i < ring.size(); ++i) {
      Point p = map(ring[i]);
      if (i == 0)
        cairo_move_to(cr, p.x, p.y);
      else
        cairo_line_to(cr, p.x, p.y);
    }
    cairo_close_path(cr);
  };
  cairo_save(cr);
  cairo_set_line_width(cr, 0.12);
  set_ink(cr, fur.ink);
  for (const auto& o : info.index_outlines) path(o);
  cairo_stroke(cr);
  path(layout.frame.neatline);
  set_ink(cr, fur.accent);
  cairo_fill(cr);
  cairo_restore(cr);
  if (!info.location_caption.empty()) {
    draw_label(cr, fonts, fur.small, info.location_caption, {box.min_x, box.max_y}, HAlign::left,
               VAlign::bottom, fur.small.size_pt * 0.85);
  }
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
