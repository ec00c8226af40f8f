#include "sheetmill/sheet/paper_sizes.hpp"

#include <algorithm>
#include <array>
#include <cctype>
#include <charconv>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::sheet {

namespace {

struct NamedSize {
  const char* name;
  double width;
  double height;
  bool inches;
};

// ISO 216 states the A series in whole millimetres; ANSI/ASME Y14.1 and the architectural series
// are defined in inches and converted exactly (1 in = 25.4 mm).
constexpr std::array<NamedSize, 16> kSizes{{
    {"A0", 841, 1189, false},
    {"A1", 594, 841, false},
    {"A2", 420, 594, false},
    {"A3", 297, 420, false},
    {"A4", 210, 297, false},
    {"ANSI A", 8.5, 11, true},
    {"ANSI B", 11, 17, true},
    {"ANSI C", 17, 22, true},
    {"ANSI D", 22, 34, true},
    {"ANSI E", 34, 44, true},
    {"ARCH A", 9, 12, true},
    {"ARCH B", 12, 18, true},
    {"ARCH C", 18, 24, true},
    {"ARCH D", 24, 36, true},
    {"ARCH E", 36, 48, true},
    {"ARCH E1", 30, 42, true},
}};

// Upper case without spaces, hyphens or underscores: "arch-e1" -> "ARCHE1".
std::string squeeze(const std::string& s) {
  std::string out;
  for (char c : s) {
    if (c == ' ' || c == '-' || c == '_' || c == '\t') continue;
    out += static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  }
  return out;
}

bool parse_number(const std::string& s, double& v) {
  if (s.empty()) return false;
  auto [ptr, ec] = std::from_chars(s.data(), s.data() + s.size(), v);
  return ec == std::errc() && ptr == s.data() + s.size() && v > 0;
}

// "600X900MM" or "24X36IN" (already squeezed).
bool parse_custom(const std::string& key, PaperSize& out) {
  double factor = 0;
  std::string body;
  if (key.size() > 2 && key.ends_with("MM")) {
    factor = 1;
    body = key.substr(0, key.size() - 2);
  } else if (key.size() > 2 && key.ends_with("IN")) {
    factor = kMmPerInch;
    body = key.substr(0, key.size() - 2);
  } else {
    return false;
  }
  auto x = body.find('X');
  if (x == std::string::npos) return false;
  double w = 0, h = 0;
  if (!parse_number(body.substr(0, x), w) || !parse_number(body.substr(x + 1), h)) return false;
  out = {"custom", std::min(w, h) * factor, std::max(w, h) * factor};
  return true;
}

}  // namespace

PaperSize paper_size(const std::string& name) {
  std::string key = squeeze(name);
  for (const auto& s : kSizes) {
    if (squeeze(s.name) == key) {
      double f = s.inches ? kMmPerInch : 1.0;
      return {s.name, s.width * f, s.height * f};
    }
  }
  PaperSize custom;
  if (parse_custom(key, custom)) return custom;
  std::string known;
  for (const auto& n : paper_size_names()) known += (known.empty() ? "" : ", ") + n;
  throw_input_error(
      SourceLocation{"", 0, 0, "paper"},
      "unknown paper size '" + name + "' (expected one of " + known + ", or WIDTHxHEIGHT mm|in)");
}

PaperSize oriented(const PaperSize& paper, bool landscape) {
  PaperSize p = paper;
  double lo = std::min(p.width_mm, p.height_mm), hi = std::max(p.width_mm, p.height_mm);
  p.width_mm = landscape ? hi : lo;
  p.height_mm = landscape ? lo : hi;
  return p;
}

std::vector<std::string> paper_size_names() {
  std::vector<std::string> names;
  for (const auto& s : kSizes) names.emplace_back(s.name);
  return names;
}

}  // namespace sheetmill::sheet
