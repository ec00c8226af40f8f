#pragma once
// The one neatline-to-page registration: where a map frame lies on the page and on the ground,
// for the PDF's geospatial viewport and the GeoTIFF's transform. Used by every template.

#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"

namespace sheetmill::pdf {

// The frame's neatline (its ground box when it has no neatline) on the page and on the ground,
// with the frame's CRS.
GeoRegistration registration_of(const MapFrame& frame);

}  // namespace sheetmill::pdf
