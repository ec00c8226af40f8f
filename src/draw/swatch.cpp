#include "sheetmill/draw/swatch.hpp"

#include "sheetmill/draw/area.hpp"
#include "sheetmill/draw/line.hpp"
#include "sheetmill/draw/point.hpp"

namespace sheetmill::draw {

void draw_rule_swatch(cairo_t* cr, const style::Rule& rule, const Box& box_mm) {
  if (box_mm.empty()) return;
  cairo_save(cr);
  cairo_new_path(cr);
  cairo_rectangle(cr, box_mm.min_x, box_mm.min_y, box_mm.width(), box_mm.height());
  cairo_clip(cr);
  const double inset = 0.1 * box_mm.height();
  if (rule.area) {
    const Box b = box_mm.expanded(-inset);
    Polyline ring{{b.min_x, b.min_y}, {b.max_x, b.min_y}, {b.max_x, b.max_y}, {b.min_x, b.max_y}};
    draw_area(cr, {ring}, *rule.area);
  }
  if (rule.line) {
    const double y = box_mm.centre().y;
    Polyline l{{box_mm.min_x + inset, y}, {box_mm.max_x - inset, y}};
    for (int pass : passes_of(*rule.line)) draw_line_pass(cr, {l}, *rule.line, pass);
  }
  if (rule.point) draw_point_symbol(cr, box_mm.centre(), *rule.point, rule.point->rotation_deg);
  cairo_restore(cr);
}

}  // namespace sheetmill::draw
