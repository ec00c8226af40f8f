#pragma once
// Colour science used to check ramps: sRGB to CIELAB (D65, IEC 61966-2-1 transfer function,
// CIE 15 Lab), the CIE76 colour difference, and the simulation of dichromatic vision after
// Machado, Oliveira and Fernandes (2009), "A physiologically-based model for simulation of
// color vision deficiency", IEEE TVCG 15(6), severity 1.0 matrices, applied in linear RGB.

#include "sheetmill/core/colour.hpp"

namespace sheetmill::exhibit {

struct Lab {
  double l = 0, a = 0, b = 0;
};

double srgb_to_linear(double c);
double linear_to_srgb(double c);
Lab to_lab(const Colour& srgb);
double delta_e76(const Lab& x, const Lab& y);

enum class Deficiency { deuteranopia, protanopia, tritanopia };
// The colour as a dichromat would see it (sRGB in, sRGB out, clamped to 0..1).
Colour simulate(const Colour& srgb, Deficiency deficiency);

}  // namespace sheetmill::exhibit
