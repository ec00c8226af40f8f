#pragma once
// Shipped hypsometric ramps for exhibits, and fitting one to the ground being shown.
//
// A shipped ramp is a list of colours at relative positions 0..1 (low to high). fit_ramp()
// places it over an elevation range whose ends and steps are Heckbert (1990) nice numbers, so
// every stop of the resulting TintRamp sits at a round elevation the colour bar can label.
// "groundlight" (the default) and "clearsight" are designed for colour-vision deficiency:
// CIELAB lightness rises monotonically
// from stop to stop and neighbouring stops stay apart under simulated deuteranopia and
// protanopia (tests/exhibit/ramp_test.cpp checks both). "groundlight" has no blue or teal, so
// low dry land never takes the colour of water; "clearsight" starts in blue-green. "meadow" is a
// conventional green-brown-white ramp that is not safe for red-green deficiency.

#include <string>
#include <utility>
#include <vector>

#include "sheetmill/core/colour.hpp"
#include "sheetmill/terrain/tint.hpp"

namespace sheetmill::exhibit {

struct ShippedRamp {
  std::string name;
  std::vector<std::pair<double, Colour>> stops;  // position 0..1 ascending, sRGB colour
  bool colour_vision_safe = false;
};

const std::vector<ShippedRamp>& shipped_ramps();
// Throws Error(input) naming the shipped ramps when `name` is not one of them.
const ShippedRamp& shipped_ramp(const std::string& name);

// The ramp's colour at relative position t (clamped to 0..1), linear in sRGB components.
Colour ramp_colour_at(const ShippedRamp& ramp, double t);

// A TintRamp with stops at nice elevations covering [lo_m, hi_m]: about `stops` stops
// (at least 3), coloured from `ramp` by their relative position in the covered range.
terrain::TintRamp fit_ramp(const ShippedRamp& ramp, double lo_m, double hi_m, int stops = 6);

}  // namespace sheetmill::exhibit
