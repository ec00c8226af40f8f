#pragma once
// Strip-wise raster output (private to the pdf stage): the page is rasterised a band of rows at a
// time and written to a GeoTIFF through GDAL, so memory stays at one strip whatever the paper.

#include <cairo.h>

#include <array>
#include <filesystem>
#include <functional>
#include <string>

namespace sheetmill::pdf {

// `draw(cr)` paints the whole page in pixel space on a context already translated to the strip;
// it is called once per strip. The geotransform follows GDAL's convention. A failed write
// throws Error(input) naming `shown_as` and the reason; the finished file is opened again with
// GDAL and its last row read before this returns. A positive `dpi` is written as the TIFF
// resolution tags (XResolution, YResolution, ResolutionUnit inch).
void write_geotiff_strips(const std::filesystem::path& path, const std::string& shown_as, int width,
                          int height, const std::array<double, 6>& geotransform,
                          const std::string& crs_wkt, const std::function<void(cairo_t*)>& draw,
                          int strip_rows = 256, double dpi = 0);

}  // namespace sheetmill::pdf
