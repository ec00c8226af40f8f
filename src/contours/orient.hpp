#pragma once
// Private: orienting contour lines so that the higher ground lies on their left.

#include "contours/dem_sampling.hpp"
#include "sheetmill/contours/contour_line.hpp"

namespace sheetmill::contours::detail {

// Shoelace area: positive for a counter-clockwise ring (ground coordinates, y up).
double signed_area(const Polyline& ring);

// Reverses the line unless the higher ground lies to its left, by a vote over a few segments
// comparing the surface a third of a cell either side of each segment's midpoint. Sets
// uphill_known to false when the DEM cannot tell (no data, or a tie).
void orient_uphill_left(ContourLine& line, const DemSampler& dem);

}  // namespace sheetmill::contours::detail
