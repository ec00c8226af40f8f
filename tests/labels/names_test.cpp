// Name candidates: positions around points, curved upright text along lines, interior points
// of areas. Checked against hand-computed geometry.

#include "sheetmill/labels/names.hpp"

#include <catch2/catch.hpp>
#include <cmath>
#include <map>

#include "sheetmill/core/units.hpp"
#include "sheetmill/text/shaping.hpp"

using namespace sheetmill;
using namespace sheetmill::labels;

namespace {
style::LabelStyle label(double size_pt = 8) {
  style::LabelStyle s;
  s.text_template = "{name}";
  s.size_pt = size_pt;
  s.offset_mm = 1.0;
  return s;
}
Box bounds(const std::vector<text::Quad>& qs) {
  Box b;
  for (const auto& q : qs)
    for (const Point& p : q) b.add(p);
  return b;
}
}  // namespace

TEST_CASE("templates name their fields and fill them", "[labels]") {
  CHECK(template_fields("{name} {ele} m {name}") == std::vector<std::string>{"name", "ele"});
  auto get = [](const std::string& k) -> const std::string* {
    static const std::string name = "Kestrel Tor", ele = "412";
    return k == "name" ? &name : k == "ele" ? &ele : nullptr;
  };
  CHECK(expand_template("{name} {ele} m", get) == "Kestrel Tor 412 m");
  CHECK(expand_template(" {missing} {name}", get, true) == "KESTREL TOR");
}

TEST_CASE("the pole of inaccessibility of simple shapes", "[labels]") {
  // A 10 x 6 rectangle: every point of its midline is 3 from the long sides; the best is the
  // centre line, clearance 3 (hand computation).
  std::vector<Polyline> rect{{{0, 0}, {10, 0}, {10, 6}, {0, 6}}};
  auto p = pole_of_inaccessibility(rect, 0.01);
  CHECK(p.clearance == Approx(3).margin(0.01));
  CHECK(p.at.y == Approx(3).margin(0.05));
  // A 20 x 20 square with a 10 x 10 hole in the middle. The remotest points lie on the
  // diagonals of the 5-wide ring's corners, where the distance x to the outer sides equals the
  // distance sqrt(2) (5 - x) to the hole's corner: x = 5 sqrt(2) / (1 + sqrt(2)) = 2.929
  // (hand computation).
  std::vector<Polyline> frame{{{0, 0}, {20, 0}, {20, 20}, {0, 20}},
                              {{5, 5}, {15, 5}, {15, 15}, {5, 15}}};
  auto q = pole_of_inaccessibility(frame, 0.01);
  CHECK(q.clearance == Approx(5 * std::sqrt(2.0) / (1 + std::sqrt(2.0))).margin(0.01));
  CHECK_FALSE((q.at.x > 5 && q.at.x < 15 && q.at.y > 5 && q.at.y < 15));
}

TEST_CASE("point names start to the right, then try the other positions", "[labels]") {
  text::FontCache fonts;
  auto c = point_name(fonts, label(), "Hollin Cross", {50, 50}, 0.8, "places");
  REQUIRE(c);
  REQUIRE(c->placements.size() == 6);
  Box right = bounds(c->placements[0].footprint);
  CHECK(right.min_x == Approx(50 + 0.8 + 1.0));  // symbol radius + gap
  CHECK(std::abs(right.centre().y - 50) < 0.5);  // centred on the anchor within the descender
  Box left = bounds(c->placements[3].footprint);
  CHECK(left.max_x == Approx(50 - 1.8));
  Box above = bounds(c->placements[4].footprint);
  CHECK(above.max_y <= 50 - 1.8 + 1e-9);
  CHECK(above.centre().x == Approx(50));
  for (std::size_t i = 1; i < c->placements.size(); ++i)
    CHECK(c->placements[i].cost > c->placements[i - 1].cost);
}

