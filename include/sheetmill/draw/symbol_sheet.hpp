#pragma once
// The symbol sheet: every rule of a style drawn as a swatch in a labelled grid, for checking a
// style at print size and as the reference picture the draw tests compare against.
// Page millimetres; the grid starts at the sheet's top-left margin.

#include <cairo.h>

#include <filesystem>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::draw {

struct SymbolSheetLayout {
  int columns = 3;
  double margin_mm = 10;
  double cell_w_mm = 62;  // swatch plus its caption
  double cell_h_mm = 12;
  double swatch_w_mm = 18;
  double swatch_h_mm = 8;
  double caption_pt = 6.5;
};

// Page size needed for `style`'s rules under `layout`.
Point symbol_sheet_size_mm(const style::Style& style, const SymbolSheetLayout& layout = {});

// Draws the sheet: one cell per rule in style order, captioned "layer / rule".
void draw_symbol_sheet(cairo_t* cr, const style::Style& style, text::FontCache& fonts,
                       const SymbolSheetLayout& layout = {});

// Writes the symbol sheet as a one-page PDF (atomically).
void write_symbol_sheet_pdf(const std::filesystem::path& path, const style::Style& style,
                            text::FontCache& fonts, const SymbolSheetLayout& layout = {});

}  // namespace sheetmill::draw
