#pragma once
// A rule's symbol drawn small inside a box, for the legend and the symbol sheet. Page mm.
// Areas fill the box inset by 10 % of its height; lines run across the middle with every pass
// in order; points sit at the centre. A rule with several kinds draws area, then line, then
// point. Nothing is drawn outside `box_mm` (the swatch is clipped to it).

#include <cairo.h>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::draw {

void draw_rule_swatch(cairo_t* cr, const style::Rule& rule, const Box& box_mm);

}  // namespace sheetmill::draw
