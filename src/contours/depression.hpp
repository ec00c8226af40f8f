#pragma once
// Private: telling a depression contour from a hill's by the ground it encloses.

#include "contours/dem_sampling.hpp"
#include "sheetmill/contours/contour_line.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::contours::detail {

enum class Enclosed {
  higher,   // the ground inside rises above the level: a hill or knoll
  lower,    // the ground inside falls below it: a depression
  unknown,  // open line, a loop closed along the DEM's edge or a nodata hole, or no cells inside
};

// Samples the DEM inside a closed line: the cells whose centres lie inside (even-odd), and of
// those the rim cells (a 4-neighbour outside), which lie just inside the line. The inside is
// lower when most rim cells are below the level, higher when most are above. Unknown when any
// cell inside is nodata or on the grid's outer row or column, or when a vertex has no data
// around it (the generator's lines along the edge and along nodata borders end there).
Enclosed enclosed_ground(const ContourLine& line, const terrain::Dem& dem,
                         const DemSampler& sampler);

// For a closed line: orients it from enclosed_ground (a depression runs clockwise so that
// its higher ground stays on the left) and sets `depression`. Other lines are left as they are
// with depression false.
void classify_loop(ContourLine& line, const terrain::Dem& dem, const DemSampler& sampler);

}  // namespace sheetmill::contours::detail
