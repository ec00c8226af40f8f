#include "sheetmill/demo/power.hpp"

#include <cmath>

#include "sheetmill/demo/random.hpp"
#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

std::vector<PowerLine> string_power_lines(const Scenario& s, const std::vector<Place>& places) {
  Random rng = Random(s.seed).fork(17);
  // Angle points: south edge, two turns, north edge; nudged east until clear of the lake and
  // of every village.
  for (int attempt = 0; attempt < 40; ++attempt) {
    double x0 = kAreaWest + rng.uniform(0.2, 0.35) * kAreaWidthM;
    Polyline corners = {{x0, kAreaSouth + 2},
                        {x0 + rng.uniform(600, 1500), kAreaSouth + rng.uniform(3500, 4200)},
                        {x0 + rng.uniform(2200, 3400), kAreaSouth + rng.uniform(8200, 9000)},
                        {x0 + rng.uniform(3000, 4500), kAreaSouth + kAreaHeightM - 2}};
    Polyline pylons;
    for (std::size_t i = 1; i < corners.size(); ++i) {
      double d = distance(corners[i - 1], corners[i]);
      int spans = static_cast<int>(std::ceil(d / 320));
      for (int k = 0; k < spans; ++k) {
        double t = static_cast<double>(k) / spans;
        pylons.push_back(corners[i - 1] + (corners[i] - corners[i - 1]) * t);
      }
    }
    pylons.push_back(corners.back());
    Polyline dense = densify(pylons, 20);
    bool clear = true;
    for (const Point& p : dense) {
      if (s.lake_shape(p) < 0.3) clear = false;
      for (const Place& pl : places) {
        if (pl.kind == "village" && distance(pl.at, p) < 450) clear = false;
        if (pl.kind != "village" && distance(pl.at, p) < 120) clear = false;
      }
    }
    if (clear) return {PowerLine{pylons, 110}};
  }
  return {};
}

}  // namespace sheetmill::demo
