// The hillshade row kernel, compiled once per SIMD target and chosen at run time (Highway's
// foreach_target + HWY_DYNAMIC_DISPATCH), so the default build needs no -march flag.
#undef HWY_TARGET_INCLUDE
#define HWY_TARGET_INCLUDE "terrain/shade_kernel.cpp"
#include "sheetmill/terrain/shade_kernel.hpp"

#include <hwy/foreach_target.h>  // must precede highway.h
#include <hwy/highway.h>

HWY_BEFORE_NAMESPACE();
namespace sheetmill::terrain::detail {
namespace HWY_NAMESPACE {
namespace hn = hwy::HWY_NAMESPACE;

// Mirrors shade_window() operation for operation (no fused multiply-add), so SIMD and scalar
// results are identical.
void shade_row_simd(const float* above, const float* mid, const float* below, int width,
                    const ShadeCoefficients& k, std::uint8_t* out) {
  const hn::ScalableTag<float> d;
  const hn::Rebind<std::int32_t, decltype(d)> di;
  const hn::Rebind<std::uint8_t, decltype(d)> du8;
  const int n = static_cast<int>(hn::Lanes(d));
  const auto two = hn::Set(d, 2.0f), one = hn::Set(d, 1.0f), zero = hn::Zero(d);
  const auto half = hn::Set(d, 0.5f), scale = hn::Set(d, 254.0f);
  const auto kx = hn::Set(d, k.kx), ky = hn::Set(d, k.ky);
  const auto sin_alt = hn::Set(d, k.sin_alt), cos_alt = hn::Set(d, k.cos_alt);
  const auto sa_ca = hn::Set(d, k.sin_az_cos_alt), ca_ca = hn::Set(d, k.cos_az_cos_alt);
  const auto h = hn::Set(d, 0.70710678118654752f);
  const auto one_and_half = hn::Set(d, 1.5f);
  const bool zt = k.method == ShadeMethod::zevenbergen_thorne;
  const bool multi = k.method == ShadeMethod::multidirectional;

  // Shades the n cells starting at column c (1 <= c, c + n <= width - 1).
  auto shade_vector = [&](int c) HWY_ATTR {
    const auto a0 = hn::LoadU(d, above + c - 1), a1 = hn::LoadU(d, above + c),
               a2 = hn::LoadU(d, above + c + 1);
    const auto m0 = hn::LoadU(d, mid + c - 1), m1 = hn::LoadU(d, mid + c),
               m2 = hn::LoadU(d, mid + c + 1);
    const auto b0 = hn::LoadU(d, below + c - 1), b1 = hn::LoadU(d, below + c),
               b2 = hn::LoadU(d, below + c + 1);
    hn::Vec<decltype(d)> gx, gy;
    if (zt) {
      gx = hn::Sub(m2, m0);
      gy = hn::Sub(a1, b1);
    } else {
      gx = hn::Add(hn::Add(hn::Sub(a2, a0), hn::Mul(hn::Sub(m2, m0), two)), hn::Sub(b2, b0));
      gy = hn::Add(hn::Add(hn::Sub(a0, b0), hn::Mul(hn::Sub(a1, b1), two)), hn::Sub(a2, b2));
    }
    // A NaN among the cells the gradient reads, or in the centre, makes this sum NaN (NaN
    // propagates through addition); those lanes are redone by the scalar path.
    const auto bad = hn::IsNaN(hn::Add(hn::Add(gx, gy), m1));

    const auto p = hn::Mul(gx, kx), q = hn::Mul(gy, ky);
    const auto pp = hn::Mul(p, p), qq = hn::Mul(q, q);
    const auto s = hn::Add(pp, qq);
    hn::Vec<decltype(d)> illum;
    if (!multi) {
      const auto num = hn::Sub(sin_alt, hn::Add(hn::Mul(p, sa_ca), hn::Mul(q, ca_ca)));
      illum = hn::Div(num, hn::Sqrt(hn::Add(one, s)));
    } else {
      const auto c225 =
          hn::Max(hn::Add(sin_alt, hn::Mul(hn::Mul(hn::Add(p, q), h), cos_alt)), zero);
      const auto c270 = hn::Max(hn::Add(sin_alt, hn::Mul(p, cos_alt)), zero);
      const auto c315 =
          hn::Max(hn::Add(sin_alt, hn::Mul(hn::Mul(hn::Sub(p, q), h), cos_alt)), zero);
      const auto c360 = hn::Max(hn::Sub(sin_alt, hn::Mul(q, cos_alt)), zero);
      const auto pq = hn::Mul(p, q);
      const auto half_s = hn::Mul(s, half);
      auto sum = hn::Add(hn::Mul(hn::Add(half_s, pq), c225), hn::Mul(pp, c270));
      sum = hn::Add(sum, hn::Mul(hn::Sub(half_s, pq), c315));
      sum = hn::Add(sum, hn::Mul(qq, c360));
      const auto mean = hn::Div(sum, hn::Mul(s, two));
      illum = hn::Div(mean, hn::Sqrt(hn::Add(one, s)));
      illum = hn::IfThenElse(hn::Eq(s, zero), sin_alt, illum);
    }
    // 1 + 254 x + 0.5 folded into one addition, then truncation = rounding (v >= 1.5); the
    // demotion to bytes saturates at 255.
    const auto v = hn::Add(hn::Mul(hn::Max(illum, zero), scale), one_and_half);
    const auto vi = hn::ConvertTo(di, v);
    hn::StoreU(hn::DemoteTo(du8, vi), du8, out + c);
    if (HWY_UNLIKELY(!hn::AllFalse(d, bad))) {
      // Holes are 0 at once; only cells with data next to a hole take the scalar path.
      for (int i = 0; i < n; ++i) {
        out[c + i] = std::isnan(mid[c + i]) ? 0 : shade_cell(above, mid, below, width, c + i, k);
      }
    }
  };
  out[0] = shade_cell(above, mid, below, width, 0, k);
  int c = 1;
  if (above && below && width - 2 >= n) {
    for (; c + n <= width - 1; c += n) shade_vector(c);
    // The last partial vector overlaps the previous one (same values rewritten) instead of
    // falling back to the slow scalar path.
    if (c < width - 1) {
      shade_vector(width - 1 - n);
      c = width - 1;
    }
  }
  for (; c < width; ++c) out[c] = shade_cell(above, mid, below, width, c, k);
}

}  // namespace HWY_NAMESPACE
}  // namespace sheetmill::terrain::detail
HWY_AFTER_NAMESPACE();

#if HWY_ONCE
namespace sheetmill::terrain::detail {

HWY_EXPORT(shade_row_simd);

void shade_row(const float* above, const float* mid, const float* below, int width,
               const ShadeCoefficients& k, std::uint8_t* out) {
  if (width <= 0) return;
  HWY_DYNAMIC_DISPATCH(shade_row_simd)(above, mid, below, width, k, out);
}

void shade_row_scalar(const float* above, const float* mid, const float* below, int width,
                      const ShadeCoefficients& k, std::uint8_t* out) {
  for (int c = 0; c < width; ++c) out[c] = shade_cell(above, mid, below, width, c, k);
}

}  // namespace sheetmill::terrain::detail
#endif  // HWY_ONCE
