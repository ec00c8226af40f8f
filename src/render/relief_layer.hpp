#pragma once
// The relief under the map: the DEM read once for the frame's window (with a margin, so the frame
// edge has no seam), shaded and tinted at the style's resolution, painted clipped to the neatline.

#include <cairo.h>

#include <optional>

#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::render {

terrain::DemReadOptions dem_options(const project::Project& project);

// Paints hillshade and tint into `cr` (page mm) for `frame`. Returns false (and warns) when the DEM
// has no data under the frame. `contour_interval_m` lets stepped tints follow the contours.
bool draw_relief(cairo_t* cr, const project::Project& project, const style::Style& style,
                 const MapFrame& frame, double contour_interval_m);

// Clips `cr` to the neatline of `frame`.
void clip_to_neatline(cairo_t* cr, const MapFrame& frame);

}  // namespace sheetmill::render
