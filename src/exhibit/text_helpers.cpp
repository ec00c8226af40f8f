#include "exhibit/text_helpers.hpp"

namespace sheetmill::exhibit::detail {

text::ShapedText put_text(cairo_t* cr, text::FontCache& fonts, const text::FontKey& key,
                          double size_pt, const std::string& s, Point baseline, Align align,
                          const Colour& colour) {
  text::ShapedText t = text::shape(fonts, key, size_pt, s);
  double x = baseline.x;
  if (align == Align::centre) x -= t.width_mm / 2;
  if (align == Align::right) x -= t.width_mm;
  text::TextPaint paint;
  paint.colour = colour;
  text::draw_text(cr, t, {x, baseline.y}, 0, paint);
  return t;
}

}  // namespace sheetmill::exhibit::detail
