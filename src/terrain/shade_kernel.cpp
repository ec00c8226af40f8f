// The hillshade row kernel, compiled once per SIMD target and chosen at run time (Highway's
// foreach_target + HWY_DYNAMIC_DISPATCH), so the default build needs no -march flag.
#undef HWY_TARGET_INCLUDE
#define HWY_TARGET_INCLUDE "terrain/shade_kernel.cpp"
#include "sheetmill/terrain/shade_kernel.hpp"

#include <hwy/cache_control.h>
#include <hwy/foreach_target.h>  // must precede highway.h
#include <hwy/highway.h>

HWY_BEFORE_NAMESPACE();
namespace sheetmill::terrain::detail {
namespace HWY_NAMESPACE {
namespace hn = hwy::HWY_NAMESPACE;

// The constants of one row, broadcast once per row.
template <class D>
struct ShadeVectors {
  hn::Vec<D> two, one, zero, half, scale, one_and_half;
  hn::Vec<D> kx, ky, sin_alt, cos_alt, sa_ca, ca_ca, hc;
  explicit ShadeVectors(D d, const ShadeCoefficients& k)
      : two(hn::Set(d, 2.0f)),
        one(hn::Set(d, 1.0f)),
        zero(hn::Zero(d)),
        half(hn::Set(d, 0.5f)),
        scale(hn::Set(d, 254.0f)),
        one_and_half(hn::Set(d, 1.5f)),
        kx(hn::Set(d, k.kx)),
        ky(hn::Set(d, k.ky)),
        sin_alt(hn::Set(d, k.sin_alt)),
        cos_alt(hn::Set(d, k.cos_alt)),
        sa_ca(hn::Set(d, k.sin_az_cos_alt)),
        ca_ca(hn::Set(d, k.cos_az_cos_alt)),
        hc(hn::Set(d, 0.70710678118654752f * k.cos_alt)) {}
};

// Shades the Lanes(d) cells starting at column c (1 <= c, c + Lanes(d) <= width - 1) and
// returns true when one of them reads a hole (those cells are redone by the caller). Mirrors
// shade_window() operation for operation (no fused multiply-add), so SIMD and scalar results
// are identical. Inlined into the row loop with the method fixed at compile time: a call per
// vector, reloading the constants through a closure, cost a third of the time.
template <ShadeMethod kMethod, class D>
HWY_INLINE bool shade_vector(D d, const ShadeVectors<D>& v, const float* above, const float* mid,
                             const float* below, int c, std::uint8_t* out) {
  const hn::RebindToSigned<D> di;
  const hn::RebindToUnsigned<D> du;
  const auto m0 = hn::LoadU(d, mid + c - 1), m1 = hn::LoadU(d, mid + c),
             m2 = hn::LoadU(d, mid + c + 1);
  hn::Vec<D> gx, gy;
  if constexpr (kMethod == ShadeMethod::zevenbergen_thorne) {
    gx = hn::Sub(m2, m0);
    gy = hn::Sub(hn::LoadU(d, above + c), hn::LoadU(d, below + c));
  } else {
    const auto a0 = hn::LoadU(d, above + c - 1), a1 = hn::LoadU(d, above + c),
               a2 = hn::LoadU(d, above + c + 1);
    const auto b0 = hn::LoadU(d, below + c - 1), b1 = hn::LoadU(d, below + c),
               b2 = hn::LoadU(d, below + c + 1);
    gx = hn::Add(hn::Add(hn::Sub(a2, a0), hn::Mul(hn::Sub(m2, m0), v.two)), hn::Sub(b2, b0));
    gy = hn::Add(hn::Add(hn::Sub(a0, b0), hn::Mul(hn::Sub(a1, b1), v.two)), hn::Sub(a2, b2));
  }
  // A NaN among the cells the gradient reads, or in the centre, makes this sum NaN (NaN
  // propagates through addition).
  const auto bad = hn::IsNaN(hn::Add(hn::Add(gx, gy), m1));

  const auto p = hn::Mul(gx, v.kx), q = hn::Mul(gy, v.ky);
  const auto pp = hn::Mul(p, p), qq = hn::Mul(q, q);
  const auto s = hn::Add(pp, qq);
  hn::Vec<D> illum;
  if constexpr (kMethod != ShadeMethod::multidirectional) {
    const auto num = hn::Sub(v.sin_alt, hn::Add(hn::Mul(p, v.sa_ca), hn::Mul(q, v.ca_ca)));
    illum = hn::Div(num, hn::Sqrt(hn::Add(v.one, s)));
  } else {
    const auto c225 = hn::Max(hn::Add(v.sin_alt, hn::Mul(hn::Add(p, q), v.hc)), v.zero);
    const auto c270 = hn::Max(hn::Add(v.sin_alt, hn::Mul(p, v.cos_alt)), v.zero);
    const auto c315 = hn::Max(hn::Add(v.sin_alt, hn::Mul(hn::Sub(p, q), v.hc)), v.zero);
    const auto c360 = hn::Max(hn::Sub(v.sin_alt, hn::Mul(q, v.cos_alt)), v.zero);
    const auto pq = hn::Mul(p, q);
    const auto half_s = hn::Mul(s, v.half);
    auto sum = hn::Add(hn::Mul(hn::Add(half_s, pq), c225), hn::Mul(pp, c270));
    sum = hn::Add(sum, hn::Mul(hn::Sub(half_s, pq), c315));
    sum = hn::Add(sum, hn::Mul(qq, c360));
    illum = hn::Div(sum, hn::Mul(hn::Mul(s, v.two), hn::Sqrt(hn::Add(v.one, s))));
    illum = hn::IfThenElse(hn::Eq(s, v.zero), v.sin_alt, illum);
  }
  // 1 + 254 x + 0.5 folded into one addition, then truncation = rounding (v >= 1.5). The
  // clamp at 255 matches encode_shade(); the value then fits the narrowing to bytes.
  const auto byte = hn::Add(hn::Mul(hn::Max(illum, v.zero), v.scale), v.one_and_half);
  const auto vi = hn::Min(hn::ConvertTo(di, byte), hn::Set(di, 255));
  hn::StoreU(hn::U8FromU32(hn::BitCast(du, vi)), hn::Rebind<std::uint8_t, D>(), out + c);
  return !hn::AllFalse(d, bad);
}

template <ShadeMethod kMethod>
void shade_row_method(const float* above, const float* mid, const float* below, int width,
                      const ShadeCoefficients& k, std::uint8_t* out) {
  const hn::ScalableTag<float> d;
  const int n = static_cast<int>(hn::Lanes(d));
  const ShadeVectors<hn::ScalableTag<float>> v(d, k);
  // Holes are 0 at once; only cells with data next to a hole take the scalar path.
  auto redo = [&](int c) {
    for (int i = 0; i < n; ++i) {
      out[c + i] = std::isnan(mid[c + i]) ? 0 : shade_cell(above, mid, below, width, c + i, k);
    }
  };
  out[0] = shade_cell(above, mid, below, width, 0, k);
  int c = 1;
  if (above && below && width - 2 >= n) {
    for (; c + n <= width - 1; c += n) {
      hwy::Prefetch(below + c + 512);
      if (HWY_UNLIKELY(shade_vector<kMethod>(d, v, above, mid, below, c, out))) redo(c);
    }
    // The last partial vector overlaps the previous one (same values rewritten) instead of
    // falling back to the slow scalar path.
    if (c < width - 1) {
      const int last = width - 1 - n;
      if (HWY_UNLIKELY(shade_vector<kMethod>(d, v, above, mid, below, last, out))) redo(last);
      c = width - 1;
    }
  }
  for (; c < width; ++c) out[c] = shade_cell(above, mid, below, width, c, k);
}

void shade_row_simd(const float* above, const float* mid, const float* below, int width,
                    const ShadeCoefficients& k, std::uint8_t* out) {
  switch (k.method) {
    case ShadeMethod::horn:
      return shade_row_method<ShadeMethod::horn>(above, mid, below, width, k, out);
    case ShadeMethod::zevenbergen_thorne:
      return shade_row_method<ShadeMethod::zevenbergen_thorne>(above, mid, below, width, k, out);
    case ShadeMethod::multidirectional:
      return shade_row_method<ShadeMethod::multidirectional>(above, mid, below, width, k, out);
  }
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
