#include "support/crs.hpp"

#include <ogr_spatialref.h>

#include "sheetmill/core/gdal_env.hpp"

namespace sheetmill::test {

std::string wkt_of_epsg(int epsg) {
  OGRSpatialReference s;
  s.importFromEPSG(epsg);
  return crs_wkt(s, "WKT2");
}

}  // namespace sheetmill::test
