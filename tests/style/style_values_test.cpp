// What a style file's keys turn into: units, colours, named symbols, inheritance, defaults,
// tint stops. Each case writes a short style into a fresh folder and loads it.
#include <catch2/catch.hpp>
#include <cmath>

#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::style;

namespace {

Style load_text(const std::string& yaml) {
  test::TempDir tmp("style");
  test::write_text(tmp / "s.yaml", yaml);
  return load_style(tmp / "s.yaml");
}

// CIE 1976 L* of an sRGB colour: IEC 61966-2-1 decoding, Y from the Rec. 709 / sRGB
// primaries (0.2126, 0.7152, 0.0722), L* = 116 f(Y) - 16 (CIE 15:2004).
double lightness(const Colour& c) {
  auto lin = [](double v) { return v <= 0.04045 ? v / 12.92 : std::pow((v + 0.055) / 1.055, 2.4); };
  double y = 0.2126 * lin(c.r) + 0.7152 * lin(c.g) + 0.0722 * lin(c.b);
  double f = y > 216.0 / 24389 ? std::cbrt(y) : (24389.0 / 27 * y + 16) / 116;
  return 116 * f - 16;
}

}  // namespace

TEST_CASE("lengths in every unit arrive in millimetres, type sizes in points", "[style]") {
  Style s = load_text(R"(
layers:
  - id: a
    source: roads
    line: { width: 1pt, dashes: [0.1in, 0.05cm], side_offset: -0.4mm }
    label: { text: "{name}", size: 3mm, gap: 2pt }
)");
  REQUIRE(s.layers.size() == 1);
  const Stroke& st = s.layers[0].rules.at(0).line->strokes.at(0);
  // 1 pt = 1/72 in = 25.4/72 mm; 1 in = 25.4 mm (exact by definition of the inch).
  CHECK(st.width_mm == Approx(25.4 / 72));
  REQUIRE(st.dash_mm.size() == 2);
  CHECK(st.dash_mm[0] == Approx(2.54));
  CHECK(st.dash_mm[1] == Approx(0.5));
  CHECK(st.offset_mm == Approx(-0.4));
  CHECK(s.layers[0].label->size_pt == Approx(3 * 72 / 25.4));
  CHECK(s.layers[0].label->offset_mm == Approx(2 * 25.4 / 72));
}

TEST_CASE("colours come from hex, the palette and opacity", "[style]") {
  Style s = load_text(R"(
colours:
  water: "#1F6FB2"
  glass: "#ff000080"
  mist: { colour: water, opacity: 50% }
layers:
  - id: a
    source: water_areas
    area: { fill: { colour: mist, opacity: 0.5 }, outline: { colour: "#000000", width: 1mm } }
)");
  // Hex digits are 8-bit sRGB: 0x1f = 31, 0x6f = 111, 0xb2 = 178 (upper case accepted).
  CHECK(s.palette.at("water").r == Approx(31 / 255.0));
  CHECK(s.palette.at("water").g == Approx(111 / 255.0));
  CHECK(s.palette.at("water").b == Approx(178 / 255.0));
  CHECK(s.palette.at("glass").a == Approx(128 / 255.0));
  CHECK(s.palette.at("mist").a == Approx(0.5));
  CHECK(s.palette.at("mist").b == Approx(178 / 255.0));
  // Opacities multiply: 50% of a 50% colour.
  CHECK(s.layers[0].rules[0].area->fill->a == Approx(0.25));
}

TEST_CASE("named symbols are defined once and used by name, in any order", "[style]") {
  Style s = load_text(R"(
symbols:
  orchard_fill:
    area: { pattern: { symbol: tree, spacing: [3mm, 2mm], staggered: false } }
  tree:
    point: { shape: circle, size: 1mm, fill: "#336633" }
  arrow:
    point:
      shapes:
        - { shape: path, path: "M 0 -1.5 L 0.8 0.5 L -0.8 0.5 Z", fill: "#000000" }
      rotate_by: azimuth_deg
layers:
  - id: a
    source: landcover
    area: orchard_fill
  - id: b
    source: water_lines
    line:
      colour: "#0000ff"
      width: 0.3mm
      marks: { every: 20mm, symbol: arrow }
)");
  const auto& pattern = s.layers[0].rules[0].area->pattern;
  REQUIRE(pattern);
  CHECK(pattern->spacing_x_mm == Approx(3));
  CHECK(pattern->spacing_y_mm == Approx(2));
  CHECK_FALSE(pattern->staggered);
  CHECK(pattern->symbol.parts.at(0).size_mm == Approx(1));
  const auto& line = *s.layers[1].rules[0].line;
  REQUIRE(line.strokes.size() == 1);  // the keys of one stroke stand for a one-stroke line
  REQUIRE(line.marks.size() == 1);
  REQUIRE(line.marks[0].symbol);
  CHECK(line.marks[0].symbol->rotation_field == "azimuth_deg");
  CHECK(line.marks[0].symbol->parts.at(0).path_data == "M 0 -1.5 L 0.8 0.5 L -0.8 0.5 Z");
}

