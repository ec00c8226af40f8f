// Hillshade of analytic planes z = p E + q N, whose Horn and Zevenbergen-Thorne gradients are
// exactly (p, q) at every cell. Expected bytes are worked out by hand from Lambert's cosine
//   illum = (sin alt - (p sin az + q cos az) cos alt) / sqrt(1 + p^2 + q^2)
// (Horn 1981, eq. for a distant light; the same expression as GDAL's hillshade) and the common
// encoding byte = round(1 + 254 max(illum, 0)). Every cell is checked, edges included, since
// edge neighbours are reflected through the centre, which is exact on a plane.
#include <catch2/catch.hpp>
#include <cmath>
#include <random>

#include "dem_fixtures.hpp"
#include "sheetmill/terrain/shade.hpp"
#include "sheetmill/terrain/shade_kernel.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;

namespace {
Dem plane(double p, double q, int w = 37, int h = 23) {
  auto g = fixture::make_grid(w, h, 500000, 4000000, 10.0, fixture::wkt_of(32633));
  return fixture::sample_dem(
      g, [&](double e, double n) { return p * (e - 500000) + q * (n - 3999000); });
}

void check_all(const Dem& dem, const ShadeParams& sp, int expected) {
  auto bytes = hillshade(dem, sp);
  int wrong = 0, first = -1;
  for (std::size_t i = 0; i < bytes.size(); ++i) {
    if (bytes[i] != expected) {
      ++wrong;
      if (first < 0) first = bytes[i];
    }
  }
  INFO("method " << shade_method_name(sp.method) << " az " << sp.azimuth_deg << " alt "
                 << sp.altitude_deg << "; first wrong byte " << first);
  CHECK(wrong == 0);
}

struct PlaneCase {
  double p, q, az, alt, exaggeration;
  int expected;
};
}  // namespace

TEST_CASE("single-light hillshade of planes matches the hand-worked bytes", "[terrain]") {
  // Each expected value by hand (sa = sin az cos alt, ca = cos az cos alt):
  const PlaneCase cases[] = {
      // flat: illum = sin 45 = 0.70711 -> 1 + 179.61 = 180.61 -> 181
      {0, 0, 315, 45, 1, 181},
      // faces east: sa = -0.5, ca = 0.5; num = 0.70711 - (-1)(-0.5) = 0.20711; den = sqrt 2
      // illum = 0.14645 -> 1 + 37.197 = 38.197 -> 38
      {-1, 0, 315, 45, 1, 38},
      // the same plane from p = -0.5 with exaggeration 2 (p becomes -1): 38
      {-0.5, 0, 315, 45, 2, 38},
      // faces north-west, toward the light: num = 0.70711 - (1(-0.5) + (-1)(0.5)) = 1.70711;
      // den = sqrt 3 = 1.73205; illum = 0.98560 -> 1 + 250.34 -> 251
      {1, -1, 315, 45, 1, 251},
      // light from the east at 30: sa = 0.86603, ca = 0; num = 0.5 + 0.5 * 0.86603 = 0.93301;
      // den = sqrt(1.3125) = 1.14564; illum = 0.81440 -> 1 + 206.86 -> 208
      {-0.5, 0.25, 90, 30, 1, 208},
      // light from the south at 60: sa = 0, ca = -0.5; num = 0.86603 + 0.05 = 0.91603;
      // den = sqrt 1.1 = 1.04881; illum = 0.87340 -> 1 + 221.84 -> 223
      {0.3, 0.1, 180, 60, 1, 223},
      // light from the north at 20: sa = 0, ca = 0.93969; num = 0.34202 + 0.37588 = 0.71790;
      // den = sqrt 1.2 = 1.09545; illum = 0.65535 -> 1 + 166.46 -> 167
      {0.2, -0.4, 0, 20, 1, 167},
      // steep slope facing away (south-east): num = 0.70711 - (1 + 1) < 0 -> clamped -> 1
      {-2, 2, 315, 45, 1, 1},
  };
  for (const auto& k : cases) {
    Dem dem = plane(k.p, k.q);
    for (ShadeMethod m : {ShadeMethod::horn, ShadeMethod::zevenbergen_thorne}) {
      check_all(dem, {m, k.az, k.alt, k.exaggeration}, k.expected);
    }
  }
}

