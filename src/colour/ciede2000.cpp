// CIEDE2000, following the implementation notes of Sharma, Wu and Dalal (2005), equations
// (1)-(22), with the parametric factors kL = kC = kH = 1. The hue angle and mean hue follow
// their notes on the discontinuities (h' = 0 when a' = b' = 0; mean hue when |h1 - h2| > 180).
#include <cmath>
#include <numbers>

#include "sheetmill/colour/colour_engine.hpp"

namespace sheetmill::print {

namespace {
constexpr double kPi = std::numbers::pi;
double deg(double rad) {
  return rad * 180.0 / kPi;
}
double rad(double d) {
  return d * kPi / 180.0;
}
double pow7(double v) {
  double v2 = v * v;
  return v2 * v2 * v2 * v;
}
}  // namespace

double ciede2000(const Lab& x, const Lab& y) {
  const double c1 = std::hypot(x.a, x.b), c2 = std::hypot(y.a, y.b);
  const double c_mean = (c1 + c2) / 2;
  const double g = 0.5 * (1 - std::sqrt(pow7(c_mean) / (pow7(c_mean) + pow7(25.0))));  // (4)
  const double a1 = (1 + g) * x.a, a2 = (1 + g) * y.a;                                 // (5)
  const double cp1 = std::hypot(a1, x.b), cp2 = std::hypot(a2, y.b);                   // (6)
  auto hue = [](double b, double a) {                                                  // (7)
    if (a == 0 && b == 0) return 0.0;
    double h = deg(std::atan2(b, a));
    return h < 0 ? h + 360 : h;
  };
  const double hp1 = hue(x.b, a1), hp2 = hue(y.b, a2);
  const double dL = y.L - x.L;  // (8)
  const double dC = cp2 - cp1;  // (9)
  double dh = 0;                // (10)
  if (cp1 * cp2 != 0) {
    dh = hp2 - hp1;
    if (dh > 180)
      dh -= 360;
    else if (dh < -180)
      dh += 360;
  }
  const double dH = 2 * std::sqrt(cp1 * cp2) * std::sin(rad(dh / 2));  // (11)
  const double L_mean = (x.L + y.L) / 2;                               // (12)
  const double cp_mean = (cp1 + cp2) / 2;                              // (13)
  double h_mean = hp1 + hp2;                                           // (14)
  if (cp1 * cp2 != 0) {
    if (std::abs(hp1 - hp2) <= 180)
      h_mean /= 2;
    else if (hp1 + hp2 < 360)
      h_mean = (hp1 + hp2 + 360) / 2;
    else
      h_mean = (hp1 + hp2 - 360) / 2;
  }
  const double t = 1 - 0.17 * std::cos(rad(h_mean - 30)) + 0.24 * std::cos(rad(2 * h_mean)) +
                   0.32 * std::cos(rad(3 * h_mean + 6)) -
                   0.20 * std::cos(rad(4 * h_mean - 63));                         // (15)
  const double d_theta = 30 * std::exp(-std::pow((h_mean - 275) / 25, 2));        // (16)
  const double rc = 2 * std::sqrt(pow7(cp_mean) / (pow7(cp_mean) + pow7(25.0)));  // (17)
  const double sl =
      1 + 0.015 * std::pow(L_mean - 50, 2) / std::sqrt(20 + std::pow(L_mean - 50, 2));  // (18)
  const double sc = 1 + 0.045 * cp_mean;                                                // (19)
  const double sh = 1 + 0.015 * cp_mean * t;                                            // (20)
  const double rt = -std::sin(rad(2 * d_theta)) * rc;                                   // (21)
  const double l = dL / sl, c = dC / sc, h = dH / sh;
  return std::sqrt(l * l + c * c + h * h + rt * c * h);  // (22)
}

}  // namespace sheetmill::print
