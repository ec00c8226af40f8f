#pragma once
// Private to the render stage: what the print finisher needs from the style (its press section).

#include <filesystem>

#include "sheetmill/print/pdfx.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::render {

// The style's intent and compensation with `profile`, and every palette colour that has its
// own CMYK (given as CMYK or as an ink tint), plus each ink's solid.
print::PdfxOptions pdfx_options(const style::Style& style, const std::filesystem::path& profile);

}  // namespace sheetmill::render