TEST_CASE("a rule's label starts from the layer's label", "[style]") {
  Style s = load_text(R"(
layers:
  - id: places
    source: places
    label: { text: "{name}", size: 9pt, weight: bold, halo: { width: 0.5mm } }
    rules:
      - when: { field: kind, equals: farm }
        label: { size: 7pt, slant: italic }
      - when: { field: kind, one_of: [village, hamlet] }
        point: { shape: circle, fill: "#000000" }
)");
  const Layer& l = s.layers.at(0);
  const LabelStyle& farm = *l.rules.at(0).label;
  CHECK(farm.text_template == "{name}");
  CHECK(farm.size_pt == Approx(7));
  CHECK(farm.font.weight == 700);
  CHECK(farm.font.italic);
  CHECK(farm.halo->width_mm == Approx(0.5));
  CHECK_FALSE(l.rules.at(1).label);  // no override: the renderer uses the layer's label
  CHECK(l.rules.at(1).name == "places.rules[1]");  // unnamed rules are named by place
  CHECK(l.rules.at(1).filter.values == std::vector<std::string>{"village", "hamlet"});
}

TEST_CASE("layers are sorted by order, ties keeping file order", "[style]") {
  Style s = load_text(R"(
layers:
  - { id: c, source: x, order: 30, line: { width: 1mm } }
  - { id: a, source: x, order: 10, line: { width: 1mm } }
  - { id: b1, source: x, order: 20, line: { width: 1mm } }
  - { id: b2, source: x, order: 20, line: { width: 1mm } }
  - { id: n, source: x, label: { text: "{name}" } }
)");
  std::vector<std::string> ids;
  for (const auto& l : s.layers) ids.push_back(l.id);
  CHECK(ids == std::vector<std::string>{"n", "a", "b1", "b2", "c"});
}

TEST_CASE("a short file gets the documented defaults", "[style]") {
  Style s = load_text(R"(
colours: { ink: "#202020", contour: "#aa5500" }
layers:
  - { id: a, source: roads, line: { width: 1mm } }
)");
  CHECK(s.name == "s");  // the file's stem when no name is given
  CHECK(s.relief.hillshade);
  CHECK_FALSE(s.relief.tint);
  CHECK(s.contours.index_every == 5);  // common practice: every fifth contour is an index
  CHECK(s.contours.line.strokes.at(0).colour == s.palette.at("contour"));
  CHECK(s.contours.index_line.strokes.at(0).width_mm > s.contours.line.strokes.at(0).width_mm);
  CHECK(s.furniture.ink == s.palette.at("ink"));
  CHECK(s.grid.label.colour == s.palette.at("ink"));
  // A stroke without a colour is black, solid, 0.25mm wide unless it says otherwise.
  const Stroke& st = s.layers[0].rules[0].line->strokes.at(0);
  CHECK(st.colour == Colour{0, 0, 0, 1});
  CHECK(st.dash_mm.empty());
  CHECK(st.pass == 0);
}

TEST_CASE("tint stops in percent spread over the stated range", "[style]") {
  Style s = load_text(R"(
relief:
  shading: off
  tint:
    over: [200m, 700m]
    stops: [{ at: 0%, colour: "#000000" }, { at: 40%, colour: "#808080" }, { at: 100%, colour: "#ffffff" }]
    stepped: true
    steps: contours
)");
  CHECK_FALSE(s.relief.hillshade);
  REQUIRE(s.relief.tint_stops.size() == 3);
  CHECK(s.relief.tint_stops[0].elevation_m == Approx(200));
  CHECK(s.relief.tint_stops[1].elevation_m == Approx(400));
  CHECK(s.relief.tint_stops[2].elevation_m == Approx(700));
  CHECK(s.relief.tint_stepped);
  CHECK(s.relief.tint_steps_follow_contours);
}

TEST_CASE("the colour-vision-safe ramp rises in lightness at every stop", "[style]") {
  Style s = load_text("relief: { tint: { ramp: slate-to-straw, over: [0m, 600m] } }\n");
  const auto& stops = s.relief.tint_stops;
  REQUIRE(stops.size() >= 5);
  CHECK(stops.front().elevation_m == Approx(0));
  CHECK(stops.back().elevation_m == Approx(600));
  for (std::size_t i = 1; i < stops.size(); ++i) {
    INFO("stop " << i);
    // A step of at least 5 L* units between neighbours: about twice the CIE 1976 colour
    // difference usually taken as just noticeable (ΔE ≈ 2.3, Sharma 2003), so the order stays
    // readable from lightness alone. The margin is our choice.
    CHECK(lightness(stops[i].colour) > lightness(stops[i - 1].colour) + 5);
  }
}

TEST_CASE("path data takes the draw stage's grammar: relative, H, V, commas, repeats", "[style]") {
  // Each of these is drawn by draw::parse_path_data; loading must accept them unchanged.
  for (const char* d :
       {"m0,0 l1,0 h1 v1 z", "M 0 0 1 1 2 0 Z", "M-1 0C-1 -1 1 -1 1 0Z", "M 1e-1 0 L 0 2.5E-1"}) {
    INFO(d);
    CHECK_NOTHROW(load_text(std::string("symbols:\n  p:\n    point: { shape: path, path: \"") + d +
                            "\", fill: \"#000000\" }\n"));
  }
}
