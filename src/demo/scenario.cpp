#include "sheetmill/demo/scenario.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/demo/random.hpp"

namespace sheetmill::demo {

namespace {
constexpr double kTwoPi = 2 * kPi;
double wave(double u, double wavelength_m, double phase) {
  return std::sin(kTwoPi * u / wavelength_m + phase);
}
}  // namespace

double Scenario::valley_axis_y(double x) const {
  double u = u_of(x);
  return kAreaSouth + 5200 + 480 * wave(u, 14000, valley_phase[0]) +
         220 * wave(u, 6100, valley_phase[1]);
}

double Scenario::floodplain_half_width_m(double x) const {
  return 560 + 180 * wave(u_of(x), 9000, floodplain_phase);
}

double Scenario::river_y(double x) const {
  // Meanders inside the floodplain, damped near the lake so the river enters and leaves it
  // at its ends.
  double u = u_of(x);
  double m = 0.7 * wave(u, 2600, meander_phase[0]) + 0.3 * wave(u, 1500, meander_phase[1]);
  double dl = std::fabs(x - lake_centre.x) / (lake_semi_axis_m[0] + 700);
  double damp = dl >= 1 ? 1 : dl * dl * (3 - 2 * dl);
  return valley_axis_y(x) + 0.5 * floodplain_half_width_m(x) * m * damp;
}

double Scenario::river_bed_m(double x) const {
  // 236 m at the west edge to 268 m at the east (1.6 m/km); the ripple's slope (0.8 m over
  // 5 km wavelength, at most 1.0 m/km) never cancels the fall, so the bed always falls west.
  double u = u_of(x);
  return 236 + 32 * (u / kAreaWidthM) + 0.8 * wave(u, 5000, 0.3);
}

double Scenario::escarpment_y(double x) const {
  double u = u_of(x);
  return kAreaSouth + 10100 + 550 * wave(u, 11000, escarpment_phase[0]) +
         230 * wave(u, 4300, escarpment_phase[1]);
}

double Scenario::escarpment_width_m(double x) const {
  return 300 + 170 * (0.5 + 0.5 * wave(u_of(x), 7000, escarpment_phase[2]));
}

double Scenario::lake_shape(Point p) const {
  double dx = (p.x - lake_centre.x) / lake_semi_axis_m[0];
  double dy = (p.y - lake_centre.y) / lake_semi_axis_m[1];
  return std::hypot(dx, dy) - 1;
}

Scenario make_scenario(std::uint64_t seed, double size_scale) {
  if (!(size_scale > 0.01 && size_scale <= 1.0)) {
    throw_input_error("--size-scale", "expected a number in (0.01, 1]");
  }
  Scenario s;
  s.seed = seed;
  double cell = 5.0 / size_scale;
  s.dem.width = static_cast<int>(std::lround(kAreaWidthM / cell));
  s.dem.height = static_cast<int>(std::lround(kAreaHeightM / cell));
  s.dem.cell_m = kAreaWidthM / s.dem.width;
  s.dem.x0 = kAreaWest;
  s.dem.y_top = kAreaSouth + kAreaHeightM;

  Random rng = Random(seed).fork(1);
  s.valley_phase[0] = rng.uniform(0, kTwoPi);
  s.valley_phase[1] = rng.uniform(0, kTwoPi);
  s.meander_phase[0] = rng.uniform(0, kTwoPi);
  s.meander_phase[1] = rng.uniform(0, kTwoPi);
  s.floodplain_phase = rng.uniform(0, kTwoPi);
  for (double& p : s.escarpment_phase) p = rng.uniform(0, kTwoPi);

  double lake_x = kAreaWest + rng.uniform(11800, 13000);
  s.lake_centre = {lake_x, s.valley_axis_y(lake_x)};
  s.lake_semi_axis_m[0] = rng.uniform(850, 1050);
  s.lake_semi_axis_m[1] = std::min(rng.uniform(330, 420), 0.75 * s.floodplain_half_width_m(lake_x));
  double q[3] = {rng.uniform(0, kTwoPi), rng.uniform(0, kTwoPi), rng.uniform(0, kTwoPi)};
  for (int k = 0; k < 180; ++k) {
    double th = kTwoPi * k / 180;
    double r = 1 + 0.06 * std::sin(2 * th + q[0]) + 0.05 * std::sin(3 * th + q[1]) +
               0.025 * std::sin(5 * th + q[2]);
    s.lake_ring.push_back({lake_x + s.lake_semi_axis_m[0] * r * std::cos(th),
                           s.lake_centre.y + s.lake_semi_axis_m[1] * r * std::sin(th)});
  }
  // The outlet sill at the west end sets the level: 0.9 m above the river bed there.
  double west_end = lake_x;
  for (const Point& p : s.lake_ring) west_end = std::min(west_end, p.x);
  s.lake_level_m = static_cast<float>(std::round((s.river_bed_m(west_end) + 0.9) * 100) / 100);
  return s;
}

}  // namespace sheetmill::demo
