// Road numbers keep clear of the railway (issue 13): on the demo sheet, every placed road-number
// label (its glyph boxes, from the descender to the ascender, in page mm) lies outside the
// railway symbol's buffer: the railway as drawn, grown by the half-width of its ink (the 0.5 mm
// track and the 1.3 mm sleeper ticks with their 0.2 mm pen, from the field style). The labels are
// placed as the render places them: the names of every layer against the obstacles of the
// layers marked blocks_labels.
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

#include "render/render_support.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/render/feature_layers.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

using namespace sheetmill;

namespace {

double segment_distance(Point a, Point b, Point c, Point d) {
  auto point_segment = [](Point p, Point s0, Point s1) {
    const Point v = s1 - s0;
    const double l2 = dot(v, v);
    const double t = l2 > 0 ? std::clamp(dot(p - s0, v) / l2, 0.0, 1.0) : 0;
    return distance(p, s0 + v * t);
  };
  const Point r = b - a, s = d - c;
  const double den = cross(r, s);
  if (den != 0) {
    const double t = cross(c - a, s) / den, u = cross(c - a, r) / den;
    if (t >= 0 && t <= 1 && u >= 0 && u <= 1) return 0;  // they cross
  }
  return std::min({point_segment(a, c, d), point_segment(b, c, d), point_segment(c, a, b),
                   point_segment(d, a, b)});
}

bool inside_quad(Point p, const text::Quad& q) {
  double sign = 0;
  for (std::size_t i = 0; i < 4; ++i) {
    const double c = cross(q[(i + 1) % 4] - q[i], p - q[i]);
    if (c == 0) continue;
    if (sign == 0) sign = c;
    if ((c > 0) != (sign > 0)) return false;
  }
  return true;
}

// The nearest approach of a glyph box and a polyline (0 when they touch or one holds the other).
double quad_to_line(const text::Quad& q, const Polyline& l) {
  double best = std::numeric_limits<double>::infinity();
  for (std::size_t j = 0; j + 1 < l.size(); ++j)
    for (std::size_t i = 0; i < 4; ++i)
      best = std::min(best, segment_distance(q[i], q[(i + 1) % 4], l[j], l[j + 1]));
  if (!l.empty() && inside_quad(l[0], q)) best = 0;
  return best;
}

}  // namespace

TEST_CASE("road numbers on the demo sheet keep clear of the railway", "[render][labels]") {
  gdal_init();
  test::TempDir dir("road-numbers");
  const project::Project project = project::load_project(test::write_demo_project(dir));
  const style::Style style = style::load_style(project.style);
  const sheet::Layout layout = sheet::compute_layout(project, style, std::nullopt);
  text::FontCache fonts;
  render::PreparedLayers prepared;
  render::FeatureLayersResult features =
      render::prepare_feature_layers(project, style, layout.frame, fonts, prepared);

  // The railway as drawn, and its ink's half-width from the style's symbol.
  std::vector<Polyline> rails;
  double rail_half = 0;
  for (const auto& l : prepared.layers) {
    if (l.layer->id != "railways") continue;
    REQUIRE(l.layer->obstacle);  // the style marks it: labels keep off it
    for (const auto& r : l.rules) {
      for (const auto& s : r.rule->line->strokes)
        rail_half = std::max(rail_half, std::abs(s.offset_mm) + s.width_mm / 2);
      for (const auto& m : r.rule->line->marks)
        rail_half = std::max(rail_half, m.length_mm + m.stroke.width_mm / 2);
      rails.insert(rails.end(), r.lines.begin(), r.lines.end());
    }
  }
  REQUIRE_FALSE(rails.empty());
  CHECK(rail_half == Approx(1.4));

  text::CollisionIndex index(Box::of(0, 0, layout.page_w_mm, layout.page_h_mm));
  index.set_bounds(layout.frame.page_box_mm());
  index.insert_all(features.obstacles);
  labels::place(features.name_candidates, index);

  int placed = 0, near_rail = 0;
  double closest = std::numeric_limits<double>::infinity();
  std::string closest_text;
  for (const auto& c : features.name_candidates) {
    if (c.layer != "roads" || !c.chosen) continue;
    ++placed;
    double d = std::numeric_limits<double>::infinity();
    for (const text::Quad& q : c.placements[*c.chosen].footprint)
      for (const Polyline& rail : rails) d = std::min(d, quad_to_line(q, rail));
    if (d < 10) ++near_rail;  // within 10 mm: the test is not one of far-away labels only
    if (d < closest) {
      closest = d;
      closest_text = c.text + " at " + std::to_string(c.anchor_mm.x) + ", " +
                     std::to_string(c.anchor_mm.y) + " mm";
    }
  }
  INFO(placed << " road numbers placed; closest to the railway: " << closest_text << ", " << closest
              << " mm");
  REQUIRE(placed >= 5);
  CHECK(near_rail >= 1);
  CHECK(closest >= rail_half - 1e-9);
}
