#pragma once
// The legend: the style's rules drawn on this sheet, then what the render drew itself (contours
// by kind, spot heights, benchmarks, grid, graticule), each a swatch and a wrapped text.
//
// plan_legend() never drops an entry or a word: texts wrap inside their column; when the entries
// do not fit the height, it tries more columns, then a smaller type size (down to
// kLegendMinScale of the body size). If even that does not fit, the plan says so (fits = false)
// and its height is what it needs; the collar then gives it that room. Page millimetres.

#include <cairo.h>

#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::sheet {

struct LegendEntry {
  std::string text;
  style::Rule swatch;  // drawn by draw::draw_rule_swatch; its own legend text is not used
};

// The rules (empty legend texts and repeats skipped), then the sheet's own furniture entries
// that `shown` marks, except where a rule already carries the same text.
std::vector<LegendEntry> legend_entries(const style::Style& style,
                                        const std::vector<const style::Rule*>& rules,
                                        const SheetInfo& info);

inline constexpr double kLegendMinScale = 0.75;
inline constexpr int kLegendMaxColumns = 3;

struct LegendRow {
  std::size_t entry = 0;  // into the entries planned
  int column = 0;
  double y_mm = 0;  // top of the row, below the heading
  std::vector<std::string> lines;
};

struct LegendPlan {
  double size_pt = 8;
  int columns = 1;
  double column_w_mm = 0;
  double heading_mm = 0;  // the heading's height and the gap under it
  double height_mm = 0;   // heading and rows
  bool fits = true;
  std::vector<LegendRow> rows;
};

LegendPlan plan_legend(text::FontCache& fonts, const style::Style& style,
                       const std::vector<LegendEntry>& entries, double width_mm,
                       double max_height_mm);

// Draws a plan with its top-left corner at `top_left`; returns the box it used.
Box draw_legend_plan(cairo_t* cr, const LegendPlan& plan, const std::vector<LegendEntry>& entries,
                     Point top_left, const style::Style& style, text::FontCache& fonts);

}  // namespace sheetmill::sheet
