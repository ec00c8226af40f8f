// The accuracy formulas against hand computations (written out beside each check).
//
// The NSSDA document (FGDC-STD-007.3-1998) could not be retrieved while these tests were
// written, so its appendix worked examples are not reproduced here; no figure below is quoted
// as published. The factors 1.9600 and 2.4477 and the Appendix 3-A approximation are from the
// standard as cited in statistics.hpp (from memory, and 1.9600 also in the project's
// REFERENCES.md); the ASPRS (2014) percentile rule and the NMAS (1947) 10 % rule likewise.
#include "sheetmill/accuracy/statistics.hpp"

#include <catch2/catch.hpp>
#include <cmath>
#include <vector>

using namespace sheetmill::accuracy;
using Catch::Detail::Approx;

TEST_CASE("vertical statistics of five errors, by hand", "[accuracy]") {
  // e = {1, -1, 2, -2, 0}: sum 0 -> mean 0; sum e^2 = 1+1+4+4+0 = 10.
  // RMSE_z = sqrt(10/5) = 1.414214; sample SD = sqrt(10/4) = 1.581139;
  // NSSDA Accuracy_z = 1.9600 x 1.414214 = 2.771859.
  std::vector<double> e{1, -1, 2, -2, 0};
  VerticalStats s = vertical_stats(e);
  CHECK(s.count == 5);
  CHECK(s.mean_m == Approx(0).margin(1e-12));
  CHECK(s.rmse_m == Approx(1.414214).epsilon(1e-6));
  CHECK(s.sd_m == Approx(1.581139).epsilon(1e-6));
  CHECK(s.nssda_95_m == Approx(2.771859).epsilon(1e-6));
  CHECK(s.max_abs_m == 2);
  // |e| sorted = {0, 1, 1, 2, 2}; ASPRS position (5 - 1) x 0.95 + 1 = 4.8 -> A4 + 0.8 (A5 - A4)
  // = 2 + 0.8 x 0 = 2.
  CHECK(s.abs_p95_m == Approx(2));
}

TEST_CASE("a bias shows in the mean and the RMSE, not the standard deviation", "[accuracy]") {
  // e = {0.5, 1.5}: mean 1; SD = sqrt((0.25 + 0.25) / 1) = 0.707107;
  // RMSE = sqrt((0.25 + 2.25) / 2) = sqrt(1.25) = 1.118034 = sqrt(mean^2 + SD^2 (n-1)/n).
  std::vector<double> e{0.5, 1.5};
  VerticalStats s = vertical_stats(e);
  CHECK(s.mean_m == Approx(1));
  CHECK(s.sd_m == Approx(0.707107).epsilon(1e-6));
  CHECK(s.rmse_m == Approx(1.118034).epsilon(1e-6));
}

TEST_CASE("the ASPRS percentile interpolates between closest ranks", "[accuracy]") {
  // Values 1..20: position (20 - 1) x 0.95 + 1 = 19.05 -> A19 + 0.05 (A20 - A19) = 19.05.
  std::vector<double> v;
  for (int i = 20; i >= 1; --i) v.push_back(i);  // unsorted on purpose
  CHECK(asprs_percentile(v, 95) == Approx(19.05));
  // Position (20 - 1) x 0.5 + 1 = 10.5 -> 10.5, the median.
  CHECK(asprs_percentile(v, 50) == Approx(10.5));
  CHECK(asprs_percentile(v, 100) == 20);
  CHECK(asprs_percentile({7.0}, 95) == 7);
}

