#pragma once
// Coherent noise for synthetic terrain. All functions are pure: the same seed and coordinates
// give the same value. Coordinates are in "noise units" (callers divide metres by a wavelength).
//
// gradient_noise: Perlin's gradient noise with the quintic fade of Perlin (2002, "Improving
//   noise"), gradients from a hash of the lattice point; range about [-1, 1], 0 at lattice points.
// fbm: fractional Brownian motion, a sum of octaves with gain per octave (Musgrave 1994 in
//   Ebert et al., "Texturing and Modeling"); range about [-1, 1].
// ridged: Musgrave's ridged multifractal (same source): sharp crests where the noise crosses
//   zero, weighted so crests carry finer detail than valleys; range [0, about 1].

#include <cstdint>

namespace sheetmill::demo {

double gradient_noise(std::uint64_t seed, double x, double y);
double fbm(std::uint64_t seed, double x, double y, int octaves, double gain = 0.5,
           double lacunarity = 2.0);
double ridged(std::uint64_t seed, double x, double y, int octaves, double gain = 0.5,
              double lacunarity = 2.0);

}  // namespace sheetmill::demo
