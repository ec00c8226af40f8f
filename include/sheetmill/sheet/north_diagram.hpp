#pragma once
// The north diagram: true north, grid north and magnetic north at the sheet centre.
//
// Grid north is drawn straight up the page (the sheet's grid is the page's). Small angles are
// exaggerated in the drawing so the three lines stay apart, but every label states the true
// value, and the diagram says so. The text states the grid-magnetic angle and its date.

#include <cairo.h>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::sheet {

// Drawn directions, degrees clockwise from page up, for true and magnetic north.
struct NorthDrawing {
  double true_deg = 0;
  double magnetic_deg = 0;
  bool exaggerated = false;
};
// Lines closer than `min_deg` to grid north or to each other are opened out to it, keeping
// their order and sides; lines at the same true angle stay together.
NorthDrawing north_drawing(const NorthInfo& north, double min_deg = 7);

void draw_north_diagram(cairo_t* cr, const Box& box, const NorthInfo& north,
                        const style::Style& style, text::FontCache& fonts);

}  // namespace sheetmill::sheet
