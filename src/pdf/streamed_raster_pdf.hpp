#pragma once
// Private to the pdf stage: StreamedRaster in the PDF (tagged placeholders, swapped in qpdf) and
// in the raster exports (painted a band at a time).

#include <cairo.h>
#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif
#include <qpdf/QPDF.hh>

#include "sheetmill/pdf/streamed_raster.hpp"

namespace sheetmill::pdf {

// Paints one placeholder per strip of `raster` on `cr` (page mm) at the strip's place, clipped,
// tagged first_tag, first_tag + 1, ... Returns the next free tag.
int paint_placeholders(cairo_t* cr, const StreamedRaster& raster, int first_tag);

// Swaps every placeholder stream in `pdf` for its strip; `rasters` in the order their tags were
// given (tags counted from 0). Throws Error(internal) when a placeholder is missing.
void substitute_placeholders(QPDF& pdf, const std::vector<const StreamedRaster*>& rasters);

// Paints the strips of `raster` that meet `cr`'s clip, in page mm, with the context's operator;
// each strip rendered with a few rows of overlap so smoothing across strip joins reads true
// neighbours.
void paint_streamed(cairo_t* cr, const StreamedRaster& raster);

}  // namespace sheetmill::pdf
