// Halos under their glyphs, one scene per test in the manner of Cairo's own test suite
// (cairo/test/README: draw one scene, rasterise, compare with a stored reference). Each scene is
// drawn the way a sheet is: into a recording surface in page millimetres, replayed onto a PDF
// surface (src/pdf/layered_canvas.cpp does the same), then rasterised by poppler's pdftoppm at
// 1200 dpi, an outside renderer. The halo is pure red and the glyphs black on white, so each
// pixel tells both coverages apart: with glyph coverage k over halo coverage h,
// R = 1 - k and G = (1 - k)(1 - h); the ink of halo-or-glyph is 1 - G and the glyphs' is 1 - R.
// The two centroids must coincide within 0.05 mm (issue #13). The texts are chosen so that this
// holds analytically for a correct halo: a stroke along a glyph's outline keeps any centre of
// symmetry of the glyph, so a text that is point-symmetric as a whole ("NOON", "HOH") or made of
// copies of one point-symmetric glyph placed symmetrically ("OOOOO" on a symmetric arc) has the
// same centroid with and without its halo. (Texts without that symmetry differ by design, since
// a halo adds ink in proportion to each glyph's outline length, not its area.)

#include <cairo-pdf.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <cstdlib>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/text/shaping.hpp"
#include "support/raster_compare.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

constexpr double kPageWmm = 40, kPageHmm = 20;
constexpr double kDpi = 1200;
constexpr double kMaxCentroidOffsetMm = 0.05;  // issue #13

struct Centroids {
  Point glyph_mm, union_mm;
  double glyph_mass = 0, union_mass = 0;
};

Centroids centroids_of(const std::filesystem::path& png) {
  CairoSurfacePtr s(cairo_image_surface_create_from_png(png.c_str()));
  REQUIRE(cairo_surface_status(s.get()) == CAIRO_STATUS_SUCCESS);
  const int w = cairo_image_surface_get_width(s.get()), h = cairo_image_surface_get_height(s.get());
  const int stride = cairo_image_surface_get_stride(s.get());
  const unsigned char* d = cairo_image_surface_get_data(s.get());
  const double mm_per_px = kMmPerInch / kDpi;
  Centroids c;
  double gx = 0, gy = 0, ux = 0, uy = 0;
  for (int y = 0; y < h; ++y)
    for (int x = 0; x < w; ++x) {
      // Cairo's ARGB32/RGB24 in memory: B, G, R, A on little-endian machines.
      const double g = d[y * stride + 4 * x + 1] / 255.0, r = d[y * stride + 4 * x + 2] / 255.0;
      const double px = (x + 0.5) * mm_per_px, py = (y + 0.5) * mm_per_px;
      const double k = 1 - r, u = 1 - g;
      gx += k * px, gy += k * py, c.glyph_mass += k;
      ux += u * px, uy += u * py, c.union_mass += u;
    }
  REQUIRE(c.glyph_mass > 0);
  c.glyph_mm = {gx / c.glyph_mass, gy / c.glyph_mass};
  c.union_mm = {ux / c.union_mass, uy / c.union_mass};
  return c;
}

text::TextPaint red_halo() {
  text::TextPaint p;
  p.colour = Colour{0, 0, 0, 1};
  p.halo = true;
  p.halo_colour = Colour{1, 0, 0, 1};
  p.halo_width_mm = 0.3;
  return p;
}

// Draws `scene` the way a sheet is drawn, writes the PDF, rasterises it at 1200 dpi and returns
// the PNG's path (inside `dir`).
template <class Scene>
std::filesystem::path render_scene(const test::TempDir& dir, const std::string& name, Scene scene) {
  cairo_rectangle_t extents{0, 0, kPageWmm, kPageHmm};
  CairoSurfacePtr rec(cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, &extents));
  {
    CairoPtr cr(cairo_create(rec.get()));
    scene(cr.get());
    REQUIRE(cairo_status(cr.get()) == CAIRO_STATUS_SUCCESS);
  }
  const auto pdf = dir / (name + ".pdf");
  {
    CairoSurfacePtr s(
        cairo_pdf_surface_create(pdf.c_str(), kPageWmm * kPtPerMm, kPageHmm * kPtPerMm));
    CairoPtr cr(cairo_create(s.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    cairo_set_source_surface(cr.get(), rec.get(), 0, 0);
    cairo_paint(cr.get());
    cr.reset();
    cairo_surface_finish(s.get());
    REQUIRE(cairo_surface_status(s.get()) == CAIRO_STATUS_SUCCESS);
  }
  auto r = test::run_command(
      {"pdftoppm", "-r", "1200", "-png", "-singlefile", pdf.string(), (dir / name).string()});
  REQUIRE(r.exit_code == 0);
  return dir / (name + ".png");
}

void check_scene(const std::string& name, const std::filesystem::path& png) {
  const Centroids c = centroids_of(png);
  INFO(name << ": glyph centroid " << c.glyph_mm.x << ", " << c.glyph_mm.y << " mm; halo "
            << c.union_mm.x << ", " << c.union_mm.y << " mm");
  CHECK(c.union_mass > c.glyph_mass * 1.5);  // the halo is really there
  CHECK(distance(c.glyph_mm, c.union_mm) <= kMaxCentroidOffsetMm);
  test::check_against_reference(png, "text", name);
}

}  // namespace

TEST_CASE("a horizontal label's halo lies under its glyphs", "[text][halo]") {
  test::TempDir dir("halo-h");
  text::FontCache fonts;
  const auto t = text::shape(fonts, {"DejaVu Sans", 400, false}, 9, "HOH");
  auto png = render_scene(dir, "halo_horizontal", [&](cairo_t* cr) {
    text::draw_text(cr, t, {6, 12}, 0, red_halo());
  });
  check_scene("halo_horizontal", png);
}

TEST_CASE("a rotated label's halo lies under its glyphs", "[text][halo]") {
  test::TempDir dir("halo-r");
  text::FontCache fonts;
  const auto t = text::shape(fonts, {"DejaVu Sans", 700, false}, 8, "NOON");
  auto png = render_scene(dir, "halo_rotated", [&](cairo_t* cr) {
    text::draw_text(cr, t, {8, 16}, -20 * kDegToRad, red_halo());
  });
  check_scene("halo_rotated", png);
}

TEST_CASE("a curved label's halo lies under its glyphs", "[text][halo]") {
  test::TempDir dir("halo-c");
  text::FontCache fonts;
  const auto t = text::shape(fonts, {"DejaVu Sans", 400, true}, 8, "OOOOO");
  Polyline arc;
  for (int i = 0; i <= 40; ++i) {
    const double a = kPi * (1.25 + 0.5 * i / 40.0);  // symmetric about its apex (20, 8)
    arc.push_back({20 + 30 * std::cos(a), 38 + 30 * std::sin(a)});
  }
  const auto glyphs = text::layout_on_path(t, arc, (30 * kPi / 2 - t.width_mm) / 2, 30, 0);
  REQUIRE_FALSE(glyphs.empty());
  auto png = render_scene(dir, "halo_curved", [&](cairo_t* cr) {
    text::draw_placed_glyphs(cr, t, glyphs, red_halo());
  });
  check_scene("halo_curved", png);
}
