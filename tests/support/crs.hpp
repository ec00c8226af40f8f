#pragma once
// CRS definitions for test fixtures, from PROJ's EPSG database through GDAL.

#include <string>

namespace sheetmill::test {

// WKT2 of an EPSG CRS (readers apply the traditional GIS axis order themselves).
std::string wkt_of_epsg(int epsg);

}  // namespace sheetmill::test
