// Hypsometric tint ramps and the relief image blend. Expected colours are worked out from the
// definitions in tint.hpp / relief.hpp (linear interpolation; out = tint * (1 - s + s * shade)).
#include "sheetmill/terrain/tint.hpp"

#include <catch2/catch.hpp>
#include <cmath>

#include "dem_fixtures.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/terrain/relief.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;

namespace {
const Colour kBlack{0, 0, 0, 1}, kWhite{1, 1, 1, 1}, kRed{1, 0, 0, 1};
}

TEST_CASE("smooth and stepped ramps", "[terrain]") {
  TintRamp smooth{{{0, kBlack}, {100, kWhite}, {200, kRed}}, false, 0};
  CHECK(tint_colour(smooth, -50).r == 0);            // below the first stop: its colour
  CHECK(tint_colour(smooth, 25).g == Approx(0.25));  // a quarter of the way black -> white
  CHECK(tint_colour(smooth, 150).g == Approx(0.5));  // halfway white -> red: g 1 -> 0
  CHECK(tint_colour(smooth, 150).r == Approx(1.0));
  CHECK(tint_colour(smooth, 900) == kRed);  // above the last stop: its colour

  TintRamp by_stop = smooth;
  by_stop.stepped = true;
  CHECK(tint_colour(by_stop, 99.9) == kBlack);  // each interval in its lower stop's colour
  CHECK(tint_colour(by_stop, 100) == kWhite);
  CHECK(tint_colour(by_stop, 150) == kWhite);

  TintRamp by_interval = by_stop;
  by_interval.step_m = 20;  // steps follow a 20 m contour interval
  // 25 m lies in the band [20, 40), coloured as the smooth ramp at its middle, 30 m: g = 0.3.
  CHECK(tint_colour(by_interval, 25).g == Approx(0.3));
  CHECK(tint_colour(by_interval, 39.99).g == Approx(0.3));
  CHECK(tint_colour(by_interval, 40).g == Approx(0.5));
  // Below zero: band [-20, 0) -> middle -10 -> below the first stop -> black.
  CHECK(tint_colour(by_interval, -5) == kBlack);
}

TEST_CASE("ramp files load, and bad ones say where", "[terrain]") {
  TintRamp r = load_ramp_string(
      "blend: steps\nstep: 50 ft\nstops:\n  - {elevation: 0 m, colour: \"#000000\"}\n"
      "  - {elevation: 1 km, colour: \"#ff8000\"}\n",
      "ramp.yaml");
  REQUIRE(r.stops.size() == 2);
  CHECK(r.stepped);
  CHECK(r.step_m == Approx(15.24));  // 50 ft x 0.3048 m
  CHECK(r.stops[1].first == Approx(1000));
  CHECK(r.stops[1].second.g == Approx(128 / 255.0));

  auto fails_with = [](const std::string& text, const std::string& fragment) {
    try {
      load_ramp_string(text, "ramp.yaml");
      FAIL("no error for: " << text);
    } catch (const Error& e) {
      std::string what = e.what();
      INFO(what);
      CHECK(e.kind() == Error::Kind::input);
      CHECK(what.rfind("ramp.yaml:", 0) == 0);
      CHECK(what.find(fragment) != std::string::npos);
    }
  };
  fails_with("stops:\n  - {elevation: 0 m, colour: \"#000000\"}\nblnd: steps\n", "blnd");
  fails_with(
      "stops:\n  - {elevation: 100 m, colour: \"#000000\"}\n"
      "  - {elevation: 0 m, colour: \"#ffffff\"}\n",
      "ascending");
  fails_with("stops:\n  - {elevation: 0 m, colour: \"green-ish\"}\n", "colour");
  fails_with("stops:\n  - {elevation: 0, colour: \"#000000\"}\n", "elevation");
  fails_with("blend: smooth\n", "stops");
}

TEST_CASE("relief image: shade ink layer and tint multiplied by shade", "[terrain]") {
  auto g = fixture::make_grid(9, 7, 440000, 6650000, 10.0, fixture::wkt_of(32633));
  Dem flat = fixture::sample_dem(g, [](double, double) { return 250.0; });
  flat.z[3 * 9 + 4] = NAN;
  ReliefParams shade_only;  // s = 0.5
  ReliefImage ink = render_relief(flat, shade_only);
  REQUIRE(ink.argb.size() == 63);
  // Flat ground, light at 45 deg: byte 181 (shade_plane_test), shade = 180/254 = 0.70866;
  // black ink alpha = 0.5 * (1 - 0.70866) = 0.14567 -> round(37.15) = 37, colour 0.
  CHECK(ink.argb[0] == (37u << 24));
  CHECK(ink.argb[3 * 9 + 4] == 0);  // hole: transparent

  ReliefParams tinted;
  tinted.tint = true;
  tinted.ramp = {{{0, {0.2, 0.6, 0.4, 1}}, {500, {0.8, 0.8, 0.6, 1}}}, false, 0};
  tinted.shade_strength = 0.6;
  ReliefImage img = render_relief(flat, tinted);
  // Tint at 250 m: halfway, (0.5, 0.7, 0.5). Factor 1 - 0.6 + 0.6 * 0.70866 = 0.82520.
  // Opaque: R = round(255 * 0.5 * 0.8252) = round(105.21) = 105, G = round(147.30) = 147,
  // B = 105, A = 255.
  CHECK(img.argb[0] == ((255u << 24) | (105u << 16) | (147u << 8) | 105u));
  // Half-strength tint: premultiplied by alpha 0.5 -> round(52.61) = 53, round(73.65) = 74.
  tinted.tint_strength = 0.5;
  img = render_relief(flat, tinted);
  CHECK(img.argb[0] == ((128u << 24) | (53u << 16) | (74u << 8) | 53u));
}
