#include "sheetmill/pdf/registration.hpp"

namespace sheetmill::pdf {

GeoRegistration registration_of(const MapFrame& frame) {
  GeoRegistration geo;
  geo.frame_page_mm = frame.page_box_mm();
  std::vector<Point> ring = frame.neatline;
  if (ring.size() < 3) {
    const Box& g = frame.ground;
    ring = {{g.min_x, g.min_y}, {g.max_x, g.min_y}, {g.max_x, g.max_y}, {g.min_x, g.max_y}};
  }
  for (const Point& p : ring) {
    geo.neatline_ground.push_back(p);
    geo.neatline_page_mm.push_back(frame.to_page(p));
  }
  geo.crs_wkt = frame.crs_wkt;
  geo.epsg = frame.epsg;
  return geo;
}

}  // namespace sheetmill::pdf
