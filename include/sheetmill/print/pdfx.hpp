#pragma once
// PDF/X-4 (ISO 15930-7) from the sheet's screen PDF, after Cairo and the pdf stage finish: every
// colour rewritten as CMYK (content streams of the page, forms and patterns; images; soft masks
// as DeviceGray; shadings), solid black text and strokes overprinting, the output intent with
// the ICC profile embedded, trim and bleed boxes, the PDF/X version key, and XMP metadata that
// repeats the document information. Layers, fonts and the geospatial viewport stay as they are.

#include <filesystem>
#include <string>
#include <vector>

#include "sheetmill/colour/cmyk_mapper.hpp"
#include "sheetmill/colour/colour_engine.hpp"

namespace sheetmill::print {

struct PdfxOptions {
  ColourSetup colour;              // output profile and intent
  std::vector<ExactColour> exact;  // palette colours with their own CMYK
  double bleed_mm = 0;             // the sheet has a white margin: no bleed by default
};

struct PdfxReport {
  long colours_converted = 0;  // colour operators rewritten
  long images_converted = 0;
  long shadings_converted = 0;
  std::string profile;  // the output profile's description
};

// Reads `in` and writes `out` (the caller makes it atomic); `shown_as` names the file in
// messages. Throws Error(input) for a bad profile and Error(internal) for PDF content this
// cannot make CMYK (such as a sampled RGB shading).
PdfxReport write_pdfx(const std::filesystem::path& in, const std::filesystem::path& out,
                      const PdfxOptions& options, const std::string& shown_as);

}  // namespace sheetmill::print
