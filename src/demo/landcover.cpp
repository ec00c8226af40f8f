#include "sheetmill/demo/landcover.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "sheetmill/demo/drainage.hpp"
#include "sheetmill/demo/isolines.hpp"
#include "sheetmill/demo/noise.hpp"
#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

namespace {

enum Cover { wood = 0, orchard = 1, marsh = 2, scrub = 3, kCovers = 4 };
const char* const kCoverName[] = {"wood", "orchard", "marsh", "scrub"};

// A soft ramp: -1 at or below lo, +1 at or above hi (linear between).
double ramp(double x, double lo, double hi) {
  return std::clamp(2 * (x - lo) / (hi - lo) - 1, -1.0, 1.0);
}

// Chamfer (3-4) distance in metres from the cells touched by the given lines (Borgefors 1986).
std::vector<float> distance_to_lines(const GridSpec& g, const std::vector<const Polyline*>& lines) {
  constexpr float kFar = 1e9f;
  std::vector<float> d(g.size(), kFar);
  for (const Polyline* l : lines) {
    for (const Point& p : densify(*l, g.cell_m / 2)) {
      d[static_cast<std::size_t>(g.row_clamped(p.y)) * g.width + g.col_clamped(p.x)] = 0;
    }
  }
  float a = static_cast<float>(g.cell_m), b = static_cast<float>(g.cell_m * 1.41421356);
  auto relax = [&](int col, int row, int dc, int dr, float w) {
    int c = col + dc, r = row + dr;
    if (!g.inside(c, r)) return;
    float& here = d[static_cast<std::size_t>(row) * g.width + col];
    here = std::min(here, d[static_cast<std::size_t>(r) * g.width + c] + w);
  };
  for (int row = 0; row < g.height; ++row) {
    for (int col = 0; col < g.width; ++col) {
      relax(col, row, -1, 0, a), relax(col, row, 0, -1, a);
      relax(col, row, -1, -1, b), relax(col, row, 1, -1, b);
    }
  }
  for (int row = g.height - 1; row >= 0; --row) {
    for (int col = g.width - 1; col >= 0; --col) {
      relax(col, row, 1, 0, a), relax(col, row, 0, 1, a);
      relax(col, row, 1, 1, b), relax(col, row, -1, 1, b);
    }
  }
  return d;
}

// Three passes of a separable [1/4, 1/2, 1/4] filter (about a 1.2-cell Gaussian); edges clamp.
void blur(FloatGrid& f) {
  const GridSpec& g = f.spec;
  std::vector<float> tmp(f.values.size());
  for (int pass = 0; pass < 3; ++pass) {
    for (int row = 0; row < g.height; ++row) {
      for (int col = 0; col < g.width; ++col) {
        int l = std::max(col - 1, 0), r = std::min(col + 1, g.width - 1);
        tmp[f.index(col, row)] =
            0.25f * f.at(l, row) + 0.5f * f.at(col, row) + 0.25f * f.at(r, row);
      }
    }
    for (int row = 0; row < g.height; ++row) {
      int u = std::max(row - 1, 0), d = std::min(row + 1, g.height - 1);
      for (int col = 0; col < g.width; ++col) {
        f.at(col, row) = 0.25f * tmp[f.index(col, u)] + 0.5f * tmp[f.index(col, row)] +
                         0.25f * tmp[f.index(col, d)];
      }
    }
  }
}

struct Inputs {
  FloatGrid z;                  // DEM heights at the cover grid's centres
  std::vector<float> slope;     // rise over run, central differences over one cover cell
  std::vector<float> twi;       // topographic wetness index
  std::vector<float> stream_d;  // metres to the nearest stream
};

Inputs gather(const FloatGrid& dem, const GridSpec& g, const std::vector<WaterLine>& water) {
  Inputs in;
  in.z = FloatGrid(g, 0.0f);
  parallel_rows(g.height, [&](int row) {
    for (int col = 0; col < g.width; ++col) {
      in.z.at(col, row) = static_cast<float>(sample(dem, g.centre(col, row)));
    }
  });
  in.slope.assign(g.size(), 0);
  for (int row = 0; row < g.height; ++row) {
    for (int col = 0; col < g.width; ++col) {
      int l = std::max(col - 1, 0), r = std::min(col + 1, g.width - 1);
      int u = std::max(row - 1, 0), d = std::min(row + 1, g.height - 1);
      double dx = (in.z.at(r, row) - in.z.at(l, row)) / ((r - l) * g.cell_m);
      double dy = (in.z.at(col, d) - in.z.at(col, u)) / ((d - u) * g.cell_m);
      in.slope[in.z.index(col, row)] = static_cast<float>(std::hypot(dx, dy));
    }
  }
  // Wetness: ln(a / tan b) with a the contributing area per unit contour width (Beven & Kirkby
  // 1979), from a Priority-Flood D8 routing on this grid.
  FlowRouting flow = route_flow(in.z, {});
  in.twi.assign(g.size(), 0);
  for (std::size_t i = 0; i < g.size(); ++i) {
    double a = flow.area_m2[i] / g.cell_m;
    in.twi[i] = static_cast<float>(std::log(a / std::max(0.002, static_cast<double>(in.slope[i]))));
  }
  std::vector<const Polyline*> streams;
  for (const WaterLine& w : water) {
    if (w.kind == "stream") streams.push_back(&w.line);
  }
  in.stream_d = distance_to_lines(g, streams);
  return in;
}

}  // namespace

