#pragma once
// Fonts: resolved by fontconfig from a family, weight and slant; loaded once with FreeType; used
// by HarfBuzz for shaping and by Cairo for drawing, so the PDF embeds (and subsets) the very
// faces that were measured. A FontCache belongs to one thread (one per batch worker).

#include <memory>
#include <string>
#include <vector>

#include "sheetmill/core/handles.hpp"

namespace sheetmill::text {

struct FontKey {
  std::string family = "DejaVu Sans";
  int weight = 400;  // CSS-style 100..900
  bool italic = false;
  bool operator==(const FontKey&) const = default;
};

// One loaded face. Non-copyable; owned by the FontCache, which outlives every use of it.
class Font {
 public:
  virtual ~Font() = default;
  virtual hb_font_t* hb() const = 0;  // shaping font, scaled in font units
  virtual cairo_font_face_t* cairo_face() const = 0;
  virtual int units_per_em() const = 0;
  virtual bool has_glyph(char32_t codepoint) const = 0;
  virtual const std::string& file() const = 0;  // the font file fontconfig chose
  virtual double ascender_em() const = 0;       // typographic ascender, in ems (positive)
  virtual double descender_em() const = 0;      // typographic descender, in ems (positive)
};

class FontCache {
 public:
  FontCache();
  ~FontCache();
  FontCache(const FontCache&) = delete;
  FontCache& operator=(const FontCache&) = delete;

  // The best match for `key`. Never returns null: fontconfig always substitutes something, and
  // the substitution is logged once when the family differs.
  const Font& primary(const FontKey& key);
  // The first face in fontconfig's preference order for `key` that covers `codepoint` (by the
  // face's character set), for codepoints the primary face lacks (non-Latin scripts). Faces are
  // loaded only when first chosen. Returns null when no installed face covers the codepoint.
  const Font* fallback_for(const FontKey& key, char32_t codepoint);

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace sheetmill::text
