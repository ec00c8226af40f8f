#pragma once
// Text shaped with HarfBuzz, in millimetres on paper. A ShapedText is a sequence of runs, each in
// one face (font fallback splits runs where the primary face lacks a glyph). Glyph positions are
// relative to the start of the baseline, x to the right, y down (Cairo's convention).

#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

#include "sheetmill/core/colour.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::text {

struct ShapedGlyph {
  uint32_t glyph_id = 0;
  double x_mm = 0;  // pen position + offset, from the run's baseline start
  double y_mm = 0;
  double pen_mm = 0;  // pen position before this glyph (x_mm without the glyph's offset)
  double advance_mm = 0;
  uint32_t cluster = 0;  // byte offset into the source UTF-8
};

struct ShapedRun {
  const Font* font = nullptr;
  std::vector<ShapedGlyph> glyphs;  // x_mm relative to the whole text's start
  uint32_t byte_begin = 0;          // this run's slice of the UTF-8 text
  uint32_t byte_end = 0;
};

struct ShapedText {
  std::string utf8;
  double size_pt = 0;
  std::vector<ShapedRun> runs;
  double width_mm = 0;    // total advance
  double ascent_mm = 0;   // above the baseline (positive)
  double descent_mm = 0;  // below the baseline (positive)
  double height_mm() const { return ascent_mm + descent_mm; }
  bool empty() const { return runs.empty(); }
};

// True when `s` is well-formed UTF-8 (RFC 3629: shortest forms, no surrogates, <= U+10FFFF).
bool is_valid_utf8(std::string_view s);

// Shapes `utf8` at `size_pt` with `key` and its fallbacks. `letter_spacing_em` adds space after
// every glyph but the last. The text is split into runs of one face and one direction by the
// Unicode Bidirectional Algorithm (GNU FriBidi) and the runs are stored in visual order, each
// shaped in its direction (script detected by HarfBuzz), so right-to-left and mixed names read
// correctly. Ill-formed UTF-8 is shaped with U+FFFD in place of each bad sequence.
ShapedText shape(FontCache& fonts, const FontKey& key, double size_pt, std::string_view utf8,
                 double letter_spacing_em = 0);

struct TextPaint {
  Colour colour;
  bool halo = false;
  Colour halo_colour{1, 1, 1, 1};
  double halo_width_mm = 0.3;
};

// Draws shaped text as real text (cairo_show_text_glyphs, so it is searchable and selectable in
// the PDF). `origin_mm` is the start of the baseline; `angle_rad` rotates about it, clockwise
// positive on the page (y down).
void draw_text(cairo_t* cr, const ShapedText& text, Point origin_mm, double angle_rad,
               const TextPaint& paint);

// One glyph placed on a path: its baseline origin and rotation.
struct PlacedGlyph {
  std::size_t run = 0;
  std::size_t index = 0;
  Point origin_mm;
  double angle_rad = 0;
};

// Places every glyph of `text` along `path_mm` (page millimetres), its baseline starting
// `start_mm` along the path. The baseline is the path smoothed over about half an em (so a
// stream's small wiggles do not crowd letters) and moved `baseline_shift_mm` to the left of the
// path's direction (page up for a path running right). Glyphs are laid chord by chord: each
// advance (with its letter spacing) is a straight chord whose ends lie on the baseline, and the
// glyph is turned to that chord about the chord's middle, so every advance and word space is kept
// exactly. Returns an empty vector when the text runs past either end, or when the turn between
// the chords of two neighbouring glyphs exceeds `max_turn_deg` (the line bends too sharply).
std::vector<PlacedGlyph> layout_on_path(const ShapedText& text, const Polyline& path_mm,
                                        double start_mm, double max_turn_deg = 30,
                                        double baseline_shift_mm = 0);

void draw_placed_glyphs(cairo_t* cr, const ShapedText& text, const std::vector<PlacedGlyph>& glyphs,
                        const TextPaint& paint);

}  // namespace sheetmill::text
