#include <catch2/catch.hpp>
#include <cstdlib>

#include "support/test_env.hpp"

using namespace sheetmill;

namespace {
std::filesystem::path wmm_file() {
  return test::shared_dir() / "data" / "wmm" / "WMM2025.COF";
}
}  // namespace

// The CLI prints the declination as the first number on its first line. Checked against the
// published WMM2025 test value at 2025.0, h = 0, 80 N 0 E: D = 1.28 deg
// (../shared/data/wmm/README.md).
TEST_CASE("sheetmill declination prints the published value", "[geomag]") {
  if (!std::filesystem::exists(wmm_file())) {
    WARN("WMM2025.COF not found; skipped");
    return;
  }
  auto r = test::run_sheetmill({"declination", "--lat", "80", "--lon", "0", "--date", "2025.0",
                                "--model", wmm_file().string()});
  REQUIRE(r.exit_code == 0);
  double d = std::strtod(r.out.c_str(), nullptr);
  CHECK(d == Approx(1.28).margin(0.005));
  auto nl = r.out.find('\n');
  REQUIRE(nl != std::string::npos);
  double annual = std::strtod(r.out.c_str() + nl + 1, nullptr);
  CHECK(std::abs(annual) < 1.0);  // degrees per year; the field drifts by tenths at most here
}

TEST_CASE("a date outside the model's validity exits 2", "[geomag]") {
  if (!std::filesystem::exists(wmm_file())) {
    WARN("WMM2025.COF not found; skipped");
    return;
  }
  auto r = test::run_sheetmill({"declination", "--lat", "47", "--lon", "13", "--date", "2031-01-01",
                                "--model", wmm_file().string()});
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("outside the validity") != std::string::npos);
  auto missing = test::run_sheetmill({"declination", "--lat", "47", "--lon", "13", "--date",
                                      "2026-01-01", "--model", "/nonexistent.cof"});
  CHECK(missing.exit_code == 2);
}
