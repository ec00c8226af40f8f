#include "sheetmill/sheet/sheet_info.hpp"

#include <catch2/catch.hpp>

#include "sheetmill/core/error.hpp"
#include "sheetmill/geomag/model.hpp"
#include "sheetmill/sheet/dms.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"
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

// The collar's north values for the sheet centre: convergence and scale factor from PROJ, the
// declination from the WMM file the project names (the model itself is checked against its
// published test values in tests/geomag).
TEST_CASE("north at the sheet centre from the WMM file", "[sheet]") {
  auto wmm = test::shared_dir() / "data" / "wmm" / "WMM2025.COF";
  if (!std::filesystem::exists(wmm)) {
    WARN("WMM2025.COF not found; skipped");
    return;
  }
  auto p = utm_project();
  p.magnetic.model_file = wmm.string();
  p.magnetic.date = "2026-06-01";
  style::Style style;
  auto L = compute_layout(p, style, std::nullopt);
  auto info = describe_sheet(p, L);
  auto crs = SheetCrs::resolve(p.crs);
  Point c = crs.to_lonlat({505000, 5204000});
  CHECK(info.north.centre_lonlat.x == Approx(c.x).margin(1e-9));
  // 505 000 E lies 5 km east of the zone's central meridian (15 E): convergence small, positive.
  CHECK(info.north.grid_convergence_deg > 0);
  CHECK(info.north.grid_convergence_deg < 0.1);
  auto field = geomag::Model::load(wmm).at(c.y, c.x, 0, geomag::decimal_year("2026-06-01"));
  REQUIRE(info.north.declination_deg);
  CHECK(*info.north.declination_deg == Approx(field.declination_deg).margin(1e-12));
  CHECK(info.north.source == "WMM-2025");
  CHECK(*info.north.grid_magnetic_angle_deg() ==
        Approx(field.declination_deg - info.north.grid_convergence_deg));
  // A date the model does not cover is the user's to fix.
  p.magnetic.date = "2031-01-01";
  CHECK_THROWS_AS(describe_sheet(p, L), Error);
}

TEST_CASE("a declination stated by hand is used as stated", "[sheet]") {
  auto p = utm_project();
  p.magnetic.declination_deg = -2.5;
  p.magnetic.date = "2026-12-01";
  style::Style style;
  auto info = describe_sheet(p, compute_layout(p, style, std::nullopt));
  CHECK(*info.north.declination_deg == -2.5);
  CHECK(info.north.date == "2026-12-01");
  // The location diagram places the sheet by its centre's latitude (PROJ as the oracle), and
  // draws parallels and meridians over five sheet sizes around it.
  Point c = SheetCrs::resolve(p.crs).to_lonlat({505000, 5204000});
  CHECK(info.location_caption.find(format_dms(c.y, AngleKind::latitude, 1)) != std::string::npos);
  CHECK(info.location_area.width() == Approx(5 * 10000));
  CHECK(info.location_graticule.size() >= 4);
}

// The location diagram of a national-size index: the sheets around this one and the index's
// extent, not thousands of outlines (which would be a smear at diagram size and cost every
// sheet time in proportion to the index).
TEST_CASE("the location diagram of a large index shows the nearby sheets and the extent",
          "[sheet]") {
  auto p = utm_project();
  p.magnetic.declination_deg = 1.0;
  p.magnetic.date = "2026-12-01";
  p.tile_index = project::TileIndex{};
  // 30 x 30 sheets of 2 x 2 km, in memory.
  TileIndexContents index;
  for (int row = 0; row < 30; ++row)
    for (int col = 0; col < 30; ++col) {
      IndexSheet s;
      s.id = "R" + std::to_string(row) + "C" + std::to_string(col);
      double x = 500000 + 2000.0 * col, y = 5200000 + 2000.0 * row;
      s.bounds = Box::of(x, y, x + 2000, y + 2000);
      s.outline = {{x, y}, {x + 2000, y}, {x + 2000, y + 2000}, {x, y + 2000}};
      index.sheets.push_back(s);
    }
  REQUIRE(index.sheets.size() > kLocationWholeIndex);
  style::Style style;
  auto L = compute_layout(p, style, std::nullopt);
  L.index_sheet = index.sheets[10 * 30 + 2];  // row 10, column 2: near the west edge
  auto info = describe_sheet(p, L, &index);
  // Columns 0..7 (2 + 4 + 1 touching, clipped at the west edge) by rows 5..15 (11 rows):
  // 8 x 11 = 88 sheets, and the extent's outline.
  CHECK(info.index_outlines.size() == 88 + 1);
  const auto& extent = info.index_outlines.back();
  Box e;
  for (Point q : extent) e.add(q);
  CHECK(e.min_x == 500000);
  CHECK(e.max_x == 560000);
  CHECK(e.max_y == 5260000);
  CHECK(info.location_caption.find("900") != std::string::npos);
  // The neighbours for the adjoining-sheets diagram are the eight around it, as before.
  CHECK(info.neighbours.size() == 8);
}
