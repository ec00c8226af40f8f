// Contour value labels through the API: on index contours only, top of the figures uphill
// (unless upright), never overlapping, spaced along the line, shaped text drawn as real text.
#include <catch2/catch.hpp>
#include <cmath>
#include <cstdlib>

#include "contours/synthetic_dem.hpp"
#include "sheetmill/contours/contour_labels.hpp"
#include "sheetmill/contours/draw_contours.hpp"
#include "sheetmill/contours/generate.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/labels/candidate.hpp"

using namespace sheetmill;
using namespace sheetmill::contours;

namespace {

// A hill and a hollow on a tilted plane, with its analytic gradient.
struct Surface {
  Point hill{2500, 2500}, hollow{5500, 2000};
  double z(double x, double y) const {
    double r1 = distance({x, y}, hill), r2 = distance({x, y}, hollow);
    return 300 + 0.02 * x + 250 * std::exp(-r1 * r1 / (2 * 900.0 * 900)) -
           150 * std::exp(-r2 * r2 / (2 * 700.0 * 700));
  }
  Point gradient(double x, double y) const {
    Point d1{x - hill.x, y - hill.y}, d2{x - hollow.x, y - hollow.y};
    double e1 = 250 * std::exp(-dot(d1, d1) / (2 * 900.0 * 900)) / (900.0 * 900);
    double e2 = -150 * std::exp(-dot(d2, d2) / (2 * 700.0 * 700)) / (700.0 * 700);
    return Point{0.02 - e1 * d1.x - e2 * d2.x, -e1 * d1.y - e2 * d2.y};
  }
};

style::ContourStyle label_style(bool upright) {
  style::ContourStyle s;
  s.label.text_template = "{elevation_m}";
  s.label.size_pt = 7;
  s.label.font.family = "DejaVu Sans";
  s.label_spacing_mm = 40;
  s.labels_upright = upright;
  return s;
}

struct Placed {
  text::Quad box;
  LabelGeometry geom;
};

std::vector<Placed> place_all(ContourLabels& cl, const MapFrame& frame) {
  text::CollisionIndex index(frame.page_box_mm().expanded(10), 10);
  labels::place(cl.candidates, index);
  std::vector<Placed> out;
  for (std::size_t c = 0; c < cl.candidates.size(); ++c) {
    const auto& cand = cl.candidates[c];
    if (!cand.chosen) continue;
    out.push_back({cand.placements[*cand.chosen].footprint[0], cl.geometry[c][*cand.chosen]});
  }
  return out;
}

}  // namespace

TEST_CASE("contour labels: index only, uphill, no overlaps, upright option", "[contours]") {
  Surface surf;
  auto dem =
      synthetic::make_dem(400, 250, 20, 0, 5000, [&](double x, double y) { return surf.z(x, y); });
  ContourParams p;
  p.interval_m = 10;
  p.scale_denominator = 25000;  // 8 km x 5 km -> 320 x 200 mm
  auto lines = generate(dem, p);
  MapFrame frame;
  frame.scale_denominator = 25000;
  frame.ground = dem.grid.bounds();
  frame.page_origin_mm = {20, 20};
  text::FontCache fonts;

  for (bool upright : {false, true}) {
    auto style = label_style(upright);
    auto cl = contour_label_candidates(lines, dem, frame, style, fonts);
    REQUIRE(cl.candidates.size() == cl.geometry.size());
    auto placed = place_all(cl, frame);
    INFO("upright " << upright << ", placed " << placed.size());
    CHECK(placed.size() >= 20);
    for (const auto& pl : placed) {
      CHECK(lines[pl.geom.line].index);  // values on index contours only
      CHECK_FALSE(lines[pl.geom.line].supplementary);
      Point g = frame.to_ground(pl.geom.centre_mm);
      Point grad = surf.gradient(g.x, g.y);  // analytic, ground (E, N)
      Point uphill_page{grad.x, -grad.y};    // page y runs down
      if (upright) {
        // Upright: the baseline runs left to right on the page (cos of the angle >= 0).
        CHECK(std::cos(pl.geom.angle_rad) >= -1e-9);
      } else {
        // Common practice: the top of the figures faces uphill (within 90 degrees).
        CHECK(dot(pl.geom.up_mm, uphill_page) > 0);
      }
      // The figures sit on their line: its centre is within a hair of the contour (page mm).
      const auto& ground = lines[pl.geom.line].ground;
      double best = 1e9;
      for (std::size_t i = 0; i + 1 < ground.size(); ++i) {
        Point a = frame.to_page(ground[i]), b = frame.to_page(ground[i + 1]);
        Point d = b - a;
        double t = std::clamp(dot(pl.geom.centre_mm - a, d) / std::max(dot(d, d), 1e-12), 0.0, 1.0);
        best = std::min(best, distance(pl.geom.centre_mm, a + d * t));
      }
      CHECK(best < 0.01);
    }
    // No two label boxes overlap (the text stage's exact separating-axis test).
    for (std::size_t i = 0; i < placed.size(); ++i)
      for (std::size_t j = i + 1; j < placed.size(); ++j)
        CHECK_FALSE(text::quads_overlap(placed[i].box, placed[j].box));
    // Along one line, placed labels keep at least half the spacing apart (page mm).
    for (std::size_t i = 0; i < placed.size(); ++i)
      for (std::size_t j = i + 1; j < placed.size(); ++j)
        if (placed[i].geom.line == placed[j].geom.line)
          CHECK(distance(placed[i].geom.centre_mm, placed[j].geom.centre_mm) >= 0.25 * 40);
  }
}

TEST_CASE("a chosen label cuts its line and draws real text", "[contours]") {
  Surface surf;
  auto dem =
      synthetic::make_dem(200, 150, 20, 0, 3000, [&](double x, double y) { return surf.z(x, y); });
  ContourParams p;
  p.interval_m = 10;
  auto lines = generate(dem, p);
  MapFrame frame;
  frame.scale_denominator = 25000;
  frame.ground = dem.grid.bounds();
  text::FontCache fonts;
  auto style = label_style(false);
  style.line.strokes = {style::Stroke{}};
  style.index_line.strokes = {style::Stroke{}};
  auto cl = contour_label_candidates(lines, dem, frame, style, fonts);
  text::CollisionIndex index(frame.page_box_mm().expanded(10), 10);
  labels::place(cl.candidates, index);
  auto gaps = label_gaps(cl.candidates);
  REQUIRE_FALSE(gaps.empty());
  // A PDF surface records the text as text: cairo_show_text_glyphs is what draw_text uses; here
  // we only make sure drawing runs cleanly on a vector surface.
  CairoSurfacePtr surface(cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, nullptr));
  CairoPtr cr(cairo_create(surface.get()));
  draw_contours(cr.get(), lines, cl.candidates, frame, style);
  labels::draw_placed(cr.get(), cl.candidates);
  CHECK(cairo_status(cr.get()) == CAIRO_STATUS_SUCCESS);
  if (const char* dump = std::getenv("SHEETMILL_CONTOUR_PNG")) {  // for a look by eye
    CairoSurfacePtr img(cairo_image_surface_create(CAIRO_FORMAT_ARGB32, 1200, 900));
    CairoPtr icr(cairo_create(img.get()));
    cairo_set_source_rgb(icr.get(), 1, 1, 1);
    cairo_paint(icr.get());
    cairo_scale(icr.get(), 10, 10);
    draw_contours(icr.get(), lines, cl.candidates, frame, style);
    labels::draw_placed(icr.get(), cl.candidates);
    cairo_surface_write_to_png(img.get(), dump);
  }
}
