// Label text templates: "{name} {ele} m".
#include <fmt/format.h>

#include <cctype>
#include <charconv>
#include <cmath>

#include "sheetmill/labels/names.hpp"

namespace sheetmill::labels {

std::vector<std::string> template_fields(const std::string& t) {
  std::vector<std::string> out;
  for (std::size_t i = 0; i < t.size(); ++i) {
    if (t[i] != '{') continue;
    std::size_t e = t.find('}', i + 1);
    if (e == std::string::npos) break;
    std::string f = t.substr(i + 1, e - i - 1);
    if (!f.empty() && std::find(out.begin(), out.end(), f) == out.end()) out.push_back(f);
    i = e;
  }
  return out;
}

std::string expand_template(const std::string& t,
                            const std::function<const std::string*(const std::string&)>& value,
                            bool upper_case) {
  std::string out;
  for (std::size_t i = 0; i < t.size(); ++i) {
    std::size_t e = t[i] == '{' ? t.find('}', i + 1) : std::string::npos;
    if (e == std::string::npos) {
      out += t[i];
      continue;
    }
    if (const std::string* v = value(t.substr(i + 1, e - i - 1))) out += *v;
    i = e;
  }
  auto is_space = [](char c) { return std::isspace(static_cast<unsigned char>(c)) != 0; };
  while (!out.empty() && is_space(out.back())) out.pop_back();
  std::size_t b = 0;
  while (b < out.size() && is_space(out[b])) ++b;
  out.erase(0, b);
  // Upper case for ASCII letters only: other scripts and accented letters keep their case (a
  // full Unicode case mapping is not available without ICU).
  if (upper_case)
    for (char& c : out)
      if (c >= 'a' && c <= 'z') c = static_cast<char>(c - 'a' + 'A');
  return out;
}

std::string format_field(const std::string& value, int decimals) {
  std::size_t b = 0, e = value.size();
  while (b < e && std::isspace(static_cast<unsigned char>(value[b]))) ++b;
  while (e > b && std::isspace(static_cast<unsigned char>(value[e - 1]))) --e;
  if (b == e) return value;
  double v = 0;
  const char* first = value.data() + b;
  const char* last = value.data() + e;
  if (*first == '+') ++first;  // from_chars takes no plus sign
  auto [end, ec] = std::from_chars(first, last, v);
  if (ec != std::errc() || end != last || !std::isfinite(v)) return value;
  std::string out = fmt::format("{:.{}f}", v, decimals);
  // A value that rounds to zero prints without a sign.
  if (out.front() == '-' && out.find_first_not_of("-0.") == std::string::npos) out.erase(0, 1);
  return out;
}

std::string label_text(const style::LabelStyle& style,
                       const std::function<const std::string*(const std::string&)>& value) {
  if (style.decimals.empty()) return expand_template(style.text_template, value, style.upper_case);
  std::string formatted;
  return expand_template(
      style.text_template,
      [&](const std::string& field) -> const std::string* {
        const std::string* v = value(field);
        auto d = style.decimals.find(field);
        if (!v || d == style.decimals.end()) return v;
        formatted = format_field(*v, d->second);
        return &formatted;
      },
      style.upper_case);
}

}  // namespace sheetmill::labels
