#include "sheetmill/sheet/sheet_info.hpp"

#include <catch2/catch.hpp>

#include "sheetmill/core/error.hpp"
#include "sheetmill/geomag/model.hpp"
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
  CHECK(info.location_caption.find("47\u00B0 N") != std::string::npos);
}
