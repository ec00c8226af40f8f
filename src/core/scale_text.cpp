#include "sheetmill/core/scale_text.hpp"

#include <charconv>
#include <cmath>
#include <string>

namespace sheetmill {

namespace {

// Spaces people put between digit groups: ASCII space, tab, no-break space (U+00A0),
// thin space (U+2009) and narrow no-break space (U+202F), the last three in UTF-8.
std::string without_group_spaces(std::string_view s) {
  std::string out;
  for (std::size_t i = 0; i < s.size(); ++i) {
    unsigned char c = static_cast<unsigned char>(s[i]);
    if (c == ' ' || c == '\t') continue;
    if (c == 0xC2 && i + 1 < s.size() && static_cast<unsigned char>(s[i + 1]) == 0xA0) {
      ++i;
      continue;
    }
    if (c == 0xE2 && i + 2 < s.size() && static_cast<unsigned char>(s[i + 1]) == 0x80 &&
        (static_cast<unsigned char>(s[i + 2]) == 0x89 ||
         static_cast<unsigned char>(s[i + 2]) == 0xAF)) {
      i += 2;
      continue;
    }
    out.push_back(s[i]);
  }
  return out;
}

}  // namespace

std::optional<double> parse_scale_denominator(std::string_view text) {
  std::string t = without_group_spaces(text);
  if (t.rfind("1:", 0) == 0) t = t.substr(2);
  if (t.empty() || t[0] == '+' || t[0] == '-') return std::nullopt;
  double v = 0;
  auto [end, ec] = std::from_chars(t.data(), t.data() + t.size(), v);
  if (ec != std::errc() || end != t.data() + t.size()) return std::nullopt;
  if (!std::isfinite(v) || !(v >= 1) || v > kMaxScaleDenominator) return std::nullopt;
  return v;
}

}  // namespace sheetmill
