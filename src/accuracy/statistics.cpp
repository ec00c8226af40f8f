#include "sheetmill/accuracy/statistics.hpp"

#include <algorithm>
#include <cmath>
#include <functional>
#include <limits>

#include "sheetmill/core/error.hpp"

namespace sheetmill::accuracy {

namespace {

double rmse(std::span<const double> e) {
  double sum_sq = 0;
  for (double v : e) sum_sq += v * v;
  return std::sqrt(sum_sq / static_cast<double>(e.size()));
}

}  // namespace

VerticalStats vertical_stats(std::span<const double> errors_m) {
  VerticalStats s;
  s.count = errors_m.size();
  if (s.count == 0) return s;
  double sum = 0;
  for (double e : errors_m) sum += e;
  s.mean_m = sum / static_cast<double>(s.count);
  double dev_sq = 0;
  for (double e : errors_m) dev_sq += (e - s.mean_m) * (e - s.mean_m);
  s.sd_m = s.count > 1 ? std::sqrt(dev_sq / static_cast<double>(s.count - 1))
                       : std::numeric_limits<double>::quiet_NaN();
  s.rmse_m = rmse(errors_m);
  // NSSDA section 3.2.2: Accuracy_z = 1.9600 * RMSE_z (errors assumed normal, zero mean).
  s.nssda_95_m = kNssdaVerticalFactor * s.rmse_m;
  std::vector<double> abs_e;
  for (double e : errors_m) abs_e.push_back(std::abs(e));
  s.max_abs_m = *std::max_element(abs_e.begin(), abs_e.end());
  s.abs_p95_m = asprs_percentile(abs_e, 95);
  s.nmas_interval_m = nmas_finest_interval_m(errors_m);
  return s;
}

double asprs_percentile(std::vector<double> values, double percent) {
  if (values.empty()) throw_internal_error("percentile of no values");
  if (!(percent > 0 && percent <= 100)) throw_internal_error("percentile outside (0, 100]");
  std::sort(values.begin(), values.end());
  // ASPRS (2014), definition of percentile: n = (N - 1) * p + 1 on a 1-based sorted list.
  double n = (static_cast<double>(values.size()) - 1) * percent / 100 + 1;
  auto whole = static_cast<std::size_t>(std::floor(n));
  double frac = n - static_cast<double>(whole);
  if (whole >= values.size()) return values.back();
  return values[whole - 1] + frac * (values[whole] - values[whole - 1]);
}

double nmas_finest_interval_m(std::span<const double> errors_m) {
  if (errors_m.empty()) return 0;
  std::vector<double> abs_e;
  for (double e : errors_m) abs_e.push_back(std::abs(e));
  std::sort(abs_e.begin(), abs_e.end(), std::greater<>());
  // NMAS (1947): "not more than 10 percent of the elevations tested shall be in error more
  // than one-half the contour interval". floor(0.1 N) points may exceed half the interval; the
  // next largest error must not, so the interval is twice it.
  std::size_t may_exceed = errors_m.size() / 10;
  return 2 * abs_e[may_exceed];
}

double usual_interval_at_least(double interval_m) {
  if (!(interval_m > 0)) return 0;
  double decade = std::pow(10.0, std::floor(std::log10(interval_m)));
  for (int k = 0; k < 2; ++k, decade *= 10) {
    for (double step : {1.0, 2.0, 2.5, 5.0}) {
      // A hair of slack so 2 x 0.05 read back from binary still counts as 0.1.
      if (step * decade >= interval_m * (1 - 1e-12)) return step * decade;
    }
  }
  return 10 * decade;
}

std::vector<std::size_t> outliers_beyond_3sd(std::span<const double> errors_m,
                                             const VerticalStats& stats) {
  std::vector<std::size_t> out;
  if (!(stats.sd_m > 0)) return out;
  for (std::size_t i = 0; i < errors_m.size(); ++i) {
    if (std::abs(errors_m[i] - stats.mean_m) > 3 * stats.sd_m) out.push_back(i);
  }
  return out;
}

HorizontalStats horizontal_stats(std::span<const double> dx_m, std::span<const double> dy_m) {
  if (dx_m.size() != dy_m.size()) throw_internal_error("horizontal_stats: dx and dy differ");
  HorizontalStats h;
  h.count = dx_m.size();
  if (h.count == 0) return h;
  for (std::size_t i = 0; i < h.count; ++i) {
    h.mean_x_m += dx_m[i];
    h.mean_y_m += dy_m[i];
  }
  h.mean_x_m /= static_cast<double>(h.count);
  h.mean_y_m /= static_cast<double>(h.count);
  h.rmse_x_m = rmse(dx_m);
  h.rmse_y_m = rmse(dy_m);
  // NSSDA section 3.2.1: RMSE_r = sqrt(RMSE_x^2 + RMSE_y^2).
  h.rmse_r_m = std::hypot(h.rmse_x_m, h.rmse_y_m);
  double lo = std::min(h.rmse_x_m, h.rmse_y_m), hi = std::max(h.rmse_x_m, h.rmse_y_m);
  h.ratio = hi > 0 ? lo / hi : 1;
  // Appendix 3-A: Accuracy_r ~ 2.4477 * 0.5 * (RMSE_x + RMSE_y); exactly 2.4477 * RMSE_x (and
  // 1.7308 * RMSE_r) when the two are equal.
  h.nssda_95_m = kNssdaHorizontalFactor * 0.5 * (h.rmse_x_m + h.rmse_y_m);
  return h;
}

}  // namespace sheetmill::accuracy
