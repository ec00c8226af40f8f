#include "sheetmill/text/shaping.hpp"

#include <cairo-pdf.h>
#include <hb.h>

#include <catch2/catch.hpp>

#include "sheetmill/core/units.hpp"
#include "sheetmill/text/collision_index.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

TEST_CASE("shaped width is HarfBuzz's advance sum at the point size", "[text]") {
  text::FontCache fonts;
  text::FontKey key{"DejaVu Sans", 400, false};
  auto t = text::shape(fonts, key, 10, "Harrowby");
  REQUIRE(t.runs.size() == 1);
  // Oracle: HarfBuzz's own advances for the same face, in font units, scaled to 10 pt in mm.
  const text::Font& f = fonts.primary(key);
  hb_buffer_t* b = hb_buffer_create();
  hb_buffer_add_utf8(b, "Harrowby", -1, 0, -1);
  hb_buffer_guess_segment_properties(b);
  hb_shape(f.hb(), b, nullptr, 0);
  unsigned n = 0;
  hb_glyph_position_t* pos = hb_buffer_get_glyph_positions(b, &n);
  double sum = 0;
  for (unsigned i = 0; i < n; ++i) sum += pos[i].x_advance;
  hb_buffer_destroy(b);
  CHECK(t.width_mm == Approx(sum * 10 * kMmPerPt / f.units_per_em()));
  CHECK(t.ascent_mm > 0);
  CHECK(t.descent_mm > 0);
  // Letter spacing adds exactly (letters - 1) ems of the requested fraction.
  auto spaced = text::shape(fonts, key, 10, "Harrowby", 0.2);
  CHECK(spaced.width_mm == Approx(t.width_mm + 7 * 0.2 * 10 * kMmPerPt));
}

TEST_CASE("text is real text in the PDF, with fallback fonts for other scripts", "[text]") {
  test::TempDir dir;
  auto pdf = dir / "t.pdf";
  {
    text::FontCache fonts;
    CairoSurfacePtr s(cairo_pdf_surface_create(pdf.c_str(), 300, 200));
    CairoPtr cr(cairo_create(s.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    text::TextPaint paint;
    paint.halo = true;
    text::FontKey key{"DejaVu Sans", 700, false};
    text::draw_text(cr.get(), text::shape(fonts, key, 12, "Öster Fjällby"), {10, 20}, 0, paint);
    // Devanagari is not in DejaVu Sans: fontconfig's fallback (Noto, fonts-noto-core) supplies it.
    auto deva = text::shape(fonts, key, 12, "नमस्ते Kalvo");
    CHECK(deva.runs.size() >= 2);
    text::draw_text(cr.get(), deva, {10, 40}, 0, paint);
    cr.reset();
    cairo_surface_finish(s.get());
  }
  auto txt = test::run_command({"pdftotext", pdf.string(), "-"});
  REQUIRE(txt.exit_code == 0);
  CHECK(txt.out.find("Öster Fjällby") != std::string::npos);
  CHECK(txt.out.find("Kalvo") != std::string::npos);
  auto fonts = test::run_command({"pdffonts", pdf.string()});
  CHECK(fonts.out.find("DejaVuSans-Bold") != std::string::npos);
  CHECK(fonts.out.find("Noto") != std::string::npos);
}

TEST_CASE("glyphs follow a path and refuse sharp bends and the line's end", "[text]") {
  text::FontCache fonts;
  auto t = text::shape(fonts, {}, 8, "Millbeck");
  Polyline straight{{0, 0}, {100, 0}};
  auto placed = text::layout_on_path(t, straight, 10);
  REQUIRE(placed.size() == t.runs[0].glyphs.size());
  CHECK(placed.front().origin_mm.x == Approx(10 + t.runs[0].glyphs[0].x_mm));
  CHECK(placed.front().angle_rad == Approx(0));
  CHECK(text::layout_on_path(t, straight, 100 - t.width_mm / 2).empty());
  Polyline hairpin{{0, 0}, {t.width_mm / 2, 0}, {0, 1}};
  CHECK(text::layout_on_path(t, hairpin, 0, 30).empty());
}

TEST_CASE("collision index finds overlaps of rotated boxes exactly", "[text]") {
  text::CollisionIndex index(Box::of(0, 0, 200, 200), 10);
  index.insert(text::rotated_box({50, 50}, 20, 5, 0));
  CHECK_FALSE(index.is_free(text::rotated_box({60, 52}, 5, 5, 0)));
  CHECK(index.is_free(text::rotated_box({50, 60}, 20, 5, 0)));
  // A box rotated 45 degrees whose bounding box overlaps but whose body does not.
  auto diag = text::rotated_box({72, 40}, 10, 1, 3.14159265 / 4);
  CHECK(index.is_free(diag));
  index.set_bounds(Box::of(0, 0, 100, 100));
  CHECK_FALSE(index.is_free(text::rotated_box({95, 20}, 10, 2, 0)));
}