TEST_CASE("multidirectional hillshade of planes matches the hand-worked bytes", "[terrain]") {
  // Mark (1992) weighting as GDAL implements it: lights at 225/270/315/360, each clamped at 0;
  // with s = p^2 + q^2 weights s/2 + pq, p^2, s/2 - pq, q^2; illum = sum / (2 s) / sqrt(1 + s).
  // h = sqrt(2)/2 = 0.70711, alt 45: sin = cos = 0.70711.
  const PlaneCase cases[] = {
      // flat: sin 45 -> 181
      {0, 0, 0, 45, 1, 181},
      // p = -1, q = 0: s = 1; weights 0.5, 1, 0.5, 0; lights 0.20711, 0, 0.20711, 0.70711;
      // sum = 0.20711; /2 = 0.10355; / sqrt 2 = 0.07322 -> 1 + 18.599 -> 20
      {-1, 0, 0, 45, 1, 20},
      // p = 0.5, q = 0.25: s = 0.3125, pq = 0.125; weights 0.28125, 0.25, 0.03125, 0.0625;
      // lights 1.08211, 1.06066, 0.83211, 0.53033; sum = 0.62866; / 0.625 = 1.00585;
      // / sqrt 1.3125 = 0.87798 -> 1 + 223.01 -> 224
      {0.5, 0.25, 0, 45, 1, 224},
      // alt 30 (sin 0.5, cos 0.86603), p = -0.3, q = 0.6: s = 0.45, pq = -0.18; weights 0.045,
      // 0.09, 0.405, 0.36; lights 0.68371, 0.24019, 0, 0 -> sum = 0.05238; / 0.9 = 0.05820;
      // / sqrt 1.45 = 0.04834 -> 1 + 12.277 -> 13
      {-0.3, 0.6, 0, 30, 1, 13},
  };
  for (const auto& k : cases) {
    check_all(plane(k.p, k.q), {ShadeMethod::multidirectional, k.az, k.alt, k.exaggeration},
              k.expected);
  }
}

TEST_CASE("SIMD and scalar shading paths give identical bytes, holes included", "[terrain]") {
  // Random rough terrain with scattered holes: the dispatched kernel must equal the scalar
  // reference everywhere (both evaluate the same float expressions in the same order).
  std::mt19937 rng(7);
  std::uniform_real_distribution<float> u(0, 50);
  const int w = 203, h = 5;
  std::vector<float> z(static_cast<std::size_t>(w) * h);
  for (auto& v : z) v = 1000 + u(rng);
  for (int i = 0; i < 40; ++i) z[rng() % z.size()] = NAN;
  for (ShadeMethod m :
       {ShadeMethod::horn, ShadeMethod::zevenbergen_thorne, ShadeMethod::multidirectional}) {
    auto k = detail::shade_coefficients({m, 300, 35, 1.5}, 30.0, 30.0);
    for (int r = 0; r < h; ++r) {
      const float* mid = z.data() + r * w;
      const float* above = r > 0 ? mid - w : nullptr;
      const float* below = r + 1 < h ? mid + w : nullptr;
      std::vector<std::uint8_t> a(w), b(w);
      detail::shade_row(above, mid, below, w, k, a.data());
      detail::shade_row_scalar(above, mid, below, w, k, b.data());
      INFO("method " << shade_method_name(m) << " row " << r);
      CHECK(a == b);
      for (int c = 0; c < w; ++c) {
        if (std::isnan(mid[c]))
          CHECK(a[c] == 0);
        else
          CHECK(a[c] >= 1);
      }
    }
  }
}
