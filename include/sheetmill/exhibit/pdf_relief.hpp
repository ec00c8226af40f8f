#pragma once
// Relief strips in the PDF without holding them all in memory.
//
// Cairo keeps every image painted on a PDF page alive until the page is finished, so a page of
// full-resolution strips would hold the whole raster. Instead each strip is painted as a tiny
// tagged placeholder image (8 x 2 pixels encoding the strip's index) at the strip's place on
// the page; after Cairo has finished, qpdf rewrites the file and swaps every placeholder's
// stream for a provider that renders that strip only while the stream is being written
// (lossless: raw RGB that qpdf deflates; jpeg: GDAL's JPEG driver into /vsimem/, /DCTDecode).
// Peak memory is one strip plus its compressed stream.

#include <cairo.h>

#include <filesystem>

#include "sheetmill/exhibit/relief_strips.hpp"

namespace sheetmill::exhibit {

// Paints one placeholder per strip of `plan` on `cr` (page mm), clipped to `clip_mm`.
void paint_relief_placeholders(cairo_t* cr, const ReliefPlan& plan, const Box& clip_mm);

struct StreamedReliefReport {
  int strips_replaced = 0;
  long strip_renders = 0;  // provider calls (qpdf may ask for a stream more than once)
};

// Reads `cairo_pdf`, replaces its placeholders with the rendered strips and writes `output`.
// Throws Error(internal) when a strip's placeholder is missing from the file.
StreamedReliefReport stream_relief_into_pdf(const std::filesystem::path& cairo_pdf,
                                            const std::filesystem::path& output,
                                            const ReliefPlan& plan, ReliefCompression compression,
                                            int jpeg_quality);

}  // namespace sheetmill::exhibit
