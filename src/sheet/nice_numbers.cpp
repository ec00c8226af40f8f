#include "sheetmill/sheet/nice_numbers.hpp"

#include <array>
#include <cmath>

#include "sheetmill/core/error.hpp"

namespace sheetmill::sheet {

// Heckbert 1990, "Nice numbers for graph labels", Graphics Gems I, pp. 61-63 (nicenum()).
double nice_number(double x, bool round) {
  if (!(x > 0) || !std::isfinite(x)) throw_internal_error("nice_number of a non-positive value");
  double expv = std::floor(std::log10(x));
  double f = x / std::pow(10.0, expv);  // 1 <= f < 10
  double nf;
  if (round) {
    if (f < 1.5)
      nf = 1;
    else if (f < 3)
      nf = 2;
    else if (f < 7)
      nf = 5;
    else
      nf = 10;
  } else {
    if (f <= 1)
      nf = 1;
    else if (f <= 2)
      nf = 2;
    else if (f <= 5)
      nf = 5;
    else
      nf = 10;
  }
  return nf * std::pow(10.0, expv);
}

// Heckbert 1990, loose_label(): range = nicenum(max - min, false), d = nicenum(range/(n-1), true).
NiceRange nice_range(double lo, double hi, int ticks) {
  if (ticks < 2 || !(hi > lo)) throw_internal_error("nice_range needs hi > lo and >= 2 ticks");
  double range = nice_number(hi - lo, false);
  double d = nice_number(range / (ticks - 1), true);
  return {std::floor(lo / d) * d, std::ceil(hi / d) * d, d};
}

double grid_interval_m(double scale_denominator) {
  if (!(scale_denominator > 0)) throw_internal_error("grid_interval_m: scale must be positive");
  double target_m = 40.0 * scale_denominator / 1000.0;
  return nice_number(target_m, true);
}

double graticule_step_arcsec(double mm_per_arcsec, double min_mm) {
  static constexpr std::array<double, 19> kSteps{
      1, 2, 5, 10, 15, 20, 30, 60, 120, 300, 600, 900, 1200, 1800, 3600, 7200, 18000, 36000, 54000};
  for (double s : kSteps) {
    if (s * mm_per_arcsec >= min_mm) return s;
  }
  return 108000;  // 30 degrees
}

}  // namespace sheetmill::sheet
