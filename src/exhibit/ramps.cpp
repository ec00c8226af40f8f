#include "sheetmill/exhibit/ramps.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/sheet/nice_numbers.hpp"

namespace sheetmill::exhibit {

namespace {
Colour hex(unsigned v) {
  return {((v >> 16) & 255) / 255.0, ((v >> 8) & 255) / 255.0, (v & 255) / 255.0, 1};
}
}  // namespace

const std::vector<ShippedRamp>& shipped_ramps() {
  // "clearsight": our own design. Anchors chosen in CIE LCh with lightness 30, 44, 57, 69, 80,
  // 90, 97 and hue turning from blue-green (250 deg) through green and olive to cream (80 deg),
  // so that lightness alone orders the elevations and the blue-yellow opponent axis, which
  // dichromats keep, carries the hue change. "meadow": conventional greens, tans and browns
  // to a pale top; its green-to-brown step is hard to tell apart for red-green deficiency.
  // "groundlight" (the default): our own design for dry land. Anchors in CIE LCh with lightness
  // 32, 44, 56, 67, 78, 88, 97 and hue turning from green (138 deg) through olive and ochre to
  // cream (78 deg): no blue or teal anywhere, so low ground never reads as water, and lightness
  // alone still orders the elevations for every kind of colour vision.
  static const std::vector<ShippedRamp> ramps = {
      {"groundlight",
       {{0.0, hex(0x32532d)},
        {1.0 / 6, hex(0x54703a)},
        {2.0 / 6, hex(0x808c48)},
        {3.0 / 6, hex(0xaea55b)},
        {4.0 / 6, hex(0xdbbe7a)},
        {5.0 / 6, hex(0xf8d8ab)},
        {1.0, hex(0xfff4e4)}},
       true},
      {"clearsight",
       {{0.0, hex(0x004d6f)},
        {1.0 / 6, hex(0x007484)},
        {2.0 / 6, hex(0x459778)},
        {3.0 / 6, hex(0x99b165)},
        {4.0 / 6, hex(0xdbc671)},
        {5.0 / 6, hex(0xfbdfad)},
        {1.0, hex(0xfff5e7)}},
       true},
      {"meadow",
       {{0.0, hex(0x6f9a5a)},
        {0.25, hex(0xa9c27a)},
        {0.5, hex(0xd9cf93)},
        {0.75, hex(0xb8916a)},
        {1.0, hex(0xf2eee6)}},
       false},
  };
  return ramps;
}

const ShippedRamp& shipped_ramp(const std::string& name) {
  std::string names;
  for (const auto& r : shipped_ramps()) {
    if (r.name == name) return r;
    names += (names.empty() ? "" : ", ") + r.name;
  }
  throw_input_error(std::string("ramp"),
                    "unknown shipped ramp \"" + name + "\" (shipped: " + names + ")");
}

Colour ramp_colour_at(const ShippedRamp& ramp, double t) {
  const auto& s = ramp.stops;
  t = std::clamp(t, 0.0, 1.0);
  if (t <= s.front().first) return s.front().second;
  for (std::size_t i = 1; i < s.size(); ++i) {
    if (t <= s[i].first) {
      const double u = (t - s[i - 1].first) / (s[i].first - s[i - 1].first);
      const Colour& a = s[i - 1].second;
      const Colour& b = s[i].second;
      return {a.r + u * (b.r - a.r), a.g + u * (b.g - a.g), a.b + u * (b.b - a.b),
              a.a + u * (b.a - a.a)};
    }
  }
  return s.back().second;
}

terrain::TintRamp fit_ramp(const ShippedRamp& ramp, double lo_m, double hi_m, int stops) {
  stops = std::max(stops, 3);
  if (!(hi_m > lo_m)) hi_m = lo_m + 1;
  // Heckbert (1990) loose labelling: nice first, last and spacing covering [lo, hi].
  sheet::NiceRange nr = sheet::nice_range(lo_m, hi_m, stops);
  terrain::TintRamp out;
  const int n = static_cast<int>(std::lround((nr.last - nr.first) / nr.spacing));
  for (int k = 0; k <= n; ++k) {
    const double z = nr.first + k * nr.spacing;
    out.stops.emplace_back(z, ramp_colour_at(ramp, n > 0 ? static_cast<double>(k) / n : 0));
  }
  return out;
}

}  // namespace sheetmill::exhibit
