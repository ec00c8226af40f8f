#include "sheetmill/sheet/collar.hpp"

#include <cairo-pdf.h>

#include <catch2/catch.hpp>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/grid.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/north_diagram.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::sheet;

namespace {

project::Project demo_project() {
  project::Project p;
  p.title = "Wrenfold Valley";
  p.subtitle = "Topographic sheet, test edition";
  p.producer = "sheetmill test suite";
  p.revision_date = "2026-12-01";
  p.crs = "EPSG:32633";
  p.scale = 25000;
  p.paper = {"A1", 841, 594};
  p.extent.box = Box::of(500000, 5200000, 510000, 5208000);
  p.magnetic.declination_deg = 4.5;
  p.magnetic.annual_change_deg = 0.12;
  p.magnetic.date = "2026-06-01";
  p.contours.interval_m = 10;
  p.elevation.vertical_datum = "EGM2008 height";
  p.data_credits = {"Roads: invented county survey 2026"};
  return p;
}

style::Rule rule(const std::string& name, const std::string& legend) {
  style::Rule r;
  r.name = name;
  r.legend = legend;
  style::LineSymbol line;
  line.strokes.push_back(style::Stroke{});
  r.line = line;
  return r;
}

std::string render_to_text(const project::Project& p, const style::Style& style,
                           const std::vector<const style::Rule*>& rules, const test::TempDir& dir) {
  auto L = compute_layout(p, style, std::nullopt);
  auto info = describe_sheet(p, L);
  text::FontCache fonts;
  auto pdf = dir / "sheet.pdf";
  {
    CairoSurfacePtr s(
        cairo_pdf_surface_create(pdf.c_str(), L.page_w_mm * kPtPerMm, L.page_h_mm * kPtPerMm));
    CairoPtr cr(cairo_create(s.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    draw_neatline_and_grid(cr.get(), L, style, fonts);
    draw_collar(cr.get(), L, p, style, info, rules, fonts);
    REQUIRE(cairo_status(cr.get()) == CAIRO_STATUS_SUCCESS);
    cr.reset();
    cairo_surface_finish(s.get());
  }
  auto txt = dir / "sheet.txt";
  auto r = test::run_command({"pdftotext", "-raw", pdf.string(), txt.string()});
  REQUIRE(r.exit_code == 0);
  return test::read_text(txt);
}

// Spaces and line breaks as one space, so a paragraph's wrapping does not matter.
std::string squash(const std::string& s) {
  std::string out;
  for (char c : s) {
    bool ws = c == ' ' || c == '\n' || c == '\t';
    if (ws && !out.empty() && out.back() == ' ') continue;
    out += ws ? ' ' : c;
  }
  return out;
}

}  // namespace

TEST_CASE("the collar states title, scale, datums, north and the caution", "[sheet]") {
  test::TempDir dir("collar");
  style::Style style;
  auto text = squash(render_to_text(demo_project(), style, {}, dir));
  CHECK(text.find("Wrenfold Valley") != std::string::npos);
  CHECK(text.find("1:25 000") != std::string::npos);
  CHECK(text.find("Contour interval 10 m") != std::string::npos);
  CHECK(text.find("EGM2008 height") != std::string::npos);
  CHECK(text.find("EPSG:32633") != std::string::npos);
  CHECK(text.find("Transverse Mercator") != std::string::npos);
  CHECK(text.find("not a survey") != std::string::npos);
  CHECK(text.find("licensed surveyor") != std::string::npos);
  CHECK(text.find("Magnetic declination 2026-06-01") != std::string::npos);
  CHECK(text.find("4.50\u00B0 E") != std::string::npos);
  CHECK(text.find("Grid-magnetic angle") != std::string::npos);
  CHECK(text.find("invented county survey") != std::string::npos);
}

TEST_CASE("the legend lists exactly the rules present", "[sheet]") {
  test::TempDir dir("legend");
  style::Style style;
  style::Rule a = rule("a", "Trunk road"), b = rule("b", "Footpath"), c = rule("c", "Ferry route");
  style::Rule hidden = rule("d", "");
  // The render passes the rules drawn on this sheet: a, c and one without legend text.
  auto text = squash(render_to_text(demo_project(), style, {&a, &c, &hidden, &a}, dir));
  CHECK(text.find("Trunk road") != std::string::npos);
  CHECK(text.find("Ferry route") != std::string::npos);
  CHECK(text.find("Footpath") == std::string::npos);
  // Listed once though passed twice.
  CHECK(text.find("Trunk road") == text.rfind("Trunk road"));
  (void)b;
}

// Grid north up the page; true north at -convergence; magnetic north at declination -
// convergence from grid north. Exaggeration keeps the lines apart but never flips a side.
TEST_CASE("north diagram directions", "[sheet]") {
  NorthInfo n;
  n.grid_convergence_deg = 1.2;  // grid north east of true north
  n.declination_deg = 4.5;
  auto d = north_drawing(n, 7);
  CHECK(d.true_deg < 0);      // true north drawn west of grid north
  CHECK(d.magnetic_deg > 0);  // magnetic north east of grid north (3.3 deg)
  CHECK(d.magnetic_deg - d.true_deg >= 7 - 1e-9);
  CHECK(d.exaggerated);
  CHECK(*n.grid_magnetic_angle_deg() == Approx(3.3));
  NorthInfo big;
  big.grid_convergence_deg = -9;
  big.declination_deg = -25;
  auto e = north_drawing(big, 7);
  CHECK(e.true_deg == Approx(9));
  CHECK(e.magnetic_deg == Approx(-16));
  CHECK_FALSE(e.exaggerated);
}
