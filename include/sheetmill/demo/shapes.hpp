#pragma once
// Small plane-geometry helpers for the generator: rings are closed implicitly (the first vertex
// is not repeated); all lengths in ground metres.

#include <functional>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/demo/grid.hpp"

namespace sheetmill::demo {

// Even-odd rule; a point exactly on an edge may fall either way.
bool point_in_ring(const Polyline& ring, Point p);
double distance_to_segment(Point p, Point a, Point b, double* t_out = nullptr);
double distance_to_polyline(const Polyline& line, Point p);
double polyline_length(const Polyline& line);
double ring_area(const Polyline& ring);  // unsigned, square metres

// Calls visit(col, row) for every cell of `spec` whose centre lies inside the ring (even-odd),
// the cell-centre rule GDAL's rasteriser also uses.
void for_cells_in_ring(const GridSpec& spec, const Polyline& ring,
                       const std::function<void(int, int)>& visit);

// One pass of a [1/4, 1/2, 1/4] moving average along the line; end vertices stay put.
Polyline smooth_open(const Polyline& line, int passes = 1);
// Chaikin (1974) corner cutting, `passes` times; end vertices stay put.
Polyline chaikin_open(const Polyline& line, int passes);
// Douglas & Peucker (1973) simplification with tolerance tol_m.
Polyline simplify(const Polyline& line, double tol_m);
// Vertices at most step_m apart (original vertices kept).
Polyline densify(const Polyline& line, double step_m);
// A rectangle of the given size centred on c, rotated by angle_rad (counter-clockwise).
Polyline rotated_rectangle(Point c, double length_m, double width_m, double angle_rad);

}  // namespace sheetmill::demo
