#include "sheetmill/demo/noise.hpp"

#include <cmath>

namespace sheetmill::demo {

namespace {

// Perlin (2002): 6t^5 - 15t^4 + 10t^3, zero first and second derivatives at 0 and 1.
double fade(double t) {
  return t * t * t * (t * (t * 6 - 15) + 10);
}

double lattice_dot(std::uint64_t seed, std::int64_t i, std::int64_t j, double dx, double dy) {
  // A unit gradient in one of 16 directions, chosen by the hash of the lattice point.
  static constexpr double kDir[16][2] = {
      {1, 0},  {0.92388, 0.38268},   {0.70711, 0.70711},   {0.38268, 0.92388},
      {0, 1},  {-0.38268, 0.92388},  {-0.70711, 0.70711},  {-0.92388, 0.38268},
      {-1, 0}, {-0.92388, -0.38268}, {-0.70711, -0.70711}, {-0.38268, -0.92388},
      {0, -1}, {0.38268, -0.92388},  {0.70711, -0.70711},  {0.92388, -0.38268}};
  // A cheap multiply-xorshift hash is enough here: only 4 bits are used and the lattice
  // coordinates are small integers.
  std::uint64_t h = (static_cast<std::uint64_t>(i) * 0x9E3779B97F4A7C15ull) ^
                    (static_cast<std::uint64_t>(j) * 0xC2B2AE3D27D4EB4Full) ^ seed;
  h ^= h >> 32;
  h *= 0xD6E8FEB86659FD93ull;
  h ^= h >> 32;
  int k = static_cast<int>(h >> 28) & 15;
  return kDir[k][0] * dx + kDir[k][1] * dy;
}

}  // namespace

double gradient_noise(std::uint64_t seed, double x, double y) {
  double fx = std::floor(x);
  double fy = std::floor(y);
  auto i = static_cast<std::int64_t>(fx);
  auto j = static_cast<std::int64_t>(fy);
  double dx = x - fx;
  double dy = y - fy;
  double n00 = lattice_dot(seed, i, j, dx, dy);
  double n10 = lattice_dot(seed, i + 1, j, dx - 1, dy);
  double n01 = lattice_dot(seed, i, j + 1, dx, dy - 1);
  double n11 = lattice_dot(seed, i + 1, j + 1, dx - 1, dy - 1);
  double u = fade(dx);
  double v = fade(dy);
  double a = n00 + u * (n10 - n00);
  double b = n01 + u * (n11 - n01);
  // Scaled so that the range is close to [-1, 1] (the raw range is about +-0.7).
  return 1.4 * (a + v * (b - a));
}

double fbm(std::uint64_t seed, double x, double y, int octaves, double gain, double lacunarity) {
  double sum = 0;
  double amp = 1;
  double norm = 0;
  for (int o = 0; o < octaves; ++o) {
    sum += amp * gradient_noise(seed + 7919u * static_cast<std::uint64_t>(o), x, y);
    norm += amp;
    amp *= gain;
    // A small rotation between octaves keeps lattice artefacts from lining up.
    double rx = 0.8 * x - 0.6 * y;
    double ry = 0.6 * x + 0.8 * y;
    x = rx * lacunarity + 17.31;
    y = ry * lacunarity - 4.77;
  }
  return sum / norm;
}

double ridged(std::uint64_t seed, double x, double y, int octaves, double gain, double lacunarity) {
  // Musgrave's ridged multifractal with offset 1: signal = (1 - |n|)^2, each octave weighted
  // by the previous signal so detail gathers on the crests.
  double sum = 0;
  double amp = 1;
  double norm = 0;
  double weight = 1;
  for (int o = 0; o < octaves; ++o) {
    double n = gradient_noise(seed + 104729u * static_cast<std::uint64_t>(o + 1), x, y);
    double signal = 1 - std::fabs(n);
    signal *= signal;
    signal *= weight;
    weight = std::fmin(1.0, std::fmax(0.0, signal * 2));
    sum += amp * signal;
    norm += amp;
    amp *= gain;
    double rx = 0.8 * x - 0.6 * y;
    double ry = 0.6 * x + 0.8 * y;
    x = rx * lacunarity + 3.17;
    y = ry * lacunarity + 9.41;
  }
  return sum / norm;
}

}  // namespace sheetmill::demo
