#include "sheetmill/sheet/dms.hpp"

#include <catch2/catch.hpp>

using namespace sheetmill::sheet;

// Sexagesimal arithmetic by hand: 47.025 deg = 47 deg 1.5' = 47 deg 01' 30".
TEST_CASE("degrees, minutes and seconds", "[sheet]") {
  CHECK(format_dms(47.025, AngleKind::latitude, 1) == "47\u00B001\u203230\u2033 N");
  CHECK(format_dms(-8.5, AngleKind::longitude, 60) == "8\u00B030\u2032 W");
  CHECK(format_dms(15.0, AngleKind::longitude, 3600) == "15\u00B0 E");
  // Rounding carries: 14 deg 59' 59.8" to the second is 15 deg 00' 00".
  CHECK(format_dms(14 + 59.0 / 60 + 59.8 / 3600, AngleKind::longitude, 1) ==
        "15\u00B000\u203200\u2033 E");
  CHECK(format_dms(0, AngleKind::latitude, 60) == "0\u00B000\u2032");
  CHECK(format_east_west(-0.3449, 2) == "0.34\u00B0 W");
  CHECK(format_east_west(0.001, 1) == "0.0\u00B0");  // no side for a zero angle
  CHECK(format_east_west(3.1, 1) == "3.1\u00B0 E");
}
