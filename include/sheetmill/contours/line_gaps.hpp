#pragma once
// Cutting lines where labels sit: the parts of a polyline inside any of a set of convex quads
// (label footprints, page millimetres) are removed, so the line breaks behind the figures.

#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/text/collision_index.hpp"

namespace sheetmill::contours {

// The pieces of `line` outside every quad, in order along the line; a closed line is treated
// as the ring through its points (the seam is rejoined when it falls outside every quad).
// Pieces shorter than `min_piece` are dropped. Quads must be convex (any winding).
std::vector<Polyline> cut_out_quads(const Polyline& line, bool closed,
                                    const std::vector<text::Quad>& quads, double min_piece = 0);

}  // namespace sheetmill::contours
