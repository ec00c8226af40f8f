#pragma once
// Deterministic pseudo-random numbers for the demo area. The same seed gives the same numbers on
// every platform and standard library, because nothing here uses the standard distributions
// (their output is implementation-defined). Generator: SplitMix64 (Steele, Lea & Flood 2014).

#include <cstdint>

namespace sheetmill::demo {

// One round of the SplitMix64 finaliser: a well-mixed 64-bit hash of x.
inline std::uint64_t mix64(std::uint64_t x) {
  x += 0x9E3779B97F4A7C15ull;
  x = (x ^ (x >> 30)) * 0xBF58476D1CE4E5B9ull;
  x = (x ^ (x >> 27)) * 0x94D049BB133111EBull;
  return x ^ (x >> 31);
}

// A hash of a seed and up to three integers, as a double in [0, 1).
inline double hash01(std::uint64_t seed, std::int64_t a, std::int64_t b = 0, std::int64_t c = 0) {
  std::uint64_t h = mix64(
      seed ^ mix64(static_cast<std::uint64_t>(a) ^
                   mix64(static_cast<std::uint64_t>(b) ^ mix64(static_cast<std::uint64_t>(c)))));
  return static_cast<double>(h >> 11) * 0x1.0p-53;
}

class Random {
 public:
  explicit Random(std::uint64_t seed) : state_(mix64(seed)) {}
  // An independent stream for one purpose (e.g. "buildings"), so that adding draws in one
  // part of the generator does not shift the numbers every other part sees.
  Random fork(std::uint64_t purpose) const { return Random(state_ ^ mix64(purpose * 0x51ED27ull)); }

  std::uint64_t next() {
    state_ += 0x9E3779B97F4A7C15ull;
    std::uint64_t z = state_;
    z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ull;
    z = (z ^ (z >> 27)) * 0x94D049BB133111EBull;
    return z ^ (z >> 31);
  }
  // Uniform in [0, 1).
  double uniform() { return static_cast<double>(next() >> 11) * 0x1.0p-53; }
  double uniform(double lo, double hi) { return lo + (hi - lo) * uniform(); }
  // Uniform integer in [0, n); n > 0.
  int below(int n) { return static_cast<int>(uniform() * n); }

 private:
  std::uint64_t state_;
};

}  // namespace sheetmill::demo
