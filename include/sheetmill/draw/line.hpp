#pragma once
// Line symbols in page millimetres on a cairo_t (user space mm, y down).
//
// A Stroke's width, dash and offset are millimetres on paper. A parallel offset is computed as a
// real offset polyline (each segment moved along its normal, joined at vertices by the stroke's
// join: miter within a limit, else bevel; round arcs; bevel), never by translating the whole
// line. "Left" is left of the direction of travel as seen on the page. Dashes restart at the
// start of every polyline.

#include <cairo.h>

#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::draw {

// The line offset by `offset_mm` (+ left). Consecutive duplicate points are dropped first;
// a line of fewer than two distinct points is returned as is. Inner corners tighter than the
// offset may fold back (a small loop), as a pen held at that distance would.
Polyline offset_polyline(const Polyline& line, double offset_mm, style::LineJoin join,
                         double miter_limit = 4.0);

// Sets colour, width, cap, join and dash of `stroke` on `cr`.
void apply_stroke(cairo_t* cr, const style::Stroke& stroke);

// Strokes one polyline with one stroke (offset applied).
void stroke_polyline(cairo_t* cr, const Polyline& line, const style::Stroke& stroke);

// The distinct passes used by the symbol's strokes, ascending.
std::vector<int> passes_of(const style::LineSymbol& symbol);

// Draws the strokes of `symbol` belonging to `pass` for every line, stroke by stroke (all lines
// of one stroke in one path, so dashes and overlaps merge). Marks are drawn with the highest
// pass of the symbol (or pass 0 when it has no strokes).
void draw_line_pass(cairo_t* cr, const std::vector<Polyline>& lines,
                    const style::LineSymbol& symbol, int pass);

// Ticks or symbols at start_mm + k * spacing_mm along the line; a symbol's x axis follows the
// line's direction.
void draw_line_marks(cairo_t* cr, const Polyline& line, const style::LineMarks& marks);

// Total length of a polyline.
double polyline_length(const Polyline& line);

}  // namespace sheetmill::draw
