#pragma once
// Preparing contour lines for print at the sheet's scale.
//
// 1. Closed loops shorter than min_loop_mm on paper are dropped.
// 2. Smoothing: a Gaussian moving average along the line's length (sigma = half the smoothing
//    tolerance on paper, at least half a DEM cell, so the kinks of the cell grid go), end points
//    of open lines fixed.
// 3. Generalisation: Douglas and Peucker (1973) at a fifth of the smoothing tolerance on paper
//    (0.05 mm by default: finer than print shows, and it removes the vertex bloat of the grid).
// Both steps are constrained: no vertex moves by more than 0.45 of the clearance from its
// segments to any other line, so two lines that did not touch cannot touch afterwards. A final
// segment-intersection check restores the raw geometry of any line still involved in a crossing
// (raw contours of one surface never cross), so the result is guaranteed free of crossings.

#include <vector>

#include "sheetmill/contours/contour_line.hpp"

namespace sheetmill::contours {

struct PrepareStats {
  long lines_in = 0;
  long loops_dropped = 0;
  long lines_restored = 0;  // reverted to raw geometry by the final crossing check
  long vertices_in = 0;
  long vertices_out = 0;
  double length_in_m = 0;  // of the lines kept
  double length_out_m = 0;
};

// In place. `cell_m` is the DEM cell (0 for supplied lines without a DEM).
PrepareStats prepare_for_print(std::vector<ContourLine>& lines, const ContourParams& params,
                               double cell_m);

// Pairs of distinct lines (i < j) whose segments intersect or touch, and lines that cross
// themselves (i == j, between non-adjacent segments). Uses a uniform grid; exact tests.
struct Crossing {
  std::size_t a = 0, b = 0;
};
std::vector<Crossing> find_crossings(const std::vector<ContourLine>& lines);

// Length of a line in its own units, including the closing segment of a closed line.
double line_length(const ContourLine& line);

}  // namespace sheetmill::contours
