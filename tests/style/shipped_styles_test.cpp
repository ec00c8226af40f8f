// The shipped styles load and hold what their comments promise.
#include <algorithm>
#include <catch2/catch.hpp>

#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::style;

namespace {

std::filesystem::path shipped(const std::string& name) {
  return test::source_dir() / "styles" / name;
}

const Layer& layer(const Style& s, const std::string& id) {
  auto it =
      std::find_if(s.layers.begin(), s.layers.end(), [&](const Layer& l) { return l.id == id; });
  REQUIRE(it != s.layers.end());
  return *it;
}

const Rule& rule(const Layer& l, const std::string& name) {
  auto it =
      std::find_if(l.rules.begin(), l.rules.end(), [&](const Rule& r) { return r.name == name; });
  REQUIRE(it != l.rules.end());
  return *it;
}

// 8-bit sRGB of a colour, for comparing with the hex in the file.
std::string hex(const Colour& c) {
  char buf[16];
  std::snprintf(buf, sizeof buf, "#%02x%02x%02x", int(c.r * 255 + 0.5), int(c.g * 255 + 0.5),
                int(c.b * 255 + 0.5));
  return buf;
}

const std::vector<std::string> kDemoSources = {
    "water_lines", "water_areas", "roads",  "tracks",  "railways",      "buildings",
    "landcover",   "power_lines", "places", "summits", "control_points"};

}  // namespace

TEST_CASE("the field style loads and symbolises every demo source", "[style]") {
  Style s = load_style(shipped("field.yaml"));
  CHECK(s.name == "Field sheet");
  // Palette spot checks against the hex written in styles/field.yaml.
  CHECK(hex(s.palette.at("water")) == "#1f6fb2");
  CHECK(s.palette.at("halo").a == Approx(0.85));
  for (const auto& src : kDemoSources) {
    INFO(src);
    CHECK(std::any_of(s.layers.begin(), s.layers.end(),
                      [&](const Layer& l) { return l.source == src; }));
  }
  // Layers come sorted by draw order; every layer names its optional-content group.
  for (std::size_t i = 1; i < s.layers.size(); ++i) {
    CHECK(s.layers[i - 1].order <= s.layers[i].order);
  }
  for (const auto& l : s.layers) CHECK_FALSE(l.group.empty());

  // Roads: casing in pass 0 under the fill in pass 1, for every class (the brief's rule).
  const Layer& roads = layer(s, "roads");
  REQUIRE(roads.rules.size() == 3);
  for (const auto& r : roads.rules) {
    INFO(r.name);
    REQUIRE(r.line);
    REQUIRE(r.line->strokes.size() == 2);
    CHECK(r.line->strokes[0].pass == 0);
    CHECK(r.line->strokes[1].pass == 1);
    CHECK(r.line->strokes[0].width_mm > r.line->strokes[1].width_mm);
    CHECK(hex(r.line->strokes[0].colour) == "#1b1b1b");
  }
  CHECK(rule(roads, "main road").filter.kind == Filter::Kind::equals);
  CHECK(roads.label->placement == LabelPlacement::line);

  // Lakes and ponds are water surfaces (contours stay out of them); nothing else is.
  for (const auto& l : s.layers) CHECK(l.water_surface == (l.source == "water_areas"));

  // Railway ticks; orchard point pattern from a named symbol; works hatched.
  const Layer& rail = layer(s, "railways");
  REQUIRE(rail.rules.size() == 1);
  REQUIRE(rail.rules[0].line->marks.size() == 1);
  CHECK(rail.rules[0].line->marks[0].spacing_mm == Approx(3.0));
  const Rule& orchard = rule(layer(s, "landcover"), "orchard");
  REQUIRE(orchard.area->pattern);
  CHECK(orchard.area->pattern->symbol.parts.at(0).kind == ShapePart::Kind::circle);
  CHECK(orchard.area->pattern->symbol.parts.at(0).size_mm == Approx(0.9));
  // Power lines split by voltage with open-ended ranges: 100 kV and above, below 100 kV.
  const Layer& power = layer(s, "power_lines");
  REQUIRE(power.rules.size() == 2);
  std::string kv110 = "110", kv20 = "20";
  CHECK(matches(power.rules[0].filter, &kv110));
  CHECK_FALSE(matches(power.rules[0].filter, &kv20));
  CHECK(matches(power.rules[1].filter, &kv20));
  CHECK(power.rules[0].line->marks.at(0).symbol->parts.at(0).kind == ShapePart::Kind::square);
  const Rule& works = rule(layer(s, "buildings"), "works");
  REQUIRE(works.area->hatches.size() == 1);
  CHECK(works.area->hatches[0].angle_deg == Approx(45));

  // Places: label-only rules; the population range comes first so it wins.
  const Layer& places = layer(s, "places");
  CHECK(places.rules.at(0).filter.kind == Filter::Kind::range);
  CHECK(places.rules.at(0).filter.min == Approx(500));
  CHECK_FALSE(places.rules.at(0).filter.max);
  CHECK(places.rules.at(0).label->size_pt == Approx(11));
  CHECK(places.rules.at(0).label->font.weight == 700);
  CHECK_FALSE(places.rules.at(0).label->may_drop);
  // based_on carries the shared label style; the rule changes only what it names.
  const Rule& hamlet = rule(places, "hamlet");
  CHECK(hamlet.label->size_pt == Approx(8.5));
  CHECK(hamlet.label->font.weight == 400);
  CHECK(hamlet.label->may_drop);
  CHECK(hamlet.label->text_template == "{name}");

  CHECK(s.relief.hillshade);
  CHECK(s.relief.method == "horn");
  CHECK(s.relief.shade_strength == Approx(0.35));
  CHECK_FALSE(s.relief.tint);
  CHECK(s.contours.index_every == 5);
  CHECK(s.contours.index_line.strokes.at(0).width_mm == Approx(0.35));
  CHECK(s.contours.supplementary);
  CHECK(s.grid.lines_across);
  CHECK(s.furniture.title.size_pt == Approx(18));
}

