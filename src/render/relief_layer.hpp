#pragma once
// The relief under the map: the frame's window (with a margin, so the frame edge has no seam),
// shaded and tinted at the style's resolution, clipped to the neatline. It is added to the canvas
// as a streamed raster: each strip is read from the DEM, warped, shaded and compressed only
// while the output is written, so the sheet never holds the relief whole (issue 16).

#include <cairo.h>

#include <memory>
#include <optional>
#include <string>

#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/terrain/dem.hpp"
#include "sheetmill/terrain/relief_strips.hpp"

namespace sheetmill::render {

terrain::DemReadOptions dem_options(const project::Project& project);

struct ReliefDrawn {
  bool any_data = true;  // false: the DEM has no data under the frame (a coarse read says)
  // Seconds spent reading, warping and shading strips, which happens while the output is
  // written: the finish's time includes it.
  std::shared_ptr<double> strip_seconds = std::make_shared<double>(0);
};

// Adds hillshade and tint for `frame` to `canvas` as the group `group` with `blend` (an empty
// group when there is nothing to draw). `contour_interval_m` lets stepped tints follow the
// contours. `max_strip_pixels` bounds a strip.
ReliefDrawn draw_relief(pdf::LayeredCanvas& canvas, const std::string& group, pdf::Blend blend,
                        const project::Project& project, const style::Style& style,
                        const MapFrame& frame, double contour_interval_m,
                        long max_strip_pixels = terrain::kDefaultStripPixels);

// Clips `cr` to the neatline of `frame`.
void clip_to_neatline(cairo_t* cr, const MapFrame& frame);

}  // namespace sheetmill::render