std::vector<LandcoverArea> classify_landcover(const Scenario& s, const FloatGrid& dem,
                                              const std::vector<char>& wet,
                                              const std::vector<Place>& places,
                                              const std::vector<WaterLine>& water) {
  GridSpec g;
  g.cell_m = std::max(25.0, dem.spec.cell_m);
  Box bounds = dem.spec.bounds();
  g.x0 = bounds.min_x;
  g.y_top = bounds.max_y;
  g.width = static_cast<int>(std::lround(bounds.width() / g.cell_m));
  g.height = static_cast<int>(std::lround(bounds.height() / g.cell_m));
  Inputs in = gather(dem, g, water);

  std::vector<FloatGrid> score(kCovers, FloatGrid(g, -1.0f));
  std::uint64_t k = s.seed * 131 + 7;
  parallel_rows(g.height, [&](int row) {
    for (int col = 0; col < g.width; ++col) {
      Point p = g.centre(col, row);
      std::size_t i = in.z.index(col, row);
      double lake = s.lake_shape(p);
      if (lake < 0.02) continue;  // open water
      double slope = in.slope[i];
      double n = fbm(k, Scenario::u_of(p.x) / 900, Scenario::v_of(p.y) / 900, 4);
      double n2 = fbm(k + 1, Scenario::u_of(p.x) / 260, Scenario::v_of(p.y) / 260, 3);
      double z = in.z.at(col, row);
      double above_bed = z - s.river_bed_m(p.x);
      double settled = std::numeric_limits<double>::infinity();
      for (const Place& pl : places) {
        if (pl.kind == "village" || pl.kind == "hamlet") {
          settled = std::min(settled, distance(pl.at, p));
        }
      }
      bool hollow = wet[dem.index(dem.spec.col_clamped(p.x), dem.spec.row_clamped(p.y))] != 0;

      // Marsh: flat and wet.
      double wetness = std::max(
          {ramp(in.twi[i], 13.5, 15.5) + 0.4 * n2, hollow ? 0.6 + 0.4 * n2 : -1.0,
           std::min(ramp(-lake, -0.26, -0.16), ramp(s.lake_level_m + 2.5 - z, -0.5, 0.5)) +
               0.3 * n2,
           std::min({ramp(2.4 - above_bed, -0.4, 0.4), ramp(n, 0.15, 0.35), ramp(n2, -0.1, 0.1)})});
      double m = std::min(wetness, ramp(0.05 - slope, -0.015, 0.015));
      // Woods: steep ground, large blocks, and strips along streams above the floodplain.
      double wood_where =
          std::max({ramp(slope, 0.18, 0.26), ramp(n, 0.26, 0.38),
                    std::min(ramp(70 - in.stream_d[i], -20, 20), ramp(n2, -0.3, -0.1))});
      double w = std::min(
          {wood_where, ramp(settled, 300, 420), ramp(above_bed, 4, 8), ramp(n2, -0.55, -0.35)});
      // Orchards: gentle ground round villages and hamlets.
      double o = std::min({ramp(settled, 100, 160), ramp(-settled, -700, -600),
                           ramp(0.12 - slope, -0.03, 0.03), ramp(n2, -0.05, 0.15),
                           ramp(-n, -0.35, -0.25)});
      // Scrub: patches on the steepest faces, on open steep ground, and in gaps of woods.
      double sc = std::max({std::min(ramp(slope, 0.5, 0.6), ramp(n2, -0.05, 0.15)),
                            std::min({ramp(slope, 0.16, 0.22), ramp(n2, 0.3, 0.42), -w}),
                            std::min(wood_where, ramp(-n2, 0.2, 0.4))});
      sc = std::min(sc, ramp(settled, 220, 300));
      score[wood].at(col, row) = static_cast<float>(w);
      score[orchard].at(col, row) = static_cast<float>(o);
      score[marsh].at(col, row) = static_cast<float>(m + 0.3);  // marsh wins close calls
      score[scrub].at(col, row) = static_cast<float>(sc);
    }
  });
  for (FloatGrid& f : score) blur(f);

  std::vector<LandcoverArea> out;
  FloatGrid own(g, 0.0f);
  for (int c = 0; c < kCovers; ++c) {
    // Where this kind's score is positive and beats every other (continuous, so the outline
    // can be contoured at sub-cell precision).
    for (std::size_t i = 0; i < g.size(); ++i) {
      float rival = 0;
      for (int o = 0; o < kCovers; ++o) {
        if (o != c) rival = std::max(rival, score[o].values[i]);
      }
      own.values[i] = score[c].values[i] - rival;
    }
    std::vector<Polyline> rings = region_rings(own);
    for (Polyline& r : rings) {
      Polyline closed = chaikin_closed(r, 2);
      closed.push_back(closed.front());
      closed = simplify(closed, 0.8);
      closed.pop_back();
      r = std::move(closed);
    }
    for (auto& poly : assemble_polygons(std::move(rings), 10000, 2500)) {
      out.push_back({std::move(poly), kCoverName[c]});
    }
  }
  return out;
}

}  // namespace sheetmill::demo
