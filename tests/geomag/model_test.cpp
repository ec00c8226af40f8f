#include "sheetmill/geomag/model.hpp"

#include <catch2/catch.hpp>

#include "sheetmill/core/error.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {
std::filesystem::path wmm_file() {
  return test::shared_dir() / "data" / "wmm" / "WMM2025.COF";
}
}  // namespace

// Published test values of the World Magnetic Model 2025 (NOAA NCEI / BGS test-value table, as
// copied into ../shared/data/wmm/README.md): declination D in degrees, rounded to 0.01.
TEST_CASE("WMM2025 published declinations", "[geomag]") {
  if (!std::filesystem::exists(wmm_file())) {
    WARN("WMM2025.COF not found beside the repository; skipped");
    return;
  }
  auto model = geomag::Model::load(wmm_file());
  CHECK(model.epoch() == 2025.0);
  CHECK(model.max_degree() == 12);
  struct Case {
    double year, h_km, lat, lon, D;
  };
  const Case cases[] = {{2025.0, 0, 80, 0, 1.28},     {2025.0, 0, 0, 120, -0.16},
                        {2025.0, 0, -80, 240, 68.78}, {2025.0, 100, 80, 0, 0.85},
                        {2025.0, 100, 0, 120, -0.15}, {2025.0, 100, -80, 240, 68.21}};
  for (const auto& c : cases) {
    INFO("lat " << c.lat << " lon " << c.lon << " h " << c.h_km);
    auto f = model.at(c.lat, c.lon, c.h_km, c.year);
    // The table rounds to 0.01 deg: agreement within half a unit of the last digit.
    CHECK(f.declination_deg == Approx(c.D).margin(0.005));
  }
}

// Internal consistency with the model's own secular variation: the annual change reported at a
// date equals the difference of declinations a year apart (the model is linear in time, so only
// the nonlinearity of atan2 separates them; 0.002 deg/yr is generous for that).
TEST_CASE("WMM annual change matches the model's drift", "[geomag]") {
  if (!std::filesystem::exists(wmm_file())) {
    WARN("WMM2025.COF not found; skipped");
    return;
  }
  auto model = geomag::Model::load(wmm_file());
  auto a = model.at(47.0, 13.0, 0.5, 2026.0);
  auto b = model.at(47.0, 13.0, 0.5, 2027.0);
  CHECK(a.annual_change_deg == Approx(b.declination_deg - a.declination_deg).margin(0.002));
  CHECK_THROWS_AS(model.at(47.0, 13.0, 0, 2030.0), Error);
  CHECK_THROWS_AS(model.at(47.0, 13.0, 0, 2024.9), Error);
}

TEST_CASE("dates as decimal years", "[geomag]") {
  CHECK(geomag::decimal_year("2025-01-01") == 2025.0);
  CHECK(geomag::decimal_year("2026-07-02") == Approx(2026 + 182.0 / 365));
  CHECK(geomag::decimal_year("2028-12-31") == Approx(2028 + 365.0 / 366));  // leap year
  CHECK(geomag::decimal_year("2027.25") == 2027.25);
  CHECK_THROWS_AS(geomag::decimal_year("2027-02-29"), Error);
  CHECK_THROWS_AS(geomag::decimal_year("yesterday"), Error);
}

TEST_CASE("malformed coefficient files are input errors", "[geomag]") {
  CHECK_THROWS_AS(geomag::Model::parse("", "x.cof"), Error);
  CHECK_THROWS_AS(geomag::Model::parse("2025.0 WMM-2025 11/13/2024\n 1 0 -29351.8 0 12\n", "x.cof"),
                  Error);
  // Truncated: no line of nines.
  CHECK_THROWS_AS(
      geomag::Model::parse("2025.0 WMM-2025 11/13/2024\n 1 0 -29351.8 0.0 12.0 0.0\n", "x.cof"),
      Error);
}
