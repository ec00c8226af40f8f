#pragma once
// Contours for a sheet: from the DEM (at about its own resolution, never finer than the print
// needs) or from a supplied layer; generalised for print, clipped out of lakes, labelled.

#include <vector>

#include "sheetmill/contours/contour_line.hpp"
#include "sheetmill/contours/spot_heights.hpp"
#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/render/sheet_contours.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/terrain/dem.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::render {

// Builds the sheet's contours and their label candidates. `water` are lake/pond polygons in ground
// coordinates that contours must not cross.
SheetContours build_contours(const project::Project& project, const style::Style& style,
                             const MapFrame& frame, const std::vector<std::vector<Polyline>>& water,
                             text::FontCache& fonts);

}  // namespace sheetmill::render
