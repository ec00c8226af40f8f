#pragma once
// The per-row hillshade kernel (SIMD through Highway's runtime
// dispatch) and its scalar twin. Both evaluate the same float expressions in the same order, so
// a cell's byte does not depend on which path or which CPU target computed it.

#include <cmath>
#include <cstdint>

#include "sheetmill/terrain/shade.hpp"
#include "sheetmill/terrain/window3x3.hpp"

namespace sheetmill::terrain::detail {

struct ShadeCoefficients {
  ShadeMethod method = ShadeMethod::horn;
  float kx = 0, ky = 0;  // exaggeration / (8 or 2 cell widths), per row, metres
  float sin_alt = 0, cos_alt = 0;
  float sin_az_cos_alt = 0, cos_az_cos_alt = 0;  // single-light methods
};

ShadeCoefficients shade_coefficients(const ShadeParams& params, double cell_x_m, double cell_y_m);

// Lambert's cosine for a light from azimuth az at altitude alt on a surface with gradient
// (p, q) = (dz/dE, dz/dN): the surface normal is (-p, -q, 1) / sqrt(1 + p^2 + q^2) and the
// light vector (sin az cos alt, cos az cos alt, sin alt), so
//   cos i = (sin alt - (p sin az + q cos az) cos alt) / sqrt(1 + p^2 + q^2).
inline float illumination(float p, float q, const ShadeCoefficients& k) {
  float num = k.sin_alt - (p * k.sin_az_cos_alt + q * k.cos_az_cos_alt);
  float den = std::sqrt(1.0f + (p * p + q * q));
  return num / den;
}

// Mark (1992) multi-directional oblique weighting: lights at 225, 270, 315 and 360 deg, each
// clamped at 0, averaged with weights that depend on the aspect. With s = p^2 + q^2 the weights
// are s/2 + pq, p^2, s/2 - pq, q^2 (they sum to 2s); this is the weighting GDAL's reference
// implementation uses, so results compare cell by cell. A flat cell gets sin(alt).
inline float illumination_multi(float p, float q, const ShadeCoefficients& k) {
  constexpr float h = 0.70710678118654752f;  // sqrt(2) / 2
  float s = p * p + q * q;
  if (s == 0.0f) return k.sin_alt;
  const float hc = h * k.cos_alt;  // one product for both diagonal lights
  float c225 = std::fmax(k.sin_alt + (p + q) * hc, 0.0f);
  float c270 = std::fmax(k.sin_alt + p * k.cos_alt, 0.0f);
  float c315 = std::fmax(k.sin_alt + (p - q) * hc, 0.0f);
  float c360 = std::fmax(k.sin_alt - q * k.cos_alt, 0.0f);
  float pq = p * q;
  float half_s = s * 0.5f;
  float sum = (((half_s + pq) * c225 + (p * p) * c270) + (half_s - pq) * c315) + (q * q) * c360;
  // One division: (sum / 2s) / sqrt(1 + s) as sum / (2s sqrt(1 + s)).
  return sum / ((s * 2.0f) * std::sqrt(1.0f + s));
}

// 1 + 254 * max(illumination, 0), rounded to the nearest byte: 254 x + (1 + 0.5) truncated
// (the SIMD path evaluates exactly this).
inline std::uint8_t encode_shade(float illum) {
  float v = std::fmax(illum, 0.0f) * 254.0f + 1.5f;
  int b = static_cast<int>(v);
  return static_cast<std::uint8_t>(b > 255 ? 255 : b);
}

// The byte for one window (already gathered and filled).
inline std::uint8_t shade_window(const float w[9], const ShadeCoefficients& k) {
  float gx, gy;
  if (k.method == ShadeMethod::zevenbergen_thorne) {
    zt_differences(w, gx, gy);
  } else {
    horn_differences(w, gx, gy);
  }
  float p = gx * k.kx, q = gy * k.ky;
  float illum = k.method == ShadeMethod::multidirectional ? illumination_multi(p, q, k)
                                                          : illumination(p, q, k);
  return encode_shade(illum);
}

// One cell the slow, careful way (edges, holes).
inline std::uint8_t shade_cell(const float* above, const float* mid, const float* below, int width,
                               int c, const ShadeCoefficients& k) {
  float w[9];
  if (!gather_window(above, mid, below, width, c, w)) return 0;
  return shade_window(w, k);
}

// Shades one row of `width` cells. `above` and `below` are the neighbouring rows or null at
// the grid's edge. Dispatches to the best SIMD target of this CPU.
void shade_row(const float* above, const float* mid, const float* below, int width,
               const ShadeCoefficients& k, std::uint8_t* out);
// The scalar path alone (tests compare the two).
void shade_row_scalar(const float* above, const float* mid, const float* below, int width,
                      const ShadeCoefficients& k, std::uint8_t* out);

}  // namespace sheetmill::terrain::detail
