// The press section (output profile, intent, inks) and the print forms of a colour: exact CMYK
// percentages and tints of an ink, and how a colour looks on one ink's plate.
#include <cmath>

#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

print::Cmyk read_cmyk(const ConfigNode& n) {
  if (!n.is_sequence() || n.items().size() != 4) {
    n.fail_expected("four ink percentages [cyan, magenta, yellow, black] such as [0, 40, 80, 25]");
  }
  double v[4];
  auto items = n.items();
  for (int i = 0; i < 4; ++i) {
    std::string s = items[i].as_string();
    if (!s.empty() && s.back() == '%') s.pop_back();
    auto p = parse_number(s);
    if (!p || !(*p >= 0 && *p <= 100)) items[i].fail_expected("an ink percentage from 0 to 100");
    v[i] = *p / 100.0;
  }
  return {v[0], v[1], v[2], v[3]};
}

print::Intent read_intent(const ConfigNode& n) {
  std::string s =
      n.as_choice({"perceptual", "relative-colorimetric", "saturation", "absolute-colorimetric"});
  if (s == "perceptual") return print::Intent::perceptual;
  if (s == "saturation") return print::Intent::saturation;
  if (s == "absolute-colorimetric") return print::Intent::absolute_colorimetric;
  return print::Intent::relative_colorimetric;
}

bool is_paper(const PressColour& c) {
  if (c.cmyk) return *c.cmyk == print::Cmyk{};
  const Colour& a = c.appearance;
  constexpr double kWhite = 254.5 / 255.0;
  return c.ink < 0 && a.r >= kWhite && a.g >= kWhite && a.b >= kWhite;
}

}  // namespace

const print::ColourEngine& Reader::engine() const {
  if (!engine_) engine_ = std::make_unique<print::ColourEngine>(press_.colour);
  return *engine_;
}

// inks: { black: { cmyk: [0, 0, 0, 100] }, water_blue: { srgb: "#1f6fb2" } }
Ink Reader::read_ink(const std::string& name, const ConfigNode& n) const {
  if (!n.is_map() || n.has("cmyk") == n.has("srgb")) {
    n.fail_expected("an ink with either cmyk: [c, m, y, k] or srgb: \"#rrggbb\"");
  }
  n.expect_keys({"cmyk", "srgb"});
  Ink ink;
  ink.name = name;
  if (auto c = n.find("cmyk")) {
    ink.cmyk = read_cmyk(*c);
    ink.appearance = engine().srgb_of(ink.cmyk);
  } else {
    const ConfigNode s = n.at("srgb");
    auto rgb = parse_hex_colour(s.as_string());
    if (!rgb || rgb->a != 1) s.fail_expected("an opaque hex colour such as #1f6fb2");
    ink.appearance = *rgb;
    ink.cmyk = engine().cmyk_of(*rgb);
  }
  return ink;
}

void Reader::read_press(const ConfigNode& n) {
  if (!n.is_map()) n.fail_expected("a mapping with profile, intent, inks");
  n.expect_keys({"profile", "intent", "black_point_compensation", "inks", "relief_plate"});
  if (auto p = n.find("profile")) press_.colour.profile = p->as_path();
  if (auto i = n.find("intent")) press_.colour.intent = read_intent(*i);
  if (auto b = n.find("black_point_compensation"))
    press_.colour.black_point_compensation = b->as_bool();
  if (auto p = n.find("profile")) {
    try {
      (void)engine();
    } catch (const Error& e) {
      p->fail(e.message());  // the profile's own complaint, located at the key
    }
  }
  if (auto inks = n.find("inks")) {
    if (!inks->is_map()) inks->fail_expected("a mapping of ink names to cmyk or srgb");
    for (const auto& [name, node] : inks->entries()) {
      press_.inks.push_back(read_ink(name, node));
    }
  }
  if (auto r = n.find("relief_plate")) {
    for (std::size_t i = 0; i < press_.inks.size(); ++i)
      if (press_.inks[i].name == r->as_string()) press_.relief_ink = static_cast<int>(i);
    if (press_.relief_ink < 0) r->fail_expected("the name of one of press.inks");
  }
  if (press_.relief_ink < 0 && !press_.inks.empty()) press_.relief_ink = 0;
}

// { cmyk: [0, 40, 80, 25] } or { ink: contour_brown, tint: 60% }, each with an optional opacity.
PressColour Reader::print_colour(const ConfigNode& n) const {
  if (n.has("cmyk") && n.has("ink")) n.fail("give either cmyk or ink, not both");
  PressColour c;
  double opacity = 1;
  if (auto o = n.find("opacity")) opacity = read_opacity(*o);
  if (auto k = n.find("cmyk")) {
    n.expect_keys({"cmyk", "srgb", "opacity"});
    c.cmyk = read_cmyk(*k);
    c.appearance = engine().srgb_of(*c.cmyk);
  } else {
    n.expect_keys({"ink", "tint", "srgb", "opacity"});
    const ConfigNode in = n.at("ink");
    const std::string name = in.as_string();
    for (std::size_t i = 0; i < press_.inks.size(); ++i)
      if (press_.inks[i].name == name) c.ink = static_cast<int>(i);
    if (c.ink < 0) {
      std::vector<std::string> names;
      for (const Ink& ink : press_.inks) names.push_back(ink.name);
      std::string near = config::closest_word(name, names);
      in.fail("expected an ink named in press.inks, got \"" + name + "\"" +
              (near.empty() ? "" : "; did you mean '" + near + "'?"));
    }
    if (auto t = n.find("tint")) c.tint = read_share(*t, "a tint");
    const print::Cmyk& s = press_.inks[c.ink].cmyk;
    c.cmyk = print::Cmyk{s.c * c.tint, s.m * c.tint, s.y * c.tint, s.k * c.tint};
    c.appearance = engine().srgb_of(*c.cmyk);
  }
  // The screen appearance may be given: the sheet then looks as before on screen, in PNG and
  // GeoTIFF, while the print file and the plates use the CMYK or the tint.
  if (auto s = n.find("srgb")) {
    auto rgb = parse_hex_colour(s->as_string());
    if (!rgb || rgb->a != 1) s->fail_expected("an opaque hex colour such as #1f6fb2");
    c.appearance = *rgb;
  }
  c.appearance.a = opacity;
  return c;
}

Colour Reader::plate_view(const PressColour& c, const ConfigNode& at) const {
  if (press_.plate < 0) return c.appearance;
  const double a = c.appearance.a;
  if (c.ink == press_.plate) {
    double grey = 1 - c.tint;  // coverage as a grey: black is 100 % ink
    return {grey, grey, grey, a};
  }
  if (c.ink >= 0) {
    // Solid black overprints: the other plates do not see it. Everything else knocks out.
    if (press_.inks[c.ink].overprints() && c.tint >= 1) return {1, 1, 1, 0};
    return {1, 1, 1, a};
  }
  if (is_paper(c)) return {1, 1, 1, a};
  at.fail(
      "expected a tint of one of press.inks or paper white for the plates, got a colour "
      "that no plate carries");
}

}  // namespace sheetmill::style::detail
