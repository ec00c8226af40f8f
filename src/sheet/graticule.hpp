#pragma once
// Graticule and second grid drawing (private to the sheet stage; see sheet/grid.hpp).

#include <cairo.h>

#include <string>
#include <vector>

#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::sheet {

// The neatline densified so no segment is longer than `max_mm` on paper, in ground metres.
std::vector<Point> dense_neatline(const Layout& layout, double max_mm = 2.0);

bool inside_ring(const std::vector<Point>& ring, Point p);

// Ticks of latitude and longitude along the neatline, crosses inside, DMS labels, and the
// geographic position of each corner just inside the neatline. The boxes (page mm) of the labels
// drawn are appended to `label_boxes` when given.
void draw_graticule(cairo_t* cr, const Layout& layout, const style::Style& style,
                    text::FontCache& fonts, std::vector<Box>* label_boxes = nullptr);

// Lines of a second projected CRS (curves on this sheet), clipped to the neatline, labelled in
// kilometres just inside it, in the style's second-grid stroke colour.
void draw_second_grid(cairo_t* cr, const Layout& layout, const style::Style& style,
                      text::FontCache& fonts, const std::string& crs, double interval_m,
                      std::vector<Box>* label_boxes = nullptr);

}  // namespace sheetmill::sheet
