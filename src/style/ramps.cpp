// The built-in tint ramps, each defined over 0..1 and spread over the elevations a style names.
//
// slate-to-straw is the colour-vision-safe ramp: it runs along the blue-yellow axis, which
// red-green colour-blind readers (the common forms) still see, and its lightness rises at every
// stop, so order can be read from lightness alone, even in greyscale copies. It was built in
// OKLab (Ottosson 2020) at L = 0.42 .. 0.95 with b from -0.10 to +0.11; the test checks the
// CIE 1976 L* of each stop rises.

#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

struct RampStop {
  double at;
  const char* hex;
};

struct Ramp {
  const char* name;
  std::vector<RampStop> stops;
};

const std::vector<Ramp>& ramps() {
  static const std::vector<Ramp> all = {
      {"slate-to-straw",
       {{0.0, "#354983"},
        {1.0 / 6, "#50668c"},
        {2.0 / 6, "#6f8292"},
        {3.0 / 6, "#929d97"},
        {4.0 / 6, "#b7b899"},
        {5.0 / 6, "#dfd399"},
        {1.0, "#ffed97"}}},
      {"meadow-to-fell",
       {{0.0, "#6f9a5c"},
        {0.25, "#a3b86c"},
        {0.5, "#d8cf8a"},
        {0.75, "#c9a877"},
        {1.0, "#efe6da"}}},
      {"grey-steps", {{0.0, "#8c8c8c"}, {1.0, "#f2f2f2"}}},
  };
  return all;
}

}  // namespace

std::vector<std::string> builtin_ramp_names() {
  std::vector<std::string> names;
  for (const auto& r : ramps()) names.push_back(r.name);
  return names;
}

std::optional<std::vector<TintStop>> builtin_ramp(const std::string& name, double low_m,
                                                  double high_m) {
  for (const auto& r : ramps()) {
    if (name != r.name) continue;
    std::vector<TintStop> out;
    for (const auto& s : r.stops) {
      out.push_back({low_m + s.at * (high_m - low_m), *parse_hex_colour(s.hex)});
    }
    return out;
  }
  return std::nullopt;
}

}  // namespace sheetmill::style::detail
