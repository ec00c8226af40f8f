// The legend lists what is on the sheet and never loses a word. Read back from the PDF with
// poppler's pdftotext, the outside reader of what a sheet says.
#include "sheetmill/sheet/legend.hpp"

#include <cairo-pdf.h>

#include <catch2/catch.hpp>
#include <map>
#include <sstream>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/collar.hpp"
#include "sheetmill/sheet/grid.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "support/pdf_words.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::sheet;

namespace {

project::Project sheet_project(const project::Paper& paper, const Box& extent) {
  project::Project p;
  p.title = "Wrenfold Valley";
  p.crs = "EPSG:32633";
  p.scale = 25000;
  p.paper = paper;
  p.extent.box = extent;
  p.magnetic.declination_deg = 4.5;
  p.magnetic.date = "2026-06-01";
  p.contours.interval_m = 10;
  return p;
}

style::Rule line_rule(const std::string& legend) {
  style::Rule r;
  r.legend = legend;
  style::LineSymbol line;
  line.strokes.push_back(style::Stroke{});
  r.line = line;
  return r;
}

// A style whose one layer carries `rules` (the layout sizes the panel by the style's legend).
style::Style style_with(const std::vector<const style::Rule*>& rules) {
  style::Style style;
  style::Layer layer;
  for (const auto* r : rules) layer.rules.push_back(*r);
  style.layers.push_back(layer);
  return style;
}

std::vector<test::PdfWord> render_collar(const project::Project& p, const SheetContents& shown,
                                         const std::vector<const style::Rule*>& rules,
                                         const test::TempDir& dir, Layout* layout_out = nullptr) {
  style::Style style = style_with(rules);
  auto L = compute_layout(p, style, std::nullopt);
  auto info = describe_sheet(p, L);
  info.shown = shown;
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
  if (layout_out) *layout_out = L;
  return test::pdf_words(pdf);
}

std::string joined(const std::vector<test::PdfWord>& words) {
  std::string out;
  for (const auto& w : words) out += w.text + " ";
  return out;
}

std::map<std::string, int> word_counts(const std::string& text) {
  std::map<std::string, int> counts;
  std::istringstream in(text);
  std::string w;
  while (in >> w) ++counts[w];
  return counts;
}

}  // namespace

TEST_CASE("legend entries for contours and spot heights exactly when on the sheet",
          "[sheet][legend]") {
  test::TempDir dir("legend_kinds");
  auto p = sheet_project({"A1", 841, 594}, Box::of(500000, 5200000, 510000, 5208000));
  style::Rule road = line_rule("Trunk road");

  SheetContents none;
  auto bare = joined(render_collar(p, none, {&road}, dir));
  CHECK(bare.find("Trunk road") != std::string::npos);
  CHECK(bare.find("Contour,") == std::string::npos);
  CHECK(bare.find("Index contour") == std::string::npos);
  CHECK(bare.find("Spot height") == std::string::npos);
  CHECK(bare.find("Grid line") == std::string::npos);

  SheetContents some;
  some.add(ContourKind::ordinary);
  some.add(ContourKind::index);
  some.spot_heights = true;
  some.grid = true;
  auto text = joined(render_collar(p, some, {&road}, dir));
  // The interval 10 m (the project's) and index every fifth line (the style's default).
  CHECK(text.find("Contour, 10 m interval") != std::string::npos);
  CHECK(text.find("Index contour, every 50 m") != std::string::npos);
  CHECK(text.find("Spot height") != std::string::npos);
  CHECK(text.find("Grid line, 1 km squares") != std::string::npos);
  CHECK(text.find("Depression contour") == std::string::npos);
  CHECK(text.find("Half-interval") == std::string::npos);
  CHECK(text.find("Graticule crossing") == std::string::npos);
  CHECK(text.find("Benchmark") == std::string::npos);

  SheetContents all = some;
  all.add(ContourKind::depression);
  all.add(ContourKind::supplementary);
  all.graticule = true;
  all.benchmarks = true;
  auto full = joined(render_collar(p, all, {&road}, dir));
  CHECK(full.find("Depression contour") != std::string::npos);
  CHECK(full.find("Half-interval contour") != std::string::npos);
  CHECK(full.find("Graticule crossing") != std::string::npos);
  CHECK(full.find("Benchmark") != std::string::npos);
}