TEST_CASE("the exhibit style loads with a tint under soft shading and large type", "[style]") {
  Style s = load_style(shipped("exhibit.yaml"));
  CHECK(s.name == "Relief exhibit");
  CHECK(s.relief.hillshade);
  CHECK(s.relief.method == "multidirectional");
  CHECK(s.relief.shade_strength == Approx(0.3));
  REQUIRE(s.relief.tint);
  REQUIRE(s.relief.tint_stops.size() == 7);
  // The ramp is spread over `over: [230m, 1000m]`.
  CHECK(s.relief.tint_stops.front().elevation_m == Approx(230));
  CHECK(s.relief.tint_stops.back().elevation_m == Approx(1000));
  REQUIRE(s.relief.water_shade);
  CHECK(s.relief.water_shade->a == Approx(0.25));
  CHECK_FALSE(s.contours.supplementary);
  CHECK_FALSE(s.grid.lines_across);
  CHECK(layer(s, "water_areas").water_surface);
  // Large type: the exhibit's body text is larger than the field sheet's.
  Style field = load_style(shipped("field.yaml"));
  CHECK(s.furniture.body.size_pt > field.furniture.body.size_pt);
  CHECK(s.furniture.title.size_pt == Approx(36));
  const Layer& places = layer(s, "places");
  CHECK(rule(places, "village").label->size_pt == Approx(16));
  CHECK(rule(places, "hamlet").label->size_pt == Approx(12));
  CHECK(rule(places, "hamlet").label->font.weight == 400);
  CHECK(rule(places, "hamlet").label->halo->width_mm == Approx(0.9));
  const Layer& roads = layer(s, "roads");
  CHECK(roads.min_scale == 0);
  CHECK(roads.max_scale == 100000);
  for (const auto& r : roads.rules) {
    CHECK(r.line->strokes.at(0).pass == 0);
    CHECK(r.line->strokes.at(1).pass == 1);
  }
}
