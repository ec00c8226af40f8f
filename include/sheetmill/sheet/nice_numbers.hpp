#pragma once
// "Nice" numbers for grid intervals, scale-bar segments and graticule steps.
//
// nice_number() is Heckbert's (1990) rule from "Nice numbers for graph labels" (Graphics Gems):
// a number of the form {1, 2, 5, 10} x 10^n near x, rounded to the nearest when `round` is true,
// otherwise the smallest such number >= x. x must be positive and finite.

#include <vector>

namespace sheetmill::sheet {

double nice_number(double x, bool round);

// Heckbert's loose labelling: a tick spacing and the range [first, last] covering [lo, hi] with
// about `ticks` ticks. `spacing` is nice; first and last are multiples of it.
struct NiceRange {
  double first = 0;
  double last = 0;
  double spacing = 1;
};
NiceRange nice_range(double lo, double hi, int ticks);

// The projected grid interval in ground metres for a sheet at 1:N: the nice number nearest to
// 40 mm on paper (at 1:25 000 a 1 km square is 40 mm, common practice).
double grid_interval_m(double scale_denominator);

// A graticule step in arc-seconds chosen from 1, 2, 5, 10, 15, 20, 30 seconds, 1, 2, 5, 10, 15, 20,
// 30 minutes and 1, 2, 5, 10, 15, 30 degrees: the smallest step whose length on paper (given
// `mm_per_arcsec`) is at least `min_mm`.
double graticule_step_arcsec(double mm_per_arcsec, double min_mm);

}  // namespace sheetmill::sheet
