#include "sheetmill/exhibit/colour_vision.hpp"

#include <algorithm>
#include <cmath>

namespace sheetmill::exhibit {

// sRGB transfer function, IEC 61966-2-1.
double srgb_to_linear(double c) {
  return c <= 0.04045 ? c / 12.92 : std::pow((c + 0.055) / 1.055, 2.4);
}
double linear_to_srgb(double c) {
  c = std::clamp(c, 0.0, 1.0);
  return c <= 0.0031308 ? 12.92 * c : 1.055 * std::pow(c, 1 / 2.4) - 0.055;
}

Lab to_lab(const Colour& srgb) {
  const double r = srgb_to_linear(srgb.r), g = srgb_to_linear(srgb.g), b = srgb_to_linear(srgb.b);
  // Linear sRGB to CIE XYZ (D65), IEC 61966-2-1; white point D65 (Xn 0.95047, Zn 1.08883).
  const double x = (0.4124564 * r + 0.3575761 * g + 0.1804375 * b) / 0.95047;
  const double y = 0.2126729 * r + 0.7151522 * g + 0.0721750 * b;
  const double z = (0.0193339 * r + 0.1191920 * g + 0.9503041 * b) / 1.08883;
  // CIE 15: f(t) = t^(1/3) above (6/29)^3, else linear.
  auto f = [](double t) {
    const double d = 6.0 / 29.0;
    return t > d * d * d ? std::cbrt(t) : t / (3 * d * d) + 4.0 / 29.0;
  };
  const double fx = f(x), fy = f(y), fz = f(z);
  return {116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)};
}

double delta_e76(const Lab& p, const Lab& q) {
  return std::sqrt((p.l - q.l) * (p.l - q.l) + (p.a - q.a) * (p.a - q.a) +
                   (p.b - q.b) * (p.b - q.b));
}

Colour simulate(const Colour& srgb, Deficiency deficiency) {
  // Machado, Oliveira and Fernandes (2009), Table 1, severity 1.0, for linear RGB.
  static const double kProtan[9] = {0.152286, 1.052583,  -0.204868, 0.114503, 0.786281,
                                    0.099216, -0.003882, -0.048116, 1.051998};
  static const double kDeutan[9] = {0.367322, 0.860646,  -0.227968, 0.280085, 0.672501,
                                    0.047413, -0.011820, 0.042940,  0.968881};
  static const double kTritan[9] = {1.255528, -0.076749, -0.178779, -0.078411, 0.930809,
                                    0.147602, 0.004733,  0.691367,  0.303900};
  const double* m = deficiency == Deficiency::protanopia     ? kProtan
                    : deficiency == Deficiency::deuteranopia ? kDeutan
                                                             : kTritan;
  const double r = srgb_to_linear(srgb.r), g = srgb_to_linear(srgb.g), b = srgb_to_linear(srgb.b);
  return {linear_to_srgb(m[0] * r + m[1] * g + m[2] * b),
          linear_to_srgb(m[3] * r + m[4] * g + m[5] * b),
          linear_to_srgb(m[6] * r + m[7] * g + m[8] * b), srgb.a};
}

}  // namespace sheetmill::exhibit
