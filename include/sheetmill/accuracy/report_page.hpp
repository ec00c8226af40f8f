#pragma once
// The one-page report of an accuracy test (A4 landscape): a map of the residuals over the DEM's
// hillshade (terrain::hillshade, Horn 1981), a histogram of the residuals with the NSSDA 95 %
// band, the figures, and the product caution. PDF or PNG by the output's extension; the page
// appears whole or not at all.
//
// prepare_report_map() reads the DEM under the points (a window of at most kReportMapCells
// cells a side, so memory is bounded by the page, not the DEM); draw_report_page() draws from
// plain values only.

#include <cairo.h>

#include <cstdint>
#include <filesystem>
#include <vector>

#include "sheetmill/accuracy/assess.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::accuracy {

inline constexpr int kReportMapCells = 700;

struct ReportMap {
  RasterGrid grid;                  // the window shown, in the DEM's CRS
  std::vector<std::uint8_t> shade;  // hillshade bytes, grid.width * grid.height; 0 = no data
};

// Page size in millimetres.
inline constexpr double kReportWidthMm = 297, kReportHeightMm = 210;

ReportMap prepare_report_map(const Assessment& a, const terrain::DemReadOptions& dem_options);

// Draws the page into `cr`, whose user space is page millimetres.
void draw_report_page(cairo_t* cr, const Assessment& a, const ReportMap& map,
                      text::FontCache& fonts);

// PDF (vector, text searchable) or PNG (150 dpi) by the extension of `out` (.pdf or .png);
// throws Error(input) for another.
void write_report(const Assessment& a, const std::filesystem::path& out,
                  const terrain::DemReadOptions& dem_options);

}  // namespace sheetmill::accuracy