// On A4 a long legend wraps, moves into columns or shrinks, but every word of every entry is
// printed once, inside the outer frame and clear of every other word.
TEST_CASE("on A4 the legend's words are all there", "[sheet][legend]") {
  test::TempDir dir("legend_a4");
  auto p = sheet_project({"A4", 297, 210}, Box::of(500000, 5200000, 502000, 5203000));
  std::vector<std::string> texts = {"Motorway with junction number",
                                    "Trunk road, dual carriageway",
                                    "Main road, two lanes, bound surface",
                                    "Secondary road",
                                    "Minor road, under 4 m wide",
                                    "Track, passable by four-wheel-drive vehicles",
                                    "Footpath, public right of way",
                                    "Railway, standard gauge, single track",
                                    "Power line on pylons",
                                    "River, over 5 m wide, with direction of flow",
                                    "Stream",
                                    "Drain or ditch",
                                    "Wood, mostly broadleaved",
                                    "Wood, mostly coniferous",
                                    "Orchard",
                                    "Marsh, reeds or saltings",
                                    "Scree and boulders",
                                    "Quarry or open pit",
                                    "Building",
                                    "Church or chapel with tower"};
  std::vector<style::Rule> rules;
  for (const auto& t : texts) rules.push_back(line_rule(t));
  std::vector<const style::Rule*> ptrs;
  for (const auto& r : rules) ptrs.push_back(&r);
  SheetContents shown;
  shown.add(ContourKind::ordinary);
  shown.add(ContourKind::index);
  shown.add(ContourKind::depression);
  shown.spot_heights = true;
  shown.grid = true;
  shown.graticule = true;
  Layout L;
  auto words = render_collar(p, shown, ptrs, dir, &L);
  // Every legend text the sheet must carry: the rules' and the furniture's own.
  SheetInfo info = describe_sheet(p, L);
  info.shown = shown;
  style::Style style;
  std::string expected;
  for (const auto& e : legend_entries(style, ptrs, info)) expected += e.text + " ";
  auto want = word_counts(expected);
  auto have = word_counts(joined(words));
  for (const auto& [w, n] : want) {
    INFO("word: " << w);
    CHECK(have[w] >= n);
  }
  // On the paper and inside the outer frame; no two words overlap (boxes shrunk by 0.1 mm for
  // poppler's rounding).
  for (const auto& w : words) {
    Box b = w.box_mm();
    INFO("word " << w.text);
    CHECK(b.min_x >= L.sheet_frame_mm.min_x - 0.5);
    CHECK(b.max_x <= L.sheet_frame_mm.max_x + 0.5);
    CHECK(b.min_y >= L.sheet_frame_mm.min_y - 0.5);
    CHECK(b.max_y <= L.sheet_frame_mm.max_y + 0.5);
  }
  // The panel's words (the grid's labels in the collar are the grid's own test).
  std::vector<test::PdfWord> panel;
  for (const auto& w : words)
    if (w.box_mm().min_x >= L.panel_box_mm.min_x - 1e-6) panel.push_back(w);
  CHECK(panel.size() > 100);
  for (std::size_t i = 0; i < panel.size(); ++i) {
    for (std::size_t j = i + 1; j < panel.size(); ++j) {
      Box a = panel[i].box_mm().expanded(-0.1), b = panel[j].box_mm().expanded(-0.1);
      INFO(panel[i].text << " / " << panel[j].text);
      CHECK_FALSE(a.intersects(b));
    }
  }
}
