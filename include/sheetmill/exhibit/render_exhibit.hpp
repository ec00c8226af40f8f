#pragma once
// Rendering an exhibit end to end: layout, overlays, furniture and relief, to PDF or PNG from
// the same composition. The output appears whole or not at all (AtomicOutput).
//
// The composition (everything but the relief) is recorded once on a Cairo recording surface in
// page millimetres. PDF: relief placeholders, then the recording, then qpdf streams the relief
// strips in (pdf_relief.hpp). PNG: the page is rasterised in horizontal bands; each band gets
// its relief rows and the replayed recording and goes straight into the PNG. Neither path holds
// a full-page raster.

#include <filesystem>
#include <optional>

#include "sheetmill/exhibit/exhibit_layout.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/furniture.hpp"

namespace sheetmill::exhibit {

enum class ExhibitFormat { pdf, png };

struct ExhibitOptions {
  ExhibitFormat format = ExhibitFormat::pdf;
  double png_dpi = 150;              // PNG resolution (relief is rendered at this dpi too)
  std::optional<double> relief_dpi;  // PDF: overrides the project's relief dpi
  long max_strip_pixels = 4L * 1024 * 1024;
};

struct ExhibitReport {
  std::filesystem::path output;
  ExhibitLayout layout;
  terrain::TintRamp ramp;
  ColourBarReport colour_bar;
  int relief_strips = 0;
  int relief_width_px = 0;
  int relief_height_px = 0;
  int callouts_forced = 0;
  double seconds = 0;
};

// "x.png" -> png, anything else -> pdf.
ExhibitFormat format_for_path(const std::filesystem::path& output);

ExhibitReport render_exhibit(const ExhibitProject& project, const std::filesystem::path& output,
                             const ExhibitOptions& options = {});

}  // namespace sheetmill::exhibit
