#include "text/itemise.hpp"

#include <fribidi.h>

#include <algorithm>
#include <string>

namespace sheetmill::text::detail {

char32_t next_codepoint(std::string_view s, std::size_t& i) {
  auto c = static_cast<unsigned char>(s[i]);
  int len = c < 0x80 ? 1 : (c >> 5) == 6 ? 2 : (c >> 4) == 14 ? 3 : (c >> 3) == 30 ? 4 : 0;
  if (len == 0 || i + len > s.size()) {
    ++i;
    return 0xFFFD;
  }
  char32_t cp = len == 1 ? c : c & (0x7F >> len);
  for (int k = 1; k < len; ++k) {
    auto b = static_cast<unsigned char>(s[i + k]);
    if ((b & 0xC0) != 0x80) {  // a truncated sequence: one replacement, resume at b
      ++i;
      return 0xFFFD;
    }
    cp = (cp << 6) | (b & 0x3F);
  }
  i += len;
  return cp;
}

bool valid_utf8(std::string_view s) {
  std::size_t i = 0;
  while (i < s.size()) {
    const std::size_t start = i;
    const char32_t cp = next_codepoint(s, i);
    const std::size_t len = i - start;
    if (cp == 0xFFFD && !(len == 3 && static_cast<unsigned char>(s[start]) == 0xEF)) return false;
    const std::size_t shortest = cp < 0x80 ? 1 : cp < 0x800 ? 2 : cp < 0x10000 ? 3 : 4;
    if (len != shortest || (cp >= 0xD800 && cp <= 0xDFFF) || cp > 0x10FFFF) return false;
  }
  return true;
}

std::string sanitised_utf8(std::string_view s) {
  if (valid_utf8(s)) return std::string(s);
  std::string out;
  for (std::size_t i = 0; i < s.size();) {
    const std::size_t start = i;
    const char32_t cp = next_codepoint(s, i);
    const std::size_t len = i - start;
    const std::size_t shortest = cp < 0x80 ? 1 : cp < 0x800 ? 2 : cp < 0x10000 ? 3 : 4;
    const bool ok = !(cp == 0xFFFD && len != 3) && len == shortest &&
                    !(cp >= 0xD800 && cp <= 0xDFFF) && cp <= 0x10FFFF;
    out += ok ? std::string(s.substr(start, len)) : std::string("\uFFFD");
  }
  return out;
}

namespace {

// Characters that take the face of their neighbours rather than forcing a fallback: spaces,
// combining marks, joiners, and the invisible bidi controls.
bool is_neutral(char32_t cp) {
  return cp == ' ' || cp == 0x00A0 || (cp >= 0x0300 && cp <= 0x036F) || cp == 0x200B ||
         cp == 0x200C || cp == 0x200D || cp == 0x200E || cp == 0x200F || cp == 0x061C ||
         (cp >= 0x202A && cp <= 0x202E) || (cp >= 0x2066 && cp <= 0x2069) || cp == 0xFEFF;
}

struct Leveled {
  Span span;
  int level = 0;
};

}  // namespace

std::vector<Span> itemise(FontCache& fonts, const FontKey& key, std::string_view utf8) {
  const Font& primary = fonts.primary(key);
  std::vector<FriBidiChar> cps;
  std::vector<uint32_t> starts;  // byte offset of each code point
  for (std::size_t i = 0; i < utf8.size();) {
    starts.push_back(static_cast<uint32_t>(i));
    cps.push_back(next_codepoint(utf8, i));
  }
  starts.push_back(static_cast<uint32_t>(utf8.size()));
  const auto n = static_cast<FriBidiStrIndex>(cps.size());
  std::vector<FriBidiCharType> types(cps.size());
  std::vector<FriBidiBracketType> brackets(cps.size());
  std::vector<FriBidiLevel> levels(cps.size(), 0);
  if (n > 0) {
    fribidi_get_bidi_types(cps.data(), n, types.data());
    fribidi_get_bracket_types(cps.data(), n, types.data(), brackets.data());
    FriBidiParType base = FRIBIDI_PAR_ON;  // from the first strong character
    if (!fribidi_get_par_embedding_levels_ex(types.data(), brackets.data(), n, &base,
                                             levels.data()))
      std::fill(levels.begin(), levels.end(), FriBidiLevel(0));
  }
  // Logical spans of one face and one level.
  std::vector<Leveled> spans;
  for (std::size_t k = 0; k < cps.size(); ++k) {
    const char32_t cp = cps[k];
    const Font* font = &primary;
    if (!is_neutral(cp) && !primary.has_glyph(cp)) {
      if (const Font* f = fonts.fallback_for(key, cp)) font = f;
    }
    const int level = levels[k];
    const bool joins = !spans.empty() && spans.back().level == level &&
                       (spans.back().span.font == font || is_neutral(cp));
    if (joins) {
      spans.back().span.end = starts[k + 1];
    } else {
      spans.push_back({{font, starts[k], starts[k + 1], (level % 2) == 1}, level});
    }
  }
  // UAX #9 rule L2, on spans (each is at one level).
  int highest = 0, lowest_odd = 1 << 8;
  for (const auto& s : spans) {
    highest = std::max(highest, s.level);
    if (s.level % 2) lowest_odd = std::min(lowest_odd, s.level);
  }
  for (int level = highest; level >= lowest_odd; --level) {
    for (std::size_t i = 0; i < spans.size();) {
      if (spans[i].level < level) {
        ++i;
        continue;
      }
      std::size_t j = i;
      while (j < spans.size() && spans[j].level >= level) ++j;
      std::reverse(spans.begin() + static_cast<std::ptrdiff_t>(i),
                   spans.begin() + static_cast<std::ptrdiff_t>(j));
      i = j;
    }
  }
  std::vector<Span> out;
  for (const auto& s : spans) out.push_back(s.span);
  return out;
}

}  // namespace sheetmill::text::detail
