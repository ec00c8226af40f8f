#pragma once
// Small typesetting helpers for the sheet furniture (private to the sheet stage). Everything in
// page millimetres, y down; text is drawn as real text through text::draw_text, so it stays
// searchable in the PDF.

#include <cairo.h>

#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"
#include "sheetmill/text/shaping.hpp"

namespace sheetmill::sheet {

enum class HAlign { left, centre, right };
enum class VAlign { baseline, top, middle, bottom };

// A piece of text in one size, set next to other pieces on one baseline.
struct Piece {
  std::string text;
  double size_pt = 8;
};

// Shapes pieces in `style`'s font; `pieces` share one baseline.
struct SetLine {
  std::vector<text::ShapedText> shaped;
  double width_mm = 0;
  double ascent_mm = 0;  // of the largest piece
  double descent_mm = 0;
  double em_mm = 0;  // of the largest piece
};
SetLine set_line(text::FontCache& fonts, const style::LabelStyle& style,
                 const std::vector<Piece>& pieces);

// Draws a set line with its left baseline start at `origin`, the baseline turned `angle_rad`
// clockwise on the page; returns its box (advance width x ascent+descent; for a turned line the
// box of the turned rectangle).
Box draw_set_line(cairo_t* cr, const SetLine& line, const style::LabelStyle& style, Point origin,
                  double angle_rad = 0);

// The baseline origin that puts `line` at `anchor` with the given alignment.
Point align(const SetLine& line, Point anchor, HAlign h, VAlign v);

// One-size convenience: shapes `text` at the style's size (or `size_pt` when > 0), aligns it at
// `anchor` and draws it. Returns the box it occupies.
Box draw_label(cairo_t* cr, text::FontCache& fonts, const style::LabelStyle& style,
               const std::string& text, Point anchor, HAlign h, VAlign v, double size_pt = 0);

// Breaks `text` into lines no wider than `width_mm` at word boundaries (a single word longer
// than the width stays whole on its own line); "\n" forces a break. Every word is kept.
std::vector<std::string> wrap_words(text::FontCache& fonts, const style::LabelStyle& style,
                                    const std::string& text, double width_mm, double size_pt);

// Breaks `text` into lines no wider than `width_mm` (at word boundaries; a single long word
// stays whole) and draws them from `top_left` down; returns the y below the last line.
double draw_paragraph(cairo_t* cr, text::FontCache& fonts, const style::LabelStyle& style,
                      const std::string& text, Point top_left, double width_mm, double size_pt = 0,
                      double leading = 1.25);

// Paints the style's colour (and halo) as a text::TextPaint.
text::TextPaint paint_of(const style::LabelStyle& style);

}  // namespace sheetmill::sheet
