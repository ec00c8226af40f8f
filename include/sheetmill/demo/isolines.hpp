#pragma once
// Region outlines at sub-cell precision: marching squares (Lorensen & Cline 1987, in its 2-D
// form) over a field sampled at cell centres, with the crossing on each cell edge placed by
// linear interpolation, so outlines run at any angle instead of along cell edges.
//
// The region is {field > 0}. Outside the grid the field is taken as the negated value of the
// nearest inside cell (or 0), which puts the outline exactly on the grid's outer edge where a
// region reaches it. Rings are closed implicitly; outer rings run counter-clockwise (ground
// frame, y north), holes clockwise. Saddle cells are decided by the mean of their corners.

#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/demo/grid.hpp"

namespace sheetmill::demo {

std::vector<Polyline> region_rings(const FloatGrid& field);

// Chaikin (1974) corner cutting on a closed ring, `passes` times; vertices on the grid box's
// edge stay on it.
Polyline chaikin_closed(const Polyline& ring, int passes);

// Signed area (shoelace): positive for counter-clockwise rings.
double signed_area(const Polyline& ring);

// Groups rings into polygons: each counter-clockwise ring of at least min_area_m2 with the
// clockwise rings it immediately contains (holes under min_hole_m2 are dropped).
std::vector<std::vector<Polyline>> assemble_polygons(std::vector<Polyline> rings,
                                                     double min_area_m2, double min_hole_m2);

}  // namespace sheetmill::demo
