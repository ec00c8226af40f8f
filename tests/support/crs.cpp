#include "support/crs.hpp"

#include <cpl_conv.h>
#include <ogr_spatialref.h>

namespace sheetmill::test {

std::string wkt_of_epsg(int epsg) {
  OGRSpatialReference s;
  s.importFromEPSG(epsg);
  char* w = nullptr;
  const char* opts[] = {"FORMAT=WKT2", nullptr};
  s.exportToWkt(&w, opts);
  std::string out = w ? w : "";
  CPLFree(w);
  return out;
}

}  // namespace sheetmill::test
