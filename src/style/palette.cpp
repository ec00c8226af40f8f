// Colours: the palette of named colours and every colour reference in the file.
#include <cctype>
#include <charconv>
#include <cmath>

#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

int hex_digit(char c) {
  if (c >= '0' && c <= '9') return c - '0';
  c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  if (c >= 'a' && c <= 'f') return c - 'a' + 10;
  return -1;
}

const char* kColourExpected = "a palette colour or a hex colour such as #1f6fb2 or #1f6fb280";

bool is_name(const std::string& s) {
  if (s.empty() || !std::isalpha(static_cast<unsigned char>(s[0]))) return false;
  for (char c : s) {
    if (!std::isalnum(static_cast<unsigned char>(c)) && c != '_' && c != '-') return false;
  }
  return true;
}

}  // namespace

// 0..1, or a percentage "35%".
double read_share(const ConfigNode& n, const char* what) {
  std::optional<double> v;
  if (n.is_scalar()) {
    std::string s = n.as_string();
    bool percent = !s.empty() && s.back() == '%';
    v = parse_number(percent ? s.substr(0, s.size() - 1) : s);
    if (v && percent) *v /= 100.0;
  }
  if (!v || !(*v >= 0 && *v <= 1))
    n.fail_expected(std::string(what) + " from 0 to 1 or 0% to 100%");
  return *v;
}

std::optional<double> parse_number(const std::string& text) {
  std::string_view t(text);
  if (!t.empty() && t.front() == '+') t.remove_prefix(1);
  double v = 0;
  auto res = std::from_chars(t.data(), t.data() + t.size(), v);
  if (t.empty() || res.ec != std::errc() || res.ptr != t.data() + t.size() || !std::isfinite(v)) {
    return std::nullopt;
  }
  return v;
}

std::optional<Colour> parse_hex_colour(const std::string& text) {
  if ((text.size() != 7 && text.size() != 9) || text[0] != '#') return std::nullopt;
  double c[4] = {0, 0, 0, 1};
  for (std::size_t i = 0; i * 2 + 1 < text.size(); ++i) {
    int hi = hex_digit(text[1 + 2 * i]), lo = hex_digit(text[2 + 2 * i]);
    if (hi < 0 || lo < 0) return std::nullopt;
    c[i] = (hi * 16 + lo) / 255.0;
  }
  return Colour{c[0], c[1], c[2], c[3]};
}

Reader::Reader(const std::optional<ConfigNode>& colours, const std::optional<ConfigNode>& symbols,
               const std::optional<ConfigNode>& press, const std::optional<ConfigNode>& plate_ink)
    : symbols_(symbols) {
  if (symbols_ && !symbols_->is_null() && !symbols_->is_map()) symbols_->fail_expected("a mapping");
  if (press) read_press(*press);
  if (plate_ink) {
    std::string name = plate_ink->as_string();
    for (std::size_t i = 0; i < press_.inks.size(); ++i)
      if (press_.inks[i].name == name) press_.plate = static_cast<int>(i);
    if (press_.plate < 0) {
      std::vector<std::string> names;
      for (const Ink& ink : press_.inks) names.push_back(ink.name);
      std::string near = config::closest_word(name, names);
      plate_ink->fail("expected one of the style's inks (press.inks), got \"" + name + "\"" +
                      (near.empty() ? "" : "; did you mean '" + near + "'?"));
    }
  }
  if (!colours) return;
  // In document order: an entry may derive from one defined above it.
  for (const auto& [name, node] : colours->entries()) {
    if (!is_name(name)) {
      node.fail("a colour name starts with a letter and holds only letters, digits, _ and -");
    }
    PressColour pc = press_colour(node);
    palette_[name] = plate_view(pc, node);
    press_.colours[name] = pc;
  }
}

Reader::~Reader() = default;

PressColour Reader::press_colour(const ConfigNode& n) const {
  if (n.is_map()) {
    if (n.has("cmyk") || n.has("ink")) return print_colour(n);
    // { colour: water, opacity: 35% }
    n.expect_keys({"colour", "opacity"});
    PressColour c = press_colour(n.at("colour"));
    if (auto o = n.find("opacity")) c.appearance.a *= read_opacity(*o);
    return c;
  }
  if (!n.is_scalar()) n.fail_expected(kColourExpected);
  std::string s = n.as_string();
  if (!s.empty() && s[0] == '#') {
    if (auto c = parse_hex_colour(s)) {
      PressColour pc;
      pc.appearance = *c;
      return pc;
    }
    n.fail_expected(kColourExpected);
  }
  auto it = press_.colours.find(s);
  if (it != press_.colours.end()) return it->second;
  std::vector<std::string> names;
  for (const auto& kv : palette_) names.push_back(kv.first);
  std::string near = config::closest_word(s, names);
  n.fail("expected " + std::string(kColourExpected) + ", got \"" + s + "\"" +
         (near.empty() ? "" : "; did you mean '" + near + "'?"));
}

Colour Reader::colour(const ConfigNode& n) const {
  if (n.is_scalar() && press_.plate < 0) {
    // The common case, without copying print definitions.
    auto it = palette_.find(n.as_string());
    if (it != palette_.end()) return it->second;
  }
  return plate_view(press_colour(n), n);
}

}  // namespace sheetmill::style::detail
