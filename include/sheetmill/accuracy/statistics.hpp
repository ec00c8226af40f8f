#pragma once
// Accuracy statistics of check-point errors, by the published standards:
//
//   National Standard for Spatial Data Accuracy (NSSDA), FGDC-STD-007.3-1998, Federal Geographic
//   Data Committee: RMSE_z, vertical accuracy at 95 % confidence = 1.9600 x RMSE_z (section 3.2.2);
//   horizontal accuracy = 2.4477 x RMSE_x when RMSE_x = RMSE_y (= 1.7308 x RMSE_r), else the
//   Appendix 3-A approximation 2.4477 x 0.5 x (RMSE_x + RMSE_y), which the standard gives for
//   RMSE_min / RMSE_max between 0.6 and 1.0.
//   ASPRS Positional Accuracy Standards for Digital Geospatial Data (2014, Edition 1): vegetated
//   vertical accuracy (VVA) = the 95th percentile of the absolute errors, with the standard's
//   percentile (linear between closest ranks, position (N - 1) p + 1 in the sorted list).
//   US National Map Accuracy Standards (US Bureau of the Budget, 1947): no more than 10 % of the
//   elevations tested in error by more than half the contour interval.
//
// Errors are "data minus check" (DEM minus surveyed) in metres: a positive mean is a DEM that
// reads high. Every function takes plain numbers and is exact arithmetic on them; NaN marks a
// figure that cannot be computed from the count given (a standard deviation of one error).

#include <cstddef>
#include <span>
#include <vector>

namespace sheetmill::accuracy {

// NSSDA's factors (FGDC-STD-007.3-1998, sections 3.2.1 and 3.2.2 and Appendix 3-A).
inline constexpr double kNssdaVerticalFactor = 1.9600;    // 95 % two-sided, normal z
inline constexpr double kNssdaHorizontalFactor = 2.4477;  // 95 % circular, x and y alike
// A minimum of 20 check points (NSSDA section 3.2.1).
inline constexpr std::size_t kNssdaMinimumPoints = 20;

struct VerticalStats {
  std::size_t count = 0;
  double mean_m = 0;           // bias
  double sd_m = 0;             // sample standard deviation (n - 1); NaN for fewer than 2
  double rmse_m = 0;           // sqrt(sum e^2 / n)
  double nssda_95_m = 0;       // 1.9600 x RMSE_z
  double abs_p95_m = 0;        // ASPRS 95th percentile of |e|
  double nmas_interval_m = 0;  // finest contour interval NMAS 1947 allows (see below)
  double max_abs_m = 0;
};

// All of the above; count 0 gives zeros.
VerticalStats vertical_stats(std::span<const double> errors_m);

// The ASPRS (2014) percentile of `values` (0 < percent <= 100): sorted ascending A[1..N], the
// position n = (N - 1) * percent / 100 + 1; A[n] when whole, else linear between its neighbours.
double asprs_percentile(std::vector<double> values, double percent);

// The finest contour interval NMAS (1947) allows: at most floor(0.1 N) points may be in error by
// more than half the interval, so the interval is twice the (floor(0.1 N) + 1)-th largest |e|.
double nmas_finest_interval_m(std::span<const double> errors_m);

// The finest interval of the usual series 1, 2, 2.5, 5 x 10^k (common practice for contour
// intervals) that is at least `interval_m`.
double usual_interval_at_least(double interval_m);

// Indices of errors more than three sample standard deviations from the mean.
std::vector<std::size_t> outliers_beyond_3sd(std::span<const double> errors_m,
                                             const VerticalStats& stats);

struct HorizontalStats {
  std::size_t count = 0;
  double mean_x_m = 0, mean_y_m = 0;
  double rmse_x_m = 0, rmse_y_m = 0;
  double rmse_r_m = 0;    // sqrt(RMSE_x^2 + RMSE_y^2)
  double nssda_95_m = 0;  // 2.4477 x 0.5 x (RMSE_x + RMSE_y); exact when they are equal
  double ratio = 1;       // RMSE_min / RMSE_max
  // NSSDA Appendix 3-A: the approximation holds for 0.6 <= ratio <= 1.0.
  bool approximation_holds() const { return ratio >= 0.6; }
};

// dx, dy: map minus surveyed, metres, one pair per point.
HorizontalStats horizontal_stats(std::span<const double> dx_m, std::span<const double> dy_m);

}  // namespace sheetmill::accuracy
