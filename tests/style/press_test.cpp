// The press section and the print forms of a colour (docs/style.md, press), and the style as
// one ink's plate sees it. The CMYK-to-sRGB appearances are checked against Little CMS itself
// (print::ColourEngine, the oracle), the plate greys against the tint arithmetic they encode.
#include <catch2/catch.hpp>

#include "sheetmill/colour/colour_engine.hpp"
#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {
const char* kStyle = R"(press:
  relief_plate: black
  inks:
    black: { cmyk: [0, 0, 0, 100] }
    brown: { cmyk: [0, 50, 80, 40] }
    blue: { srgb: "#1f6fb2" }
colours:
  ink: { ink: black }
  paper: "#ffffff"
  contour: { ink: brown, tint: 60% }
  water: { ink: blue, srgb: "#1f6fb2" }
  grey: { ink: black, tint: 40% }
  halo: { colour: paper, opacity: 85% }
layers:
  - id: lines
    source: lines
    line: { colour: contour, width: 0.2mm }
contours:
  line: { colour: contour, width: 0.14mm }
)";
// The same style with a palette colour given as CMYK that is no ink's tint.
std::string with_mauve() {
  std::string s = kStyle;
  s.insert(s.find("  halo:"), "  mauve: { cmyk: [20, 40, 0, 10] }\n");
  return s;
}
}  // namespace

TEST_CASE("press colours keep their CMYK and ink, and look as Little CMS prints them", "[style]") {
  test::TempDir dir("press");
  test::write_text(dir / "s.yaml", kStyle);
  style::Style s = style::load_style(dir / "s.yaml");
  REQUIRE(s.press.inks.size() == 3);
  CHECK(s.press.inks[0].overprints());
  CHECK_FALSE(s.press.inks[1].overprints());
  CHECK(s.press.relief_ink == 0);
  const auto& contour = s.press.colours.at("contour");
  REQUIRE(contour.cmyk);
  // A 60 % tint of 0/50/80/40 is 0/30/48/24.
  CHECK(contour.cmyk->m == Approx(0.30));
  CHECK(contour.cmyk->y == Approx(0.48));
  CHECK(contour.cmyk->k == Approx(0.24));
  CHECK(contour.ink == 1);
  print::ColourEngine engine;
  Colour seen = engine.srgb_of(*contour.cmyk);
  CHECK(s.palette.at("contour").r == Approx(seen.r));
  CHECK(s.palette.at("contour").g == Approx(seen.g));
  // An ink given in sRGB is converted once through the profile (relative colorimetric + BPC).
  print::Cmyk blue = engine.cmyk_of(Colour{0x1f / 255.0, 0x6f / 255.0, 0xb2 / 255.0, 1});
  CHECK(s.press.inks[2].cmyk.c == Approx(blue.c));
  // The given appearance wins on screen.
  CHECK(s.palette.at("water").b == Approx(0xb2 / 255.0));
  test::write_text(dir / "m.yaml", with_mauve());
  CHECK(style::load_style(dir / "m.yaml").press.colours.at("mauve").cmyk->c == Approx(0.20));
  CHECK(s.contours.line.strokes.at(0).colour == s.palette.at("contour"));
}

TEST_CASE("a plate sees its ink as coverage grey, others white, solid black not at all",
          "[style]") {
  test::TempDir dir("plate");
  test::write_text(dir / "s.yaml", kStyle);
  style::Style brown = style::load_style(dir / "s.yaml", "brown");
  CHECK(brown.press.plate == 1);
  const Colour c = brown.palette.at("contour");
  CHECK(c.r == Approx(0.4));  // 60 % coverage
  CHECK(c.a == 1);
  CHECK(brown.palette.at("water") == Colour{1, 1, 1, 1});  // knocks out
  CHECK(brown.palette.at("grey") == Colour{1, 1, 1, 1});   // a tint of black knocks out
  CHECK(brown.palette.at("ink").a == 0);                   // solid black overprints
  CHECK(brown.palette.at("halo") == Colour{1, 1, 1, 0.85});
  CHECK_FALSE(brown.relief.hillshade);  // the relief is on the black plate
  style::Style black = style::load_style(dir / "s.yaml", "black");
  CHECK(black.palette.at("ink") == Colour{0, 0, 0, 1});
  CHECK(black.palette.at("grey").r == Approx(0.6));
  CHECK(black.relief.hillshade);
  // A colour of no ink cannot be separated: an error at its key.
  test::write_text(dir / "m.yaml", with_mauve());
  CHECK_NOTHROW(style::load_style(dir / "m.yaml"));
  try {
    (void)style::load_style(dir / "m.yaml", "blue");
    FAIL("expected an error");
  } catch (const Error& e) {
    CHECK(e.kind() == Error::Kind::input);
    CHECK(e.where().key_path == "colours.mauve");
  }
  try {
    (void)style::load_style(dir / "s.yaml", "green");
    FAIL("expected an error");
  } catch (const Error& e) {
    CHECK(std::string(e.what()).find("press.inks") != std::string::npos);
  }
}
