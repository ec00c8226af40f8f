// One reference scene per furniture element, in the manner of Cairo's test suite (one scene per
// test, a rasterised result compared with a stored reference within a tolerance): each scene is
// drawn into a PDF, rasterised by poppler (pdftoppm, 200 dpi) and compared with
// tests/sheet/references/NAME.png. scripts/make-furniture-refs records the references (review
// them by eye before committing). The same thresholds as the symbol-sheet references.
#include <cairo-pdf.h>

#include <catch2/catch.hpp>
#include <cstdlib>
#include <functional>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/collar.hpp"
#include "sheetmill/sheet/legend.hpp"
#include "sheetmill/sheet/north_diagram.hpp"
#include "sheetmill/sheet/scale_bar.hpp"
#include "support/raster_compare.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::sheet;

namespace {

constexpr double kMaxMeanDiff = 1.0;
constexpr double kMaxChangedFraction = 0.002;
// Compared by test::compare_png (tests/support/raster_compare.hpp), the suites' one diff.
using test::compare_png;
using Diff = test::RasterDiff;

// Draws `scene` on a w x h mm PDF page and rasterises it; returns the PNG.
std::filesystem::path rasterise(const test::TempDir& tmp, const std::string& name, double w_mm,
                                double h_mm, const std::function<void(cairo_t*)>& scene) {
  auto pdf = tmp / (name + ".pdf");
  {
    CairoSurfacePtr s(cairo_pdf_surface_create(pdf.c_str(), w_mm * kPtPerMm, h_mm * kPtPerMm));
    CairoPtr cr(cairo_create(s.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    cairo_set_source_rgb(cr.get(), 1, 1, 1);
    cairo_paint(cr.get());
    scene(cr.get());
    REQUIRE(cairo_status(cr.get()) == CAIRO_STATUS_SUCCESS);
    cr.reset();
    cairo_surface_finish(s.get());
  }
  auto r = test::run_command(
      {"pdftoppm", "-r", "200", "-png", "-singlefile", pdf.string(), (tmp / name).string()});
  REQUIRE(r.exit_code == 0);
  return tmp / (name + ".png");
}

std::filesystem::path reference(const std::string& name) {
  return test::source_dir() / "tests" / "sheet" / "references" / (name + ".png");
}

// Records the scene as its reference (SHEETMILL_UPDATE_REFS=1) or compares it with it.
void check_scene(const std::string& name, double w_mm, double h_mm,
                 const std::function<void(cairo_t*)>& scene) {
  test::TempDir tmp("scene_" + name);
  auto png = rasterise(tmp, name, w_mm, h_mm, scene);
  auto ref = reference(name);
  if (std::getenv("SHEETMILL_UPDATE_REFS")) {
    std::filesystem::create_directories(ref.parent_path());
    std::filesystem::copy_file(png, ref, std::filesystem::copy_options::overwrite_existing);
    WARN("reference recorded: " << ref);
    return;
  }
  REQUIRE(std::filesystem::exists(ref));  // record with scripts/make-furniture-refs
  Diff d = compare_png(png, ref);
  INFO(name << ": mean " << d.mean << ", changed " << d.changed_fraction);
  CHECK(d.mean <= kMaxMeanDiff);
  CHECK(d.changed_fraction <= kMaxChangedFraction);
}

const style::Style& field_style() {
  static const style::Style s = style::load_style(test::source_dir() / "styles" / "field.yaml");
  return s;
}

void scale_bars(cairo_t* cr, const std::vector<std::string>& units) {
  text::FontCache fonts;
  draw_scale_panel(cr, Box::of(5, 3, 215, 33), 25000, units, field_style(), fonts);
}

// Magnetic north 0.05 degrees east of true north, both east of grid north by a fraction of a
// degree: the case where the lines used to coincide.
void near_north(cairo_t* cr) {
  NorthInfo n;
  n.grid_convergence_deg = -0.2;
  n.declination_deg = -0.15;
  n.date = "2026-12-01";
  n.source = "stated in the project";
  text::FontCache fonts;
  draw_north_diagram(cr, Box::of(3, 3, 83, 43), n, field_style(), fonts);
}

SheetInfo legend_info() {
  SheetInfo info;
  info.contour_interval_m = 10;
  info.grid_interval_m = 1000;
  info.shown.add(ContourKind::ordinary);
  info.shown.add(ContourKind::index);
  info.shown.add(ContourKind::depression);
  info.shown.spot_heights = true;
  info.shown.grid = true;
  info.shown.graticule = true;
  return info;
}

void legend(cairo_t* cr, double width_mm, double height_mm) {
  std::vector<const style::Rule*> rules;
  for (const auto& layer : field_style().layers)
    for (const auto& rule : layer.rules)
      if (!rule.legend.empty()) rules.push_back(&rule);
  text::FontCache fonts;
  auto entries = legend_entries(field_style(), rules, legend_info());
  auto plan = plan_legend(fonts, field_style(), entries, width_mm, height_mm);
  draw_legend_plan(cr, plan, entries, {3, 3}, field_style(), fonts);
}

// "A1" (north-west) to "C3" (south-east): rows from the north, columns from the west.
std::string fmt_id(int r_north, int c_east) {
  return std::string(1, static_cast<char>('B' - r_north)) + std::to_string(2 + c_east);
}

void location(cairo_t* cr) {
  // An invented 3 x 3 index of 10 x 8 km sheets, the DEM covering the middle row and more.
  SheetInfo info;
  info.sheet_id = "B2";
  Layout layout;
  const double w = 10000, h = 8000;
  for (int r = -1; r <= 1; ++r) {
    for (int c = -1; c <= 1; ++c) {
      Box b = Box::of(500000 + c * w, 5200000 + r * h, 510000 + c * w, 5208000 + r * h);
      std::vector<Point> ring{
          {b.min_x, b.max_y}, {b.max_x, b.max_y}, {b.max_x, b.min_y}, {b.min_x, b.min_y}};
      info.index_outlines.push_back(ring);
      if (r == 0 && c == 0) {
        layout.frame.ground = b;
        layout.frame.neatline = ring;
      } else {
        info.neighbours.push_back({fmt_id(r, c), "", c, -r});
      }
    }
  }
  info.location_area = Box::of(480000, 5179000, 530000, 5229000);
  info.dem_footprint = {{488000, 5196000}, {524000, 5194000}, {526000, 5214000}, {490000, 5216000}};
  for (double x = 485000; x < 530000; x += 15000)
    info.location_graticule.push_back({{x, 5179000}, {x + 400, 5229000}});
  for (double y = 5185000; y < 5229000; y += 15000)
    info.location_graticule.push_back({{480000, y}, {530000, y - 300}});
  info.location_caption =
      "Centre 46\u00B059\u2032 N 15\u00B004\u2032 E; index sheets, DEM coverage shaded; graticule "
      "every 10\u2032";
  text::FontCache fonts;
  draw_diagrams(cr, Box::of(3, 3, 83, 48), layout, field_style(), info, fonts);
}

}  // namespace

TEST_CASE("scene: metric and feet scale bars", "[sheet][scenes]") {
  check_scene("scale_bars", 220, 36, [](cairo_t* cr) { scale_bars(cr, {"m", "ft"}); });
}

TEST_CASE("scene: north diagram with nearly coinciding lines", "[sheet][scenes]") {
  check_scene("north_near", 86, 46, near_north);
}

TEST_CASE("scene: legend in a narrow box", "[sheet][scenes]") {
  check_scene("legend_narrow", 76, 130, [](cairo_t* cr) { legend(cr, 70, 120); });
}

TEST_CASE("scene: legend in columns", "[sheet][scenes]") {
  check_scene("legend_columns", 150, 80, [](cairo_t* cr) { legend(cr, 144, 74); });
}

TEST_CASE("scene: adjoining sheets and location", "[sheet][scenes]") {
  check_scene("location", 86, 51, location);
}

// The comparison must see a change: the metric bar alone is not the two-bar reference.
TEST_CASE("the scene comparison notices a changed scene", "[sheet][scenes]") {
  if (std::getenv("SHEETMILL_UPDATE_REFS") || !std::filesystem::exists(reference("scale_bars"))) {
    WARN("no reference yet");
    return;
  }
  test::TempDir tmp("scene_control");
  auto png = rasterise(tmp, "scale_bars", 220, 36, [](cairo_t* cr) { scale_bars(cr, {"m"}); });
  Diff d = compare_png(png, reference("scale_bars"));
  CHECK((d.mean > kMaxMeanDiff || d.changed_fraction > kMaxChangedFraction));
}
