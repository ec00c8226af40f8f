#pragma once
// The inset location map: a small, lightly shaded overview of the country around the exhibit
// (three times the frame's extent) with the exhibit's frame outlined. Reads the DEM at the
// inset's own coarse resolution only, so it costs little memory whatever the DEM's size.

#include <cairo.h>

#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/type_scale.hpp"
#include "sheetmill/terrain/tint.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::exhibit {

// `terrain_ground`: the DEM's footprint in the sheet CRS (sheet/dem_footprint.hpp), outlined so
// the inset shows the exhibit inside the terrain data's extent; empty: no outline.
void draw_inset_map(cairo_t* cr, const Box& box, const ExhibitProject& project,
                    const MapFrame& frame, const terrain::TintRamp& ramp, const TypeScale& type,
                    text::FontCache& fonts, const std::vector<Point>& terrain_ground = {});

}  // namespace sheetmill::exhibit
