#pragma once
// Hypsometric tint: a colour for each elevation from a ramp of elevation stops.
//
// Smooth ramps interpolate linearly (in sRGB components) between neighbouring stops and hold
// the end colours beyond the first and last stop. Stepped ramps give every band one flat
// colour: with step_m > 0 the bands are [k step, (k+1) step) (so steps can follow the contour
// interval) coloured as the smooth ramp at the band's middle; with step_m = 0 the bands are
// the intervals between stops, each in its lower stop's colour.
//
// Ramp files (format of this project, documented in docs/relief.md) are YAML:
//   blend: smooth            # or "steps"
//   step: 20 m               # optional, with blend: steps; a length with its unit (m, ft)
//   stops:
//     - {elevation: 0 m, colour: "#5b8a50"}
//     - {elevation: 800 m, colour: "#e8dcb0"}

#include <filesystem>
#include <string>
#include <utility>
#include <vector>

#include "sheetmill/core/colour.hpp"

namespace sheetmill::terrain {

struct TintRamp {
  std::vector<std::pair<double, Colour>> stops;  // elevation in metres, ascending
  bool stepped = false;
  double step_m = 0;  // > 0: steps at multiples of step_m (the contour interval)
};

// The ramp's colour at elevation z_m. The ramp must have at least one stop.
Colour tint_colour(const TintRamp& ramp, double z_m);

// Throws Error(input) when the ramp has no stops, stops out of order, or a negative step.
void validate_ramp(const TintRamp& ramp, const std::string& where);

// Loads a ramp file; errors carry FILE:LINE:COL and the key path.
TintRamp load_ramp_file(const std::filesystem::path& path);
TintRamp load_ramp_string(const std::string& yaml_text, const std::string& name);

// "#rrggbb" or "#rrggbbaa"; returns false for anything else.
bool parse_hex_colour(const std::string& text, Colour& out);

}  // namespace sheetmill::terrain
