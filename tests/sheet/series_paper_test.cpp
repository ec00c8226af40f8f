// Paper for a series sheet, and its heading. The oracle for "smallest that holds it" is the
// layout itself on each smaller standard size: every one of them must refuse the frame.
#include <catch2/catch.hpp>

#include "sheetmill/core/error.hpp"
#include "sheetmill/sheet/collar.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/paper_sizes.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::sheet;

namespace {

bool fits_on(const project::Project& base, const style::Style& style, const PaperSize& paper) {
  project::Project p = base;
  p.paper = {paper.name, paper.width_mm, paper.height_mm};
  try {
    compute_layout(p, style, std::nullopt);
    return true;
  } catch (const Error&) {
    return false;
  }
}

bool inside(const Box& inner, const Box& outer) {
  return inner.min_x >= outer.min_x - 1e-6 && inner.min_y >= outer.min_y - 1e-6 &&
         inner.max_x <= outer.max_x + 1e-6 && inner.max_y <= outer.max_y + 1e-6;
}

}  // namespace

// ISO 216 sizes (A4 210 x 297 mm ... A0 841 x 1189 mm), in order of area.
TEST_CASE("a series sheet gets the smallest standard paper that holds frame and collar",
          "[sheet][paper]") {
  style::Style style;
  const std::vector<std::string> series{"A4", "A3", "A2", "A1", "A0"};
  // Frames of 6 x 4, 10 x 8 and 20 x 16 km at 1:25 000 (240 x 160 to 800 x 640 mm).
  for (Box extent :
       {Box::of(500000, 5200000, 506000, 5204000), Box::of(500000, 5200000, 510000, 5208000),
        Box::of(500000, 5200000, 520000, 5216000)}) {
    project::Project p;
    p.crs = "EPSG:32633";
    p.scale = 25000;
    p.extent.box = extent;
    p.paper.name = project::kFitPaper;
    auto L = compute_layout(p, style, std::nullopt);
    INFO("frame " << L.map_box_mm.width() << " x " << L.map_box_mm.height() << " mm on "
                  << L.page_w_mm << " x " << L.page_h_mm);
    // The frame is at the exact scale on the chosen paper.
    CHECK(L.map_box_mm.width() == Approx(extent.width() / 25.0).margin(1e-9));
    // Everything inside the outer frame, the outer frame on the paper.
    for (const Box& b : {L.collar_box_mm, L.panel_box_mm, L.scale_box_mm}) {
      CHECK(inside(b, L.sheet_frame_mm));
    }
    CHECK(inside(L.sheet_frame_mm, Box::of(0, 0, L.page_w_mm, L.page_h_mm)));
    // The chosen paper is a standard size and every smaller one refuses the frame.
    std::size_t chosen = series.size();
    for (std::size_t i = 0; i < series.size(); ++i) {
      PaperSize s = paper_size(series[i]);
      if (std::min(L.page_w_mm, L.page_h_mm) == s.width_mm &&
          std::max(L.page_w_mm, L.page_h_mm) == s.height_mm)
        chosen = i;
    }
    REQUIRE(chosen < series.size());
    for (std::size_t i = 0; i < chosen; ++i) {
      for (bool landscape : {false, true}) {
        CHECK_FALSE(fits_on(p, style, oriented(paper_size(series[i]), landscape)));
      }
    }
    CHECK(fits_on(p, style, PaperSize{"chosen", L.page_w_mm, L.page_h_mm}));
  }
}

// The demo's own tile index: a sheet of it without stated paper is laid out on paper that fits.
TEST_CASE("a tile-index sheet from the demo gets fitting paper", "[sheet][paper]") {
  auto tiles = test::demo_area() / "generated" / "tiles.gpkg";
  if (!std::filesystem::exists(tiles)) {
    WARN("demo tile index not generated; skipped");
    return;
  }
  project::Project p;
  p.crs = "EPSG:32632";
  p.scale = 25000;
  p.paper.name = project::kFitPaper;
  project::TileIndex ti;
  ti.path = tiles.string();
  ti.layer = "sheets";
  ti.id_field = "sheet_id";
  ti.name_field = "name";
  p.tile_index = ti;
  auto index = read_tile_index(*p.tile_index, p.crs);
  REQUIRE(!index.sheets.empty());
  const auto& first = index.sheets.front();
  p.extent.sheet_id = first.id;
  style::Style style;
  auto L = compute_layout(p, style, std::nullopt);
  CHECK(L.index_sheet);
  CHECK(inside(L.collar_box_mm, L.sheet_frame_mm));
  CHECK(inside(L.panel_box_mm, L.sheet_frame_mm));
  CHECK(L.page_w_mm <= 594 + 1e-9);  // never the A2 of the demo's own project for one sheet
}

// Batch sheet titles: a name that already carries the id says it once.
TEST_CASE("sheet heading without repetition", "[sheet][title]") {
  CHECK(sheet_heading("Sheet A01", "A01") == "Sheet A01");
  CHECK(sheet_heading("sheet a01", "A01") == "sheet a01");
  CHECK(sheet_heading("", "A01") == "Sheet A01");
  CHECK(sheet_heading("Fennworth", "A01") == "Fennworth \u2014 sheet A01");
  CHECK(sheet_heading("Fennworth", "") == "Fennworth");
  CHECK(sheet_heading("", "") == "");
}
