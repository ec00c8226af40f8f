#pragma once
// Line generalisation: Douglas and Peucker (1973), "Algorithms for the reduction of the number
// of points required to represent a digitized line or its caricature", The Canadian
// Cartographer 10(2). Keeps the end points; every removed point lies within `tolerance` of the
// result. Units are whatever the input is in (page millimetres in this project).

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::features {

// Simplifies in place. Lines of fewer than three points are left alone.
void simplify_polyline(Polyline& line, double tolerance);

// Simplifies a closed ring (first point not repeated) in place, keeping at least three points.
void simplify_ring(Polyline& ring, double tolerance);

}  // namespace sheetmill::features
