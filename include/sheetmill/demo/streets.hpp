#pragma once
// Village streets that follow the terrain: a back street along the contour above the through
// road (traced across the slope, holding its height), a short link climbing to it from the
// centre, and a lane up the nearest side valley (a least-cost route beside its stream). None
// crosses the river: each keeps to the village's side of the valley.

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/hydrography.hpp"
#include "sheetmill/demo/random.hpp"
#include "sheetmill/demo/route.hpp"
#include "sheetmill/demo/scenario.hpp"

namespace sheetmill::demo {

struct StreetContext {
  const Scenario& s;
  const FloatGrid& dem;
  const Hydrography& water;
  RouteGrid& grid;
  std::vector<char>& on_road;  // route nodes on a road, grown as streets are added
};

// Appends the village's streets to `roads` (class minor, no ref).
void lay_out_streets(StreetContext& ctx, const Place& village, Random& rng,
                     std::vector<Road>& roads);

// A line along the contour through `start`, both ways, up to half_length_m each way; it stops
// at water, the lake, steep ground, the area edge and the other side of the river.
Polyline trace_contour(const Scenario& s, const FloatGrid& dem, const Hydrography& water,
                       Point start, double half_length_m);

}  // namespace sheetmill::demo
