#include "sheetmill/sheet/layout.hpp"

#include <cairo-pdf.h>

#include <catch2/catch.hpp>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/grid.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"
#include "sheetmill/text/shaping.hpp"
#include "support/pdf_words.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::sheet;

namespace {

project::Project utm_project() {
  project::Project p;
  p.crs = "EPSG:32633";
  p.scale = 25000;
  p.paper = {"A1", 841, 594};
  p.extent.box = Box::of(500000, 5200000, 510000, 5208000);
  return p;
}

}  // namespace

// Common practice / definition of scale: at 1:25 000, 1 km on the ground is 1 000 000 mm / 25 000
// = 40 mm on paper; the brief allows 0.05 mm.
TEST_CASE("the frame is at the exact scale", "[sheet]") {
  style::Style style;
  auto L = compute_layout(utm_project(), style, std::nullopt);
  Point a = L.frame.to_page({501000, 5204000}), b = L.frame.to_page({502000, 5204000});
  CHECK(distance(a, b) == Approx(40.0).margin(0.05));
  CHECK(L.map_box_mm.width() == Approx(400.0).margin(1e-9));
  CHECK(L.map_box_mm.height() == Approx(320.0).margin(1e-9));
  // Everything stays on the paper, inside the margins.
  double m = style.furniture.margin_mm;
  for (const Box& b : {L.collar_box_mm, L.title_box_mm, L.legend_box_mm, L.scale_box_mm,
                       L.north_box_mm, L.notes_box_mm, L.diagrams_box_mm}) {
    CHECK(b.min_x >= m - 1e-9);
    CHECK(b.min_y >= m - 1e-9);
    CHECK(b.max_x <= L.page_w_mm - m + 1e-9);
    CHECK(b.max_y <= L.page_h_mm - m + 1e-9);
  }
  CHECK(L.legend_box_mm.min_x > L.collar_box_mm.max_x);
  // Other scales: 1:24 000 puts 2 000 ft in one inch (common practice, US 7.5' quadrangles).
  auto p = utm_project();
  p.scale = 24000;
  auto L24 = compute_layout(p, style, std::nullopt);
  Point c = L24.frame.to_page({501000, 5204000});
  Point d = L24.frame.to_page({501000 + 2000 * kMetresPerFoot, 5204000});
  CHECK(distance(c, d) == Approx(25.4).margin(0.05));
}

TEST_CASE("an extent too large for the paper is an input error", "[sheet]") {
  auto p = utm_project();
  p.extent.box = Box::of(500000, 5200000, 530000, 5208000);  // 1200 mm wide at 1:25 000
  style::Style style;
  CHECK_THROWS_AS(compute_layout(p, style, std::nullopt), Error);
}

TEST_CASE("an extent from a centre fills the map area", "[sheet]") {
  auto p = utm_project();
  p.extent = {};
  p.extent.centre = Point{505000, 5204000};
  style::Style style;
  auto L = compute_layout(p, style, std::nullopt);
  CHECK(L.frame.ground.centre().x == Approx(505000));
  CHECK(L.frame.ground.centre().y == Approx(5204000));
  CHECK(L.map_box_mm.width() == std::floor(L.map_box_mm.width()));
  CHECK(L.map_box_mm.width() > 600);
}

// The grid labels land where their lines are: pdftotext (poppler, an outside reader) reports the
// words' boxes; a label's principal digits are centred on the easting's page position
// x = origin + (E - E_min) x 1000 / N, computed here from the scale alone.
TEST_CASE("grid label positions on the page", "[sheet]") {
  test::TempDir dir("grid");
  style::Style style;
  auto L = compute_layout(utm_project(), style, std::nullopt);
  text::FontCache fonts;
  auto pdf = dir / "grid.pdf";
  {
    CairoSurfacePtr surface(
        cairo_pdf_surface_create(pdf.c_str(), L.page_w_mm * kPtPerMm, L.page_h_mm * kPtPerMm));
    CairoPtr cr(cairo_create(surface.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    GridOptions opt;
    opt.graticule = false;
    draw_neatline_and_grid(cr.get(), L, style, fonts, opt);
    cr.reset();
    cairo_surface_finish(surface.get());
  }
  auto words = test::pdf_words(pdf);
  REQUIRE(!words.empty());
  const double origin_x = L.map_box_mm.min_x;
  // poppler splits words where the type size changes, so the large principal digits are a word
  // of their own: "03" of easting 503 000 above and below the frame.
  double x = origin_x + (503000 - 500000) * 1000.0 / 25000;
  int found = 0;
  for (const auto& w : words) {
    bool above = w.box_mm().max_y<L.map_box_mm.min_y, below = w.box_mm().min_y> L.map_box_mm.max_y;
    if (w.text != "03" || !(above || below)) continue;
    ++found;
    CHECK(w.box_mm().centre().x == Approx(x).margin(0.2));
  }
  CHECK(found == 2);
  // Northing 5 204 000 ("52" small, "04" large) left and right of the frame, reading up the
  // page: the principal digits' advance is centred on the line, so their word box is too.
  double y = L.map_box_mm.min_y + (5208000 - 5204000) * 1000.0 / 25000;
  found = 0;
  for (const auto& w : words) {
    bool left = w.box_mm().max_x<L.map_box_mm.min_x, right = w.box_mm().min_x> L.map_box_mm.max_x;
    if (w.text != "04" || !(left || right)) continue;
    ++found;
    CHECK(w.box_mm().centre().y == Approx(y).margin(0.2));
  }
  CHECK(found == 2);
  // Full values at the corners: the westernmost easting carries "000m" and "E".
  bool full = false;
  for (std::size_t i = 0; i + 1 < words.size(); ++i) {
    full = full || (words[i].text == "000m" && words[i + 1].text == "E");
  }
  CHECK(full);
}

// A second grid in the neighbouring UTM zone (EPSG:32634): its lines are curves on this sheet,
// labelled in kilometres. The line through the sheet centre is found by PROJ independently of the
// drawing code and its label must be in the page's text.
TEST_CASE("second grid in another CRS", "[sheet]") {
  test::TempDir dir("grid2");
  style::Style style;
  auto L = compute_layout(utm_project(), style, std::nullopt);
  text::FontCache fonts;
  auto pdf = dir / "grid2.pdf";
  {
    CairoSurfacePtr surface(
        cairo_pdf_surface_create(pdf.c_str(), L.page_w_mm * kPtPerMm, L.page_h_mm * kPtPerMm));
    CairoPtr cr(cairo_create(surface.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    GridOptions opt;
    opt.graticule = false;
    opt.second_grid_crs = "EPSG:32634";
    opt.second_interval_m = 1000;
    draw_neatline_and_grid(cr.get(), L, style, fonts, opt);
    REQUIRE(cairo_status(cr.get()) == CAIRO_STATUS_SUCCESS);
    cr.reset();
    cairo_surface_finish(surface.get());
  }
  Reprojector to2("EPSG:32633", "EPSG:32634");
  Point c2 = to2.forward(L.frame.ground.centre());
  std::string km = std::to_string(static_cast<long>(std::floor(c2.x / 1000)));
  bool found = false;
  for (const auto& w : test::pdf_words(pdf)) found = found || w.text == km;
  CHECK(found);
}
