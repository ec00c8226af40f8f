// The legend: one swatch and one text per rule present on the sheet, drawn by the same code that
// draws the map's symbols (draw::draw_rule_swatch), in columns when one does not suffice.
#include "sheet/typeset.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/draw/swatch.hpp"
#include "sheetmill/sheet/collar.hpp"

namespace sheetmill::sheet {

std::vector<const style::Rule*> draw_legend(cairo_t* cr, const Box& box, const style::Style& style,
                                            const std::vector<const style::Rule*>& rules,
                                            text::FontCache& fonts) {
  std::vector<const style::Rule*> listed;
  for (const auto* r : rules) {
    if (!r || r->legend.empty()) continue;
    bool dup = false;
    for (const auto* l : listed) dup = dup || l == r;
    if (!dup) listed.push_back(r);
  }
  if (listed.empty()) return listed;
  const auto& fur = style.furniture;
  Box head = draw_label(cr, fonts, fur.heading, "Legend", {box.min_x, box.min_y}, HAlign::left,
                        VAlign::top);
  const double swatch_w = 9, swatch_h = 4.5, gap = 2.5;
  const double row = std::max(swatch_h + 1.6, fur.body.size_pt * kMmPerPt * 1.5);
  double top = head.max_y + 2;
  int rows = std::max(1, static_cast<int>((box.max_y - top) / row));
  int columns = static_cast<int>((listed.size() + rows - 1) / rows);
  double col_w = box.width() / std::max(1, columns);
  std::vector<const style::Rule*> drawn;
  for (std::size_t i = 0; i < listed.size(); ++i) {
    int c = static_cast<int>(i) / rows, r = static_cast<int>(i) % rows;
    double x = box.min_x + c * col_w, y = top + r * row;
    if (x + swatch_w > box.max_x + 1e-6) break;  // no room: later rules are not listed
    Box sw = Box::of(x, y, x + swatch_w, y + swatch_h);
    cairo_save(cr);
    draw::draw_rule_swatch(cr, *listed[i], sw);
    cairo_restore(cr);
    // A text longer than its column is cut at the column's edge rather than run into the next.
    cairo_save(cr);
    cairo_rectangle(cr, x, y - row * 0.25, col_w - 1, row * 1.5);
    cairo_clip(cr);
    draw_label(cr, fonts, fur.body, listed[i]->legend, {x + swatch_w + gap, sw.centre().y},
               HAlign::left, VAlign::middle);
    cairo_restore(cr);
    drawn.push_back(listed[i]);
  }
  return drawn;
}

}  // namespace sheetmill::sheet