TEST_CASE("NMAS 1947: the finest interval leaves at most 10 % beyond half of it", "[accuracy]") {
  // |e| = 0.1, 0.2, ..., 1.0 (ten points, signs mixed): floor(0.1 x 10) = 1 point may exceed
  // half the interval, so half the interval is the second largest, 0.9: interval 1.8 m.
  std::vector<double> e{0.1, -0.2, 0.3, -0.4, 0.5, -0.6, 0.7, -0.8, 0.9, -1.0};
  double ci = nmas_finest_interval_m(e);
  CHECK(ci == Approx(1.8));
  auto beyond = [&](double interval) {
    int n = 0;
    for (double v : e) n += std::abs(v) > interval / 2;
    return n;
  };
  CHECK(beyond(ci) == 1);         // 10 %: allowed
  CHECK(beyond(ci - 0.02) == 2);  // 20 %: not
  // Nine points: floor(0.9) = 0 may exceed; the interval is twice the largest error.
  std::vector<double> nine(e.begin(), e.begin() + 9);
  CHECK(nmas_finest_interval_m(nine) == Approx(1.8));
  // Twenty points, |e| = 0.05 .. 1.00: two may exceed; twice the third largest (0.90) = 1.8.
  std::vector<double> twenty;
  for (int i = 1; i <= 20; ++i) twenty.push_back(0.05 * i);
  CHECK(nmas_finest_interval_m(twenty) == Approx(1.8));
}

TEST_CASE("usual contour intervals: 1, 2, 2.5, 5 x 10^k (common practice)", "[accuracy]") {
  CHECK(usual_interval_at_least(0.08) == Approx(0.1));
  CHECK(usual_interval_at_least(0.1) == Approx(0.1));
  CHECK(usual_interval_at_least(2.1) == Approx(2.5));
  CHECK(usual_interval_at_least(3) == Approx(5));
  CHECK(usual_interval_at_least(6) == Approx(10));
  CHECK(usual_interval_at_least(10) == Approx(10));
  CHECK(usual_interval_at_least(26.3) == Approx(50));
}

TEST_CASE("an error beyond three standard deviations is an outlier", "[accuracy]") {
  // Twenty zeros and one 10: mean = 10/21 = 0.47619; deviations: 20 x 0.47619^2 = 4.53515 and
  // 9.52381^2 = 90.70295; SD = sqrt(95.2381 / 20) = 2.18218; 3 SD = 6.54654 < 9.52381.
  std::vector<double> e(20, 0.0);
  e.push_back(10);
  VerticalStats s = vertical_stats(e);
  CHECK(s.sd_m == Approx(2.18218).epsilon(1e-5));
  auto out = outliers_beyond_3sd(e, s);
  REQUIRE(out.size() == 1);
  CHECK(out[0] == 20);
  // Normal spread has none: {1, -1, 2, -2, 0}, SD 1.58, 3 SD = 4.74 > 2.
  std::vector<double> calm{1, -1, 2, -2, 0};
  CHECK(outliers_beyond_3sd(calm, vertical_stats(calm)).empty());
}

TEST_CASE("NSSDA horizontal accuracy, equal and unequal RMSE_x and RMSE_y", "[accuracy]") {
  // dx = dy = {1, -1, 1, -1}: RMSE_x = RMSE_y = 1; RMSE_r = sqrt(2) = 1.414214;
  // Accuracy_r = 2.4477 x 1 = 2.4477, and 1.7308 x RMSE_r = 2.44772 (the standard's two forms).
  std::vector<double> d{1, -1, 1, -1};
  HorizontalStats h = horizontal_stats(d, d);
  CHECK(h.rmse_x_m == Approx(1));
  CHECK(h.rmse_r_m == Approx(1.414214).epsilon(1e-6));
  CHECK(h.nssda_95_m == Approx(2.4477));
  CHECK(h.nssda_95_m == Approx(1.7308 * h.rmse_r_m).epsilon(1e-4));
  CHECK(h.approximation_holds());
  // RMSE_y = 0.8: ratio 0.8, within 0.6..1; Accuracy_r ~ 2.4477 x 0.5 x (1 + 0.8) = 2.20293.
  std::vector<double> dy{0.8, -0.8, 0.8, -0.8};
  HorizontalStats u = horizontal_stats(d, dy);
  CHECK(u.ratio == Approx(0.8));
  CHECK(u.nssda_95_m == Approx(2.20293).epsilon(1e-5));
  CHECK(u.approximation_holds());
  // RMSE_y = 0.5: ratio 0.5, outside the approximation's range.
  std::vector<double> flat{0.5, -0.5, 0.5, -0.5};
  CHECK_FALSE(horizontal_stats(d, flat).approximation_holds());
}
