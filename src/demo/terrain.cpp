#include "sheetmill/demo/terrain.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/demo/noise.hpp"
#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

namespace {

double smoothstep(double t) {
  t = std::clamp(t, 0.0, 1.0);
  return t * t * (3 - 2 * t);
}

struct Seeds {
  std::uint64_t ridges, hills, detail, floodplain, plateau;
};

double height_at(const Scenario& s, const Seeds& k, double x, double y) {
  double u = Scenario::u_of(x);
  double v = Scenario::v_of(y);
  double bed = s.river_bed_m(x);

  // Hills: height above the valley grows with distance from the floodplain edge.
  double out = std::max(0.0, std::fabs(y - s.valley_axis_y(x)) - s.floodplain_half_width_m(x));
  // Blend the floodplain into the hills over 250 m beyond its edge (a low terrace).
  double t = smoothstep(out / 250);

  double flood = 0;
  if (t < 1) {
    // Floodplain: a little above the river bed, rising gently away from the channel.
    flood = bed + 1.6 + 0.0025 * std::fabs(y - s.river_y(x)) +
            0.25 * fbm(k.floodplain, u / 350, v / 350, 3);
    // Around the lake the floor stays above the lake level, so the shore is a closed contour
    // except where the outlet channel is cut later.
    double near_lake = 1 - smoothstep(s.lake_shape({x, y}) / 0.6);
    flood += near_lake * std::max(0.0, s.lake_level_m + 0.7 - flood);
    if (t <= 0) return flood;
  }
  double base = bed + 2.5 + 175 * (1 - std::exp(-out / 1600));
  double amp = 30 + 200 * smoothstep(out / 3500);

  // Escarpment: a steep step of 260 m up to the plateau, whose top dips gently north.
  double esc = s.escarpment_y(x);
  double w = s.escarpment_width_m(x);
  double step = smoothstep((y - esc) / w + 0.5);
  double plateau = step * (260 - 0.011 * std::max(0.0, y - esc));
  // The plateau's north-east rises into a group of higher ridges.
  double ne = smoothstep((u - 9000) / 9000) * smoothstep((v - 10500) / 3500);
  amp *= 1 - 0.4 * step + 0.5 * ne;

  double r = ridged(k.ridges, u / 2700, v / 2700, 6);
  double h = fbm(k.hills, u / 1500, v / 1500, 5);
  double d = fbm(k.detail, u / 260, v / 260, 3);
  double hills = base + plateau + amp * (0.7 * r + 0.3 * (0.5 + 0.5 * h)) + 5 * d + 60 * ne;
  return flood * (1 - t) + hills * t;
}

}  // namespace

FloatGrid synthesize_terrain(const Scenario& s) {
  FloatGrid dem(s.dem, 0.0f);
  Seeds k{s.seed * 31 + 1, s.seed * 31 + 2, s.seed * 31 + 3, s.seed * 31 + 4, s.seed * 31 + 5};
  parallel_rows(s.dem.height, [&](int row) {
    double y = s.dem.centre_y(row);
    for (int col = 0; col < s.dem.width; ++col) {
      dem.at(col, row) = static_cast<float>(height_at(s, k, s.dem.centre_x(col), y));
    }
  });
  flatten_lake(s, dem);
  return dem;
}

void flatten_lake(const Scenario& s, FloatGrid& dem) {
  for_cells_in_ring(dem.spec, s.lake_ring,
                    [&](int col, int row) { dem.at(col, row) = s.lake_level_m; });
}

}  // namespace sheetmill::demo
