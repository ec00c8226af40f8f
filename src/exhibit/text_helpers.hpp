#pragma once
// Small text helpers for the exhibit's furniture and callouts (page millimetres, y down).

#include <cairo.h>

#include <string>

#include "sheetmill/core/colour.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/text/font.hpp"
#include "sheetmill/text/shaping.hpp"

namespace sheetmill::exhibit::detail {

inline text::FontKey regular() {
  return {"DejaVu Sans", 400, false};
}
inline text::FontKey bold() {
  return {"DejaVu Sans", 700, false};
}

enum class Align { left, centre, right };

// Draws `s` with its baseline at `baseline.y`, anchored at `baseline.x` by `align`; returns the
// shaped text (for its width and height).
text::ShapedText put_text(cairo_t* cr, text::FontCache& fonts, const text::FontKey& key,
                          double size_pt, const std::string& s, Point baseline, Align align,
                          const Colour& colour = {0.1, 0.1, 0.1, 1});

}  // namespace sheetmill::exhibit::detail