TEST_CASE("line names read upright and stay on the line", "[labels]") {
  text::FontCache fonts;
  auto s = label();
  // Drawn right to left: the text must still read left to right (glyph angles near 0, not pi).
  Polyline leftwards{{150, 40}, {10, 40}};
  auto cs = line_names(fonts, s, "Mere Brook", leftwards, "water");
  REQUIRE(cs.size() == 1);
  for (const auto& pl : cs[0].placements) {
    Box b = bounds(pl.footprint);
    CHECK(b.min_x >= 10 - 1e-6);
    CHECK(b.max_x <= 150 + 1e-6);
    for (const auto& q : pl.footprint) CHECK(q[1].x > q[0].x);  // boxes run left to right
  }
  // Shorter than its text: no label (never past the line's end).
  CHECK(line_names(fonts, s, "Mere Brook", {{0, 0}, {5, 0}}, "water").empty());
  // A hairpin: two 12 mm arms meeting at 10 degrees. No placement may put glyphs on both arms.
  Polyline hairpin{
      {0, 0}, {12, 0}, {12 - 12 * std::cos(10 * kDegToRad), 12 * std::sin(10 * kDegToRad)}};
  for (const auto& c : line_names(fonts, s, "Mere Brook", hairpin, "water"))
    for (const auto& pl : c.placements) {
      double a0 = std::atan2(pl.footprint.front()[1].y - pl.footprint.front()[0].y,
                             pl.footprint.front()[1].x - pl.footprint.front()[0].x);
      for (const auto& q : pl.footprint)
        CHECK(std::abs(std::remainder(std::atan2(q[1].y - q[0].y, q[1].x - q[0].x) - a0, 2 * kPi)) <
              30 * kDegToRad);
    }
  // Repeats: a 400 mm line with repeat_mm 100 gets four candidates.
  s.repeat_mm = 100;
  CHECK(line_names(fonts, s, "Mere Brook", {{0, 100}, {400, 100}}, "water").size() == 4);
}

TEST_CASE("area names stay inside and spread across large areas", "[labels]") {
  text::FontCache fonts;
  auto s = label(9);
  std::vector<Polyline> lake{{{0, 0}, {80, 0}, {80, 20}, {0, 20}}};
  auto plain = area_name(fonts, s, "Lake Ormer", lake, "water");
  REQUIRE(plain);
  Box pb = bounds(plain->placements[0].footprint);
  CHECK(pb.centre().x == Approx(40).margin(0.5));
  s.spread_in_area = true;
  auto spread = area_name(fonts, s, "Lake Ormer", lake, "water");
  REQUIRE(spread);
  Box sb = bounds(spread->placements[0].footprint);
  CHECK(sb.width() > pb.width() * 1.5);
  CHECK(sb.width() <= 0.6 * 80 + 0.5);  // at most the stated 60 % of the width (plus rounding)
  CHECK(sb.min_x > 0);
  CHECK(sb.max_x < 80);
  // Too small for the text: no candidate.
  std::vector<Polyline> pond{{{0, 0}, {3, 0}, {3, 2}, {0, 2}}};
  CHECK_FALSE(area_name(fonts, s, "Lake Ormer", pond, "water"));
}

TEST_CASE("names in accented and non-Latin scripts shape without missing glyphs", "[labels]") {
  text::FontCache fonts;
  for (const char* name : {"Llyn Ðwyrëan", "Øster Ålund", "Ποταμός", "Речка"}) {
    INFO(name);
    auto t = text::shape(fonts, text::FontKey{}, 8, name);
    REQUIRE(!t.empty());
    for (const auto& run : t.runs)
      for (const auto& g : run.glyphs) CHECK(g.glyph_id != 0);  // 0 is .notdef, a missing glyph
    CHECK(point_name(fonts, label(), name, {20, 20}, 0, "places"));
  }
}

TEST_CASE("names in Devanagari shape through a fallback face", "[labels]") {
  // fonts-noto-core installs Noto Sans Devanagari; DejaVu Sans has no Devanagari, so every
  // glyph must come from a fallback face.
  text::FontCache fonts;
  auto t = text::shape(fonts, text::FontKey{}, 8, "नदी");
  REQUIRE(!t.empty());
  for (const auto& run : t.runs)
    for (const auto& g : run.glyphs) CHECK(g.glyph_id != 0);
}

TEST_CASE("numeric fields are rounded as the label style says", "[labels][decimals]") {
  // Rounding to a fixed number of decimals, worked by hand (round half away from zero is not
  // at stake: none of these values lies on a tie in binary).
  CHECK(format_field("808.65380859375", 0) == "809");
  CHECK(format_field("808.65380859375", 1) == "808.7");
  CHECK(format_field(" 256.194 ", 2) == "256.19");
  CHECK(format_field("+12.5e1", 0) == "125");
  CHECK(format_field("-0.2", 0) == "0");  // never "-0"
  CHECK(format_field("-3.46", 1) == "-3.5");
  // Not numbers: printed as the data has them.
  CHECK(format_field("S 12", 0) == "S 12");
  CHECK(format_field("12a", 0) == "12a");
  CHECK(format_field("", 0) == "");
  CHECK(format_field("nan", 0) == "nan");

  style::LabelStyle s = label();
  s.text_template = "{name} {elevation_m}";
  s.decimals["elevation_m"] = 0;
  std::map<std::string, std::string> f{{"name", "Kestrel Top"}, {"elevation_m", "808.6538"}};
  auto value = [&](const std::string& k) -> const std::string* {
    auto it = f.find(k);
    return it == f.end() ? nullptr : &it->second;
  };
  CHECK(label_text(s, value) == "Kestrel Top 809");
  s.decimals.clear();
  CHECK(label_text(s, value) == "Kestrel Top 808.6538");
}
