#pragma once
// A raster drawn by strips only while the output is written, never held whole (issue 16).
//
// Cairo keeps every image painted on a PDF page alive until the page is finished, so a raster
// painted through Cairo is held whole. A StreamedRaster is instead a description (size, place on
// the page, clip, and a function that renders any band of rows): the PDF finish paints one tiny
// tagged placeholder image per strip through Cairo and, in the qpdf pass, swaps each
// placeholder's stream for a provider that renders, compresses (Flate on both cores, or JPEG) and
// writes that strip while the file is written. The raster exports paint the strips a band at a
// time. Peak memory is one strip and its compressed stream.

#include <cstdint>
#include <functional>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::pdf {

enum class RasterCompression { flate, jpeg };

struct StreamedRaster {
  int width = 0, height = 0;  // pixels
  int channels = 1;           // 1 = DeviceGray, 3 = DeviceRGB; 8 bits each
  struct Strip {
    int row0 = 0, rows = 0;
  };
  std::vector<Strip> strips;        // whole rows, top to bottom, covering [0, height)
  Point origin_mm;                  // page position of the raster's top-left corner
  double px_mm = 0;                 // size of a pixel on the page (square pixels)
  std::vector<Point> clip_page_mm;  // the raster is shown inside this ring only (empty: all)
  // Rows [row0, row0 + rows) within [0, height): rows * width * channels bytes, row-major. Called
  // from the writing thread, one call at a time.
  std::function<std::vector<std::uint8_t>(int row0, int rows)> render;
  RasterCompression compression = RasterCompression::flate;
  int jpeg_quality = 85;  // 1..100, for RasterCompression::jpeg
};

// Deflates `data` (rows of `row_bytes`) as one zlib stream with the PNG "Up" predictor in front
// of every row (ISO 32000-1 section 7.4.4.4, /Predictor >= 10; RFC 2083 filter type 2), the
// rows cut into one independent deflate run per core and joined with full flushes (RFC 1951
// section 3.2.3 blocks are byte-aligned after a flush). Inflating the result and undoing the
// predictor gives back `data` exactly.
std::vector<std::uint8_t> deflate_rows_parallel(const std::uint8_t* data, std::size_t rows,
                                                std::size_t row_bytes, int level = 4);

}  // namespace sheetmill::pdf
