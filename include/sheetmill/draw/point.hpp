#pragma once
// Point symbols built from primitives, drawn in page millimetres on a cairo_t.
//
// Parts are drawn in order around the anchor: circle (size = diameter), square (side),
// triangle (equilateral, side = size, apex up, centred on its centroid), cross (a plus sign with
// arms of total length size), path (path_data in mm). PointSymbol::scale multiplies the
// geometry (sizes, offsets, path coordinates), not ink widths. Rotation is in degrees clockwise
// on the page, about the anchor. A cross with no outline is stroked in its fill colour at a
// sixth of its size.

#include <cairo.h>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::draw {

void draw_point_symbol(cairo_t* cr, Point at_mm, const style::PointSymbol& symbol,
                       double rotation_deg = 0);

// Radius (mm) of a circle about the anchor containing the whole symbol at any rotation,
// ink included. 0 for a symbol with no parts.
double point_symbol_radius_mm(const style::PointSymbol& symbol);

// The page box (mm, relative to the anchor) of the symbol's ink at `rotation_deg`, as Cairo
// measures it (fill and stroke extents, caps and joins included). Uses `cr` only to measure.
Box point_symbol_ink_box_mm(cairo_t* cr, const style::PointSymbol& symbol, double rotation_deg);

// The rotation to use for a feature: the attribute value (degrees clockwise from sheet north)
// when the symbol names a field and the value parses, else the symbol's fixed rotation.
double symbol_rotation_deg(const style::PointSymbol& symbol, const std::string* field_value);

}  // namespace sheetmill::draw
