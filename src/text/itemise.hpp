#pragma once
// Itemising text for shaping (private to the text stage): runs of one face and one direction,
// in visual order.

#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

#include "sheetmill/text/font.hpp"

namespace sheetmill::text::detail {

// Decodes one UTF-8 code point at s[i] and advances i; an invalid byte decodes as U+FFFD.
char32_t next_codepoint(std::string_view s, std::size_t& i);

// True when `s` is well-formed UTF-8 (RFC 3629: no overlongs, no surrogates, at most U+10FFFF).
bool valid_utf8(std::string_view s);

// `s` with every ill-formed sequence replaced by U+FFFD (so the PDF's text stays valid).
std::string sanitised_utf8(std::string_view s);

struct Span {
  const Font* font = nullptr;
  uint32_t begin = 0, end = 0;  // bytes of the UTF-8 text
  bool rtl = false;             // shaped right to left
};

// Splits `utf8` into spans, each in the first face (primary, then fontconfig's fallbacks) that
// has its characters' glyphs and at one embedding level of the Unicode Bidirectional Algorithm
// (UAX #9, computed by GNU FriBidi; the paragraph direction from the first strong character),
// and returns them in visual order, left to right (UAX #9 rule L2: from the highest level down
// to the lowest odd one, every maximal sequence of spans at that level or above is reversed).
std::vector<Span> itemise(FontCache& fonts, const FontKey& key, std::string_view utf8);

}  // namespace sheetmill::text::detail
