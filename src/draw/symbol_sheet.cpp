#include "sheetmill/draw/symbol_sheet.hpp"

#include <cairo-pdf.h>

#include <cmath>

#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/draw/swatch.hpp"
#include "sheetmill/text/shaping.hpp"

namespace sheetmill::draw {

namespace {
std::size_t rule_count(const style::Style& style) {
  std::size_t n = 0;
  for (const auto& l : style.layers) n += l.rules.size();
  return n;
}
}  // namespace

Point symbol_sheet_size_mm(const style::Style& style, const SymbolSheetLayout& lay) {
  const std::size_t n = rule_count(style);
  const int rows = static_cast<int>((n + lay.columns - 1) / lay.columns);
  return {2 * lay.margin_mm + lay.columns * lay.cell_w_mm,
          2 * lay.margin_mm + std::max(1, rows) * lay.cell_h_mm};
}

void draw_symbol_sheet(cairo_t* cr, const style::Style& style, text::FontCache& fonts,
                       const SymbolSheetLayout& lay) {
  std::size_t k = 0;
  text::TextPaint ink;
  ink.colour = {0, 0, 0, 1};
  for (const auto& layer : style.layers) {
    for (const auto& rule : layer.rules) {
      const double x = lay.margin_mm + static_cast<double>(k % lay.columns) * lay.cell_w_mm;
      const double y = lay.margin_mm + static_cast<double>(k / lay.columns) * lay.cell_h_mm;
      const Box swatch = Box::of(x, y, x + lay.swatch_w_mm, y + lay.swatch_h_mm);
      draw_rule_swatch(cr, rule, swatch);
      // A hairline frame so empty or white symbols still show where their cell is.
      cairo_save(cr);
      cairo_rectangle(cr, swatch.min_x, swatch.min_y, swatch.width(), swatch.height());
      cairo_set_source_rgba(cr, 0.6, 0.6, 0.6, 1);
      cairo_set_line_width(cr, 0.05);
      cairo_stroke(cr);
      cairo_restore(cr);
      const std::string caption = layer.id + " / " + (rule.name.empty() ? "(rule)" : rule.name);
      auto t = text::shape(fonts, text::FontKey{}, lay.caption_pt, caption);
      text::draw_text(
          cr, t, {swatch.max_x + 2, swatch.centre().y + (t.ascent_mm - t.descent_mm) / 2}, 0, ink);
      ++k;
    }
  }
}

void write_symbol_sheet_pdf(const std::filesystem::path& path, const style::Style& style,
                            text::FontCache& fonts, const SymbolSheetLayout& lay) {
  const Point size = symbol_sheet_size_mm(style, lay);
  AtomicOutput out(path);
  {
    CairoSurfacePtr surface(
        cairo_pdf_surface_create(out.temp_path().c_str(), size.x * kPtPerMm, size.y * kPtPerMm));
    check_cairo(cairo_surface_status(surface.get()), "symbol sheet surface");
    CairoPtr cr(cairo_create(surface.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);  // user space: page millimetres
    cairo_set_source_rgb(cr.get(), 1, 1, 1);
    cairo_paint(cr.get());
    draw_symbol_sheet(cr.get(), style, fonts, lay);
    check_cairo(cairo_status(cr.get()), "symbol sheet drawing");
    cr.reset();
    cairo_surface_finish(surface.get());
    check_cairo(cairo_surface_status(surface.get()), "symbol sheet PDF");
  }
  out.commit();
}

}  // namespace sheetmill::draw
