// Colour science and the shipped ramps. Reference values are named beside each check.
#include <catch2/catch.hpp>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/exhibit/colour_vision.hpp"
#include "sheetmill/exhibit/ramps.hpp"
#include "sheetmill/terrain/tint.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;

namespace {
// True when CIELAB lightness rises strictly along the ramp, sampled densely (64 steps), for the
// colours as seen with `deficiency` (or as they are, when `simulated` is false).
bool lightness_monotonic(const ShippedRamp& ramp, bool simulated, Deficiency deficiency) {
  double last = -1;
  for (int i = 0; i <= 64; ++i) {
    Colour c = ramp_colour_at(ramp, i / 64.0);
    if (simulated) c = simulate(c, deficiency);
    const double l = to_lab(c).l;
    if (!(l > last)) return false;
    last = l;
  }
  return true;
}

// The smallest CIE76 difference between neighbouring stops as seen with `deficiency`.
double min_neighbour_delta_e(const ShippedRamp& ramp, Deficiency deficiency) {
  double d = 1e9;
  for (std::size_t i = 1; i < ramp.stops.size(); ++i) {
    d = std::min(d, delta_e76(to_lab(simulate(ramp.stops[i - 1].second, deficiency)),
                              to_lab(simulate(ramp.stops[i].second, deficiency))));
  }
  return d;
}
}  // namespace

TEST_CASE("sRGB to CIELAB matches published values", "[exhibit]") {
  // D65 white is L* 100, a* b* 0 by definition (CIE 15).
  Lab w = to_lab({1, 1, 1, 1});
  CHECK(w.l == Approx(100).margin(0.01));
  CHECK(w.a == Approx(0).margin(0.01));
  CHECK(w.b == Approx(0).margin(0.01));
  // sRGB red (255, 0, 0): L* 53.24, a* 80.09, b* 67.20 (Lindbloom's colour calculator, D65;
  // values from memory, widely tabulated).
  Lab r = to_lab({1, 0, 0, 1});
  CHECK(r.l == Approx(53.24).margin(0.05));
  CHECK(r.a == Approx(80.09).margin(0.1));
  CHECK(r.b == Approx(67.20).margin(0.1));
  // sRGB mid grey (119, 119, 119) has L* 50.0 (same source, from memory).
  CHECK(to_lab({119 / 255.0, 119 / 255.0, 119 / 255.0, 1}).l == Approx(50.03).margin(0.1));
}

TEST_CASE("dichromat simulation keeps greys and merges red and green", "[exhibit]") {
  // Machado et al. (2009) matrices have rows summing to 1, so neutral greys are unchanged.
  for (Deficiency d : {Deficiency::deuteranopia, Deficiency::protanopia, Deficiency::tritanopia}) {
    Colour g = simulate({0.5, 0.5, 0.5, 1}, d);
    CHECK(g.r == Approx(0.5).margin(0.002));
    CHECK(g.g == Approx(0.5).margin(0.002));
    CHECK(g.b == Approx(0.5).margin(0.002));
  }
  // The defining confusion: a red and a green of similar lightness that differ widely for
  // normal vision come much closer for a deuteranope.
  Colour red{0.80, 0.30, 0.25, 1}, green{0.45, 0.55, 0.25, 1};
  const double normal = delta_e76(to_lab(red), to_lab(green));
  const double deutan = delta_e76(to_lab(simulate(red, Deficiency::deuteranopia)),
                                  to_lab(simulate(green, Deficiency::deuteranopia)));
  CHECK(deutan < 0.5 * normal);
}

TEST_CASE("the clearsight ramp is safe for colour-vision deficiency", "[exhibit]") {
  const ShippedRamp& ramp = shipped_ramp("clearsight");
  CHECK(ramp.colour_vision_safe);
  CHECK(lightness_monotonic(ramp, false, Deficiency::deuteranopia));
  CHECK(lightness_monotonic(ramp, true, Deficiency::deuteranopia));
  CHECK(lightness_monotonic(ramp, true, Deficiency::protanopia));
  // Neighbouring stops at least 10 CIE76 units apart for each dichromacy (our threshold: about
  // five just-noticeable differences; a JND is roughly 2.3, Sharma 2003, common practice).
  CHECK(min_neighbour_delta_e(ramp, Deficiency::deuteranopia) >= 10);
  CHECK(min_neighbour_delta_e(ramp, Deficiency::protanopia) >= 10);
}

TEST_CASE("the conventional meadow ramp fails the same check", "[exhibit]") {
  // The check must be able to fail: a green-tan-brown ramp darkens in its upper half.
  const ShippedRamp& ramp = shipped_ramp("meadow");
  CHECK_FALSE(ramp.colour_vision_safe);
  CHECK_FALSE(lightness_monotonic(ramp, true, Deficiency::deuteranopia));
}

TEST_CASE("a shipped ramp is fitted with stops at nice elevations", "[exhibit]") {
  const ShippedRamp& ramp = shipped_ramp("clearsight");
  terrain::TintRamp t = fit_ramp(ramp, 123, 987, 6);
  REQUIRE(t.stops.size() >= 3);
  CHECK(t.stops.front().first <= 123);
  CHECK(t.stops.back().first >= 987);
  const double step = t.stops[1].first - t.stops[0].first;
  // Heckbert (1990): the spacing is 1, 2 or 5 times a power of ten.
  const double f = step / std::pow(10.0, std::floor(std::log10(step)));
  CHECK((std::abs(f - 1) < 1e-9 || std::abs(f - 2) < 1e-9 || std::abs(f - 5) < 1e-9));
  for (std::size_t i = 1; i < t.stops.size(); ++i) {
    CHECK(t.stops[i].first - t.stops[i - 1].first == Approx(step));
  }
  // End colours are the ramp's ends.
  CHECK(t.stops.front().second == ramp.stops.front().second);
  CHECK(t.stops.back().second == ramp.stops.back().second);
  CHECK_THROWS_AS(shipped_ramp("no-such-ramp"), Error);
}
