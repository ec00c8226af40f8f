#pragma once
// Area symbols in page millimetres on a cairo_t.
//
// An area is a set of rings (outer rings and holes, any winding) combined by the even-odd rule.
// Order of ink: fill, hatches, point pattern, outline. Hatch lines and pattern points are
// anchored to the page origin (user-space 0,0), not to the area, so adjacent areas with the same
// symbol continue each other's lines and grid without a seam; both are clipped to the area.

#include <cairo.h>

#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::draw {

// Draws one area (a polygon with its holes, or several polygons' rings together).
void draw_area(cairo_t* cr, const std::vector<Polyline>& rings, const style::AreaSymbol& symbol);

// Hatch lines of `hatch` covering `box` (page mm), as segments (pairs of points). Line k lies at
// signed distance k * spacing from the page origin along the hatch's normal.
std::vector<std::pair<Point, Point>> hatch_segments(const Box& box, const style::Hatch& hatch);

// Pattern anchor points strictly inside `box` (page mm): column i, row j at (i sx, j sy), odd
// rows shifted by sx / 2 when staggered.
std::vector<Point> pattern_points(const Box& box, const style::PatternFill& pattern);

}  // namespace sheetmill::draw
