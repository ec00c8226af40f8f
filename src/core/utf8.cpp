#include "sheetmill/core/utf8.hpp"

#include <fmt/format.h>

namespace sheetmill {

std::size_t utf8_sequence(std::string_view s, std::size_t i, std::uint32_t& cp) {
  auto b = [&](std::size_t k) { return static_cast<unsigned char>(s[i + k]); };
  unsigned char c = b(0);
  std::size_t n = c < 0x80           ? 1
                  : (c >> 5) == 0x6  ? 2
                  : (c >> 4) == 0xe  ? 3
                  : (c >> 3) == 0x1e ? 4
                                     : 0;
  if (n == 0 || i + n > s.size()) return 0;
  cp = n == 1 ? c : n == 2 ? (c & 0x1f) : n == 3 ? (c & 0x0f) : (c & 0x07);
  for (std::size_t k = 1; k < n; ++k) {
    if ((b(k) & 0xc0) != 0x80) return 0;
    cp = (cp << 6) | (b(k) & 0x3f);
  }
  static constexpr std::uint32_t kMin[5] = {0, 0, 0x80, 0x800, 0x10000};
  if (cp < kMin[n] || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return 0;
  return n;
}

std::optional<std::size_t> first_invalid_utf8(std::string_view s) {
  for (std::size_t i = 0; i < s.size();) {
    std::uint32_t cp = 0;
    std::size_t n = utf8_sequence(s, i, cp);
    if (n == 0) return i;
    i += n;
  }
  return std::nullopt;
}

bool hides_or_reorders_text(std::uint32_t cp) {
  return (cp >= 0x80 && cp <= 0x9f) || (cp >= 0x202a && cp <= 0x202e) ||
         (cp >= 0x2066 && cp <= 0x2069) || cp == 0x2028 || cp == 0x2029 || cp == 0x200e ||
         cp == 0x200f || cp == 0x061c || cp == 0xfeff;
}

std::string quote_untrusted(std::string_view raw, std::size_t max_bytes) {
  std::string out = "\"";
  std::size_t i = 0;
  for (; i < raw.size() && i < max_bytes;) {
    std::uint32_t cp = 0;
    std::size_t n = utf8_sequence(raw, i, cp);
    unsigned char c = static_cast<unsigned char>(raw[i]);
    if (n == 0) {
      out += fmt::format("\\x{:02X}", c);
      ++i;
      continue;
    }
    if (cp == '"' || cp == '\\') {
      out += '\\';
      out += static_cast<char>(cp);
    } else if (cp == '\n') {
      out += "\\n";
    } else if (cp == '\t') {
      out += "\\t";
    } else if (cp < 0x20 || cp == 0x7f) {
      out += fmt::format("\\x{:02X}", cp);
    } else if (hides_or_reorders_text(cp)) {
      out += fmt::format("\\u{{{:04X}}}", cp);
    } else {
      out.append(raw.substr(i, n));
    }
    i += n;
  }
  if (i < raw.size()) out += "...";
  return out + "\"";
}

}  // namespace sheetmill
