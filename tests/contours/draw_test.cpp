// Drawing: depression ticks land on the downhill side, and lines break behind chosen labels.
// Checked on the rendered pixels, not on our own geometry.
#include <catch2/catch.hpp>
#include <cmath>

#include "contours/synthetic_dem.hpp"
#include "sheetmill/contours/contour_labels.hpp"
#include "sheetmill/contours/draw_contours.hpp"
#include "sheetmill/contours/generate.hpp"
#include "sheetmill/core/handles.hpp"

using namespace sheetmill;
using namespace sheetmill::contours;

namespace {

constexpr double kPxPerMm = 10;

style::ContourStyle plain_style() {
  style::ContourStyle s;
  style::Stroke ink{{0, 0, 0, 1}, 0.15, style::LineCap::butt, style::LineJoin::round, {}, 0, 0, 0};
  s.line.strokes = {ink};
  s.index_line.strokes = {ink};
  s.index_line.strokes[0].width_mm = 0.3;
  s.depression_ticks.strokes = {ink};
  s.tick_spacing_mm = 1.0;
  s.tick_length_mm = 0.8;
  return s;
}

struct Canvas {
  CairoSurfacePtr surface;
  CairoPtr cr;
  int w, h;
  Canvas(double w_mm, double h_mm)
      : w(static_cast<int>(w_mm * kPxPerMm)), h(static_cast<int>(h_mm * kPxPerMm)) {
    surface.reset(cairo_image_surface_create(CAIRO_FORMAT_ARGB32, w, h));
    cr.reset(cairo_create(surface.get()));
    cairo_scale(cr.get(), kPxPerMm, kPxPerMm);  // user space = page mm, as on a sheet
  }
  // Ink (alpha) at page position p, in 0..255.
  int ink(Point p) {
    cairo_surface_flush(surface.get());
    int x = static_cast<int>(p.x * kPxPerMm), y = static_cast<int>(p.y * kPxPerMm);
    if (x < 0 || y < 0 || x >= w || y >= h) return 0;
    auto* data = cairo_image_surface_get_data(surface.get());
    int stride = cairo_image_surface_get_stride(surface.get());
    return data[y * stride + x * 4 + 3];
  }
};

MapFrame frame_for(const terrain::Dem& dem, double scale) {
  MapFrame f;
  f.scale_denominator = scale;
  f.ground = dem.grid.bounds();
  return f;
}

}  // namespace

TEST_CASE("depression ticks point toward lower ground", "[contours]") {
  // A paraboloid pit z = a r^2 (lowest at the centre): every ring is a depression contour and
  // its downhill side is the inside (analytic). One ring of r = 1000 m is drawn at 1:25 000
  // (40 mm on paper); ticks of 0.8 mm must ink the annulus 0.4 mm inside the ring, and leave
  // the annulus 0.4 mm outside it blank.
  const Point c{1500, 1500};
  auto dem = synthetic::make_dem(300, 300, 10, 0, 3000, [&](double x, double y) {
    double r = distance({x, y}, c);
    return 0.001 * r * r;
  });
  ContourParams p;
  p.interval_m = 1000;  // the ring z = 1000 m (r = 1000 m); higher levels hit the grid's edge
  auto lines = generate(dem, p);
  std::erase_if(lines, [](const ContourLine& l) { return l.elevation_m != 1000; });
  REQUIRE(lines.size() == 1);
  REQUIRE(lines[0].depression);
  MapFrame frame = frame_for(dem, 25000);
  Canvas canvas(frame.width_mm(), frame.height_mm());
  draw_contours(canvas.cr.get(), lines, {}, frame, plain_style());
  Point centre = frame.to_page(c);
  double r_mm = 1000 * frame.mm_per_metre();
  int inside_hits = 0, outside_hits = 0, samples = 720;
  for (int k = 0; k < samples; ++k) {
    double a = 2 * kPi * k / samples;
    Point dir{std::cos(a), std::sin(a)};
    inside_hits += canvas.ink(centre + dir * (r_mm - 0.45)) > 64;
    outside_hits += canvas.ink(centre + dir * (r_mm + 0.45)) > 64;
  }
  // Ticks 0.15 mm wide every 1 mm of a 251 mm ring: about 15 % of the inside samples.
  CHECK(inside_hits > samples / 20);
  CHECK(outside_hits == 0);
}

TEST_CASE("lines break behind a chosen label footprint", "[contours]") {
  auto dem = synthetic::make_dem(200, 100, 10, 0, 1000, [](double x, double) { return x / 10; });
  ContourParams p;
  p.interval_m = 50;  // vertical lines at x = 500, 1000, 1500 m
  auto lines = generate(dem, p);
  MapFrame frame = frame_for(dem, 10000);  // 200 x 100 mm
  labels::Candidate cand;
  cand.layer = kContourLabelLayer;
  labels::Placement pl;
  pl.footprint = {text::box_quad(Box::of(45, 40, 55, 60))};  // across the line at x = 50 mm
  cand.placements = {pl};
  cand.chosen = 0;
  Canvas canvas(frame.width_mm(), frame.height_mm());
  draw_contours(canvas.cr.get(), lines, {cand}, frame, plain_style());
  CHECK(canvas.ink({50, 30}) > 64);   // line above the gap
  CHECK(canvas.ink({50, 50}) == 0);   // gap
  CHECK(canvas.ink({50, 70}) > 64);   // line below
  CHECK(canvas.ink({100, 50}) > 64);  // the next line is untouched
}
