#include "sheetmill/sheet/nice_numbers.hpp"

#include <catch2/catch.hpp>
#include <cmath>

#include "sheetmill/sheet/scale_bar.hpp"

using namespace sheetmill::sheet;

// Heckbert, P. (1990) "Nice numbers for graph labels", Graphics Gems I: nicenum() gives
// {1, 2, 5, 10} x 10^n; with round, fractions < 1.5 -> 1, < 3 -> 2, < 7 -> 5, else 10;
// without, the smallest nice number >= x.
TEST_CASE("Heckbert nice numbers", "[sheet]") {
  CHECK(nice_number(1.4, true) == 1);
  CHECK(nice_number(1.6, true) == 2);
  CHECK(nice_number(2.9, true) == 2);
  CHECK(nice_number(3.1, true) == 5);
  CHECK(nice_number(6.9, true) == 5);
  CHECK(nice_number(7.1, true) == 10);
  CHECK(nice_number(0.034, true) == Approx(0.05));
  CHECK(nice_number(1.01, false) == 2);
  CHECK(nice_number(2.0, false) == 2);
  CHECK(nice_number(2.01, false) == 5);
  CHECK(nice_number(5.01, false) == 10);
  CHECK(nice_number(123, false) == 200);
}

// Heckbert's loose labelling of his own example range: data 105..543 with 5 ticks:
// range = nicenum(438, false) = 500, d = nicenum(125, true) = 100, labels 100..600.
TEST_CASE("Heckbert loose labels", "[sheet]") {
  auto r = nice_range(105, 543, 5);
  CHECK(r.spacing == 100);
  CHECK(r.first == 100);
  CHECK(r.last == 600);
}

// Common practice: a 1 km grid at 1:25 000 (40 mm squares) and 1:24 000.
TEST_CASE("grid interval for the scale", "[sheet]") {
  CHECK(grid_interval_m(25000) == 1000);
  CHECK(grid_interval_m(24000) == 1000);
  CHECK(grid_interval_m(10000) == 500);
  CHECK(grid_interval_m(250000) == 10000);
}

TEST_CASE("graticule step", "[sheet]") {
  // 1 arc-minute of latitude ~ 1852 m = 74 mm at 1:25 000; >= 40 mm wanted -> 1'.
  double mm_per_arcsec = 1852.0 / 60 * 1000 / 25000;
  CHECK(graticule_step_arcsec(mm_per_arcsec, 40) == 60);
  CHECK(graticule_step_arcsec(mm_per_arcsec, 100) == 120);
}

// Scale bars: segment lengths are nice numbers (Heckbert 1990) and exact on paper.
TEST_CASE("scale bar plans", "[sheet]") {
  // 1:25 000, 100 mm: 2 500 m available, 2500 / 5 = 500 m -> nice 500 m; four segments of
  // exactly 500 x 1000 / 25 000 = 20 mm, plus the extension, divided in fifths (of a 5).
  auto m = plan_scale_bar(25000, 100, scale_unit("m"));
  CHECK(m.segment_units == 500);
  CHECK(m.segments == 4);
  CHECK(m.segment_mm == Approx(20.0).epsilon(1e-12));
  CHECK(m.subdivisions == 5);
  CHECK(m.total_mm() <= 100 + 1e-9);
  // 1:24 000 in feet: 2 000 ft to the inch (common practice, the 7.5' quadrangle scale).
  auto ft = plan_scale_bar(24000, 100, scale_unit("ft"));
  CHECK(ft.segment_units == 2000);
  CHECK(ft.segment_mm == Approx(25.4).epsilon(1e-12));
  // A mile is 1609.344 m (international mile); at 1:63 360 it is one inch.
  auto mi = plan_scale_bar(63360, 130, scale_unit("mi"));
  CHECK(mi.segment_units * 1609.344 * 1000 / 63360 == Approx(mi.segment_mm));
  CHECK(mi.segment_units == 1);
  CHECK(mi.segment_mm == Approx(25.4).epsilon(1e-12));
  CHECK(representative_fraction(25000) == "1:25 000");
  CHECK(representative_fraction(1000000) == "1:1 000 000");
  CHECK(representative_fraction(5000) == "1:5000");
}
