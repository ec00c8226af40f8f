#pragma once
// How much of the map frame a DEM read for the sheet covers, reported once per sheet.

#include <string>

#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::render {

// The share (0-1) of the cells of `dem` whose centres lie inside the map frame's ground box that
// hold data; the margin the sheet's grids reach past the frame does not count. 1 when no cell
// centre lies in the frame.
double frame_coverage(const terrain::Dem& dem, const MapFrame& frame);

// One log warning when `share` < 1 (none when the frame is covered), naming `dem_path`.
void warn_frame_coverage(const std::string& dem_path, double share);

}  // namespace sheetmill::render
