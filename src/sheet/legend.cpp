// The legend's layout: swatch and wrapped text per entry, filled column by column. A plan is
// tried at the body size in one column, then in more columns, then at smaller sizes; the first
// that fits the height wins. No entry and no word is ever left out.
#include "sheetmill/sheet/legend.hpp"

#include <algorithm>

#include "sheet/typeset.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/draw/swatch.hpp"

namespace sheetmill::sheet {

namespace {

constexpr double kSwatchWMm = 9, kSwatchHMm = 4.5, kSwatchGapMm = 2.5, kColumnGapMm = 3;

double leading_mm(double size_pt) {
  return size_pt * kMmPerPt * 1.2;
}
double row_gap_mm(double size_pt) {
  return std::max(1.6, size_pt * kMmPerPt * 0.5);
}

double heading_height_mm(const style::Style& style) {
  return style.furniture.heading.size_pt * kMmPerPt + 2;
}

LegendPlan try_plan(text::FontCache& fonts, const style::Style& style,
                    const std::vector<LegendEntry>& entries, double width_mm, double max_h_mm,
                    double size_pt, int columns) {
  LegendPlan p;
  p.size_pt = size_pt;
  p.columns = columns;
  p.column_w_mm = (width_mm - kColumnGapMm * (columns - 1)) / columns;
  p.heading_mm = heading_height_mm(style);
  double text_w = p.column_w_mm - kSwatchWMm - kSwatchGapMm;
  std::vector<LegendRow> rows;
  std::vector<double> heights;
  for (std::size_t i = 0; i < entries.size(); ++i) {
    LegendRow r;
    r.entry = i;
    r.lines = wrap_words(fonts, style.furniture.body, entries[i].text, text_w, size_pt);
    double h = std::max(kSwatchHMm, leading_mm(size_pt) * static_cast<double>(r.lines.size()));
    heights.push_back(h + row_gap_mm(size_pt));
    rows.push_back(std::move(r));
  }
  // Columns in reading order, each as full as the height allows; the last takes the rest.
  double room = max_h_mm - p.heading_mm;
  int column = 0;
  double y = 0, tallest = 0;
  for (std::size_t i = 0; i < rows.size(); ++i) {
    if (y > 0 && y + heights[i] > room + 1e-9 && column + 1 < columns) {
      ++column;
      y = 0;
    }
    rows[i].column = column;
    rows[i].y_mm = y;
    y += heights[i];
    tallest = std::max(tallest, y);
  }
  p.rows = std::move(rows);
  p.height_mm = p.heading_mm + tallest;
  p.fits = p.height_mm <= max_h_mm + 1e-9;
  // Every word on a line no wider than its column (a single over-long word cannot be).
  for (const auto& r : p.rows) {
    for (const auto& line : r.lines) {
      auto s = text::shape(fonts, style.furniture.body.font, size_pt, line);
      if (s.width_mm > text_w + 1e-6 && line.find(' ') != std::string::npos) p.fits = false;
    }
  }
  return p;
}

}  // namespace

LegendPlan plan_legend(text::FontCache& fonts, const style::Style& style,
                       const std::vector<LegendEntry>& entries, double width_mm,
                       double max_height_mm) {
  const double body = style.furniture.body.size_pt;
  // Narrow boxes take fewer columns: each column needs room for a swatch and a few words.
  int max_columns = std::clamp(static_cast<int>(width_mm / 45), 1, kLegendMaxColumns);
  LegendPlan last;
  for (double scale : {1.0, 0.9, 0.8, kLegendMinScale}) {
    for (int columns = 1; columns <= max_columns; ++columns) {
      last = try_plan(fonts, style, entries, width_mm, max_height_mm, body * scale, columns);
      if (last.fits) return last;
    }
  }
  return last;  // the smallest, most columns: too tall, but whole
}

Box draw_legend_plan(cairo_t* cr, const LegendPlan& plan, const std::vector<LegendEntry>& entries,
                     Point top_left, const style::Style& style, text::FontCache& fonts) {
  Box used;
  if (entries.empty()) return used;
  const auto& fur = style.furniture;
  Box head = draw_label(cr, fonts, fur.heading, "Legend", top_left, HAlign::left, VAlign::top);
  used.add({head.min_x, head.min_y});
  used.add({head.max_x, head.max_y});
  double top = top_left.y + plan.heading_mm;
  double lead = leading_mm(plan.size_pt);
  for (const auto& row : plan.rows) {
    double x = top_left.x + row.column * (plan.column_w_mm + kColumnGapMm);
    double y = top + row.y_mm;
    Box sw = Box::of(x, y, x + kSwatchWMm, y + kSwatchHMm);
    cairo_save(cr);
    draw::draw_rule_swatch(cr, entries[row.entry].swatch, sw);
    cairo_restore(cr);
    used.add({sw.min_x, sw.min_y});
    used.add({sw.max_x, sw.max_y});
    // The first line centred on the swatch, the rest below it.
    double baseline = sw.centre().y + plan.size_pt * kMmPerPt * 0.365;
    for (const auto& line : row.lines) {
      Box b = draw_label(cr, fonts, fur.body, line, {x + kSwatchWMm + kSwatchGapMm, baseline},
                         HAlign::left, VAlign::baseline, plan.size_pt);
      used.add({b.min_x, b.min_y});
      used.add({b.max_x, b.max_y});
      baseline += lead;
    }
  }
  return used;
}

}  // namespace sheetmill::sheet
