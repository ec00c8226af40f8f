#pragma once
// The map frame: where a piece of ground in the sheet CRS lands on the page, at an exact scale.
//
// Ground coordinates are easting/northing in metres of the sheet CRS (a projected CRS). Page
// coordinates are millimetres from the page's top-left corner, y down. The mapping is the
// similarity  page = page_origin + (E - ground.min_x, ground.max_y - N) * 1000 / scale, so 1 km at
// 1:25 000 is exactly 40 mm. The neatline is a polygon in ground coordinates: the rectangle
// `ground` for grid-aligned sheets, or a curved outline for sheets bounded by meridians and
// parallels (then `ground` is its bounding box).

#include <cmath>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill {

struct MapFrame {
  std::string crs_wkt;           // sheet CRS, WKT2
  std::string crs_name;          // e.g. "WGS 84 / UTM zone 33N"
  int epsg = 0;                  // 0 when the CRS has no EPSG code
  double scale_denominator = 0;  // N of 1:N
  Box ground;                    // metres, sheet CRS
  Point page_origin_mm;          // page position of (ground.min_x, ground.max_y)
  std::vector<Point> neatline;   // ground polygon, closed implicitly

  double mm_per_metre() const { return 1000.0 / scale_denominator; }
  double metres_per_mm() const { return scale_denominator / 1000.0; }
  double width_mm() const { return ground.width() * mm_per_metre(); }
  double height_mm() const { return ground.height() * mm_per_metre(); }
  Box page_box_mm() const {
    return Box::of(page_origin_mm.x, page_origin_mm.y, page_origin_mm.x + width_mm(),
                   page_origin_mm.y + height_mm());
  }
  Point to_page(Point g) const {
    return {page_origin_mm.x + (g.x - ground.min_x) * mm_per_metre(),
            page_origin_mm.y + (ground.max_y - g.y) * mm_per_metre()};
  }
  Point to_ground(Point p) const {
    return {ground.min_x + (p.x - page_origin_mm.x) * metres_per_mm(),
            ground.max_y - (p.y - page_origin_mm.y) * metres_per_mm()};
  }
};

// A north-up raster grid over (part of) the frame: the sheet's own grid at an output resolution.
// geotransform follows GDAL's convention (origin x, pixel width, 0, origin y, 0, -pixel height).
struct RasterGrid {
  int width = 0;
  int height = 0;
  double geotransform[6] = {0, 1, 0, 0, 0, -1};
  std::string crs_wkt;

  double cell_x() const { return geotransform[1]; }
  double cell_y() const { return -geotransform[5]; }
  Box bounds() const {
    return Box::of(geotransform[0], geotransform[3] + height * geotransform[5],
                   geotransform[0] + width * geotransform[1], geotransform[3]);
  }
};

// The grid covering `frame.ground` at `dpi` on paper, grown by `margin_cells` on every side so
// that kernels reading neighbours have data at the frame edge.
inline RasterGrid grid_for_frame(const MapFrame& frame, double dpi, int margin_cells = 0) {
  RasterGrid g;
  double cell = kMmPerInch / dpi * frame.metres_per_mm();
  g.width = static_cast<int>(std::ceil(frame.ground.width() / cell - 1e-9)) + 2 * margin_cells;
  g.height = static_cast<int>(std::ceil(frame.ground.height() / cell - 1e-9)) + 2 * margin_cells;
  g.geotransform[0] = frame.ground.min_x - margin_cells * cell;
  g.geotransform[1] = cell;
  g.geotransform[3] = frame.ground.max_y + margin_cells * cell;
  g.geotransform[5] = -cell;
  g.crs_wkt = frame.crs_wkt;
  return g;
}

}  // namespace sheetmill
