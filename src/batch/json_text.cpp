#include "sheetmill/batch/json_text.hpp"

#include <cstdint>
#include <cstdio>

namespace sheetmill::batch {

namespace {
// Length of a well-formed UTF-8 sequence at s[i] (RFC 3629), 0 if none.
std::size_t utf8_length(std::string_view s, std::size_t i) {
  auto c = static_cast<unsigned char>(s[i]);
  std::size_t n = c < 0x80           ? 1
                  : (c >> 5) == 0x6  ? 2
                  : (c >> 4) == 0xe  ? 3
                  : (c >> 3) == 0x1e ? 4
                                     : 0;
  if (n == 0 || i + n > s.size()) return 0;
  std::uint32_t cp = n == 1 ? c : n == 2 ? (c & 0x1f) : n == 3 ? (c & 0x0f) : (c & 0x07);
  for (std::size_t k = 1; k < n; ++k) {
    auto b = static_cast<unsigned char>(s[i + k]);
    if ((b & 0xc0) != 0x80) return 0;
    cp = (cp << 6) | (b & 0x3f);
  }
  static constexpr std::uint32_t kMin[5] = {0, 0, 0x80, 0x800, 0x10000};
  if (cp < kMin[n] || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return 0;
  return n;
}
}  // namespace

std::string json_quote(std::string_view s) {
  std::string out = "\"";
  for (std::size_t i = 0; i < s.size();) {
    std::size_t n = utf8_length(s, i);
    if (n == 0) {
      out += "\\ufffd";
      ++i;
      continue;
    }
    auto c = static_cast<unsigned char>(s[i]);
    if (n == 1 && (c < 0x20 || c == '"' || c == '\\' || c == 0x7f)) {
      switch (c) {
        case '"':
          out += "\\\"";
          break;
        case '\\':
          out += "\\\\";
          break;
        case '\n':
          out += "\\n";
          break;
        case '\t':
          out += "\\t";
          break;
        case '\r':
          out += "\\r";
          break;
        default: {
          char buf[8];
          std::snprintf(buf, sizeof buf, "\\u%04x", c);
          out += buf;
        }
      }
    } else {
      out.append(s.substr(i, n));
    }
    i += n;
  }
  out += '"';
  return out;
}

std::string display_text(std::string_view text) {
  std::string q = json_quote(text);
  return q.substr(1, q.size() - 2);
}

std::string csv_field(std::string_view s) {
  std::string v(s);
  if (!v.empty() && (v[0] == '=' || v[0] == '+' || v[0] == '-' || v[0] == '@')) v = "'" + v;
  if (v.find_first_of(",\"\r\n") == std::string::npos) return v;
  std::string out = "\"";
  for (char c : v) {
    if (c == '"') out += '"';
    out += c;
  }
  return out + '"';
}

}  // namespace sheetmill::batch
