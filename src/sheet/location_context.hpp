#pragma once
// The location diagram's context (private to the sheet stage): an area kLocationContext sheet
// sizes across centred on the sheet, the DEM's footprint and graticule lines in it, all in the
// sheet CRS's ground coordinates, and a caption.

#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"

namespace sheetmill::sheet {

// Five sheet sizes across: the sheet stands out as a fifth of the diagram whatever the scale.
inline constexpr double kLocationContext = 5.0;

Box location_area(const Box& sheet_ground);

// The outline of the project's DEM (its raster edges) in the sheet CRS; empty without a DEM or
// without a CRS for it. Throws Error(input) when the DEM cannot be opened.
std::vector<Point> dem_footprint(const project::Project& project);

struct LocationGraticule {
  double step_arcsec = 0;
  std::vector<Polyline> lines;  // ground
};
// Parallels and meridians across `area` at a step about a quarter of `area_mm` on the diagram.
LocationGraticule location_graticule(const SheetCrs& crs, const Box& area, double area_mm);

std::string location_caption(const SheetCrs& crs, const Box& sheet_ground, double step_arcsec,
                             bool has_index, bool has_dem);

}  // namespace sheetmill::sheet
