#pragma once
// Clipping of plain geometry to an axis-aligned box (the map frame plus a margin).
//
// Lines: Liang and Barsky (1984) parametric clipping per segment; a line leaving and re-entering
// the box becomes several pieces. Rings: Sutherland and Hodgman (1974) against the four edges;
// a concave ring crossing the box may come out with zero-width bridges along the box edge, which
// fill correctly (even-odd or nonzero) and lie on the margin, outside the visible frame.

#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/features/feature.hpp"

namespace sheetmill::features {

// Appends the pieces of `line` inside `box` to `out` (pieces of fewer than two points dropped).
void clip_polyline(const Polyline& line, const Box& box, std::vector<Polyline>& out);

// The part of a ring inside `box`; empty when fewer than three points remain.
Polyline clip_ring(const Polyline& ring, const Box& box);

// Clips outer ring and holes; returns false when nothing of the outer ring remains.
bool clip_polygon(Polygon& polygon, const Box& box);

}  // namespace sheetmill::features
