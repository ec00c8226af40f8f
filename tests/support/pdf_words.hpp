#pragma once
// Words of a PDF as poppler's `pdftotext -bbox` reports them: the outside reader the tests use
// to check what a sheet's text says and where it stands.

#include <filesystem>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::test {

struct PdfWord {
  std::string text;
  Box box_pt;  // PDF points, y down from the page's top-left corner
  Box box_mm() const;
};

// Every word on every page, in poppler's reading order. Throws when pdftotext fails.
std::vector<PdfWord> pdf_words(const std::filesystem::path& pdf);

}  // namespace sheetmill::test
