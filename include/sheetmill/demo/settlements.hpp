#pragma once
// Where people live and how they get about: villages, hamlets and farms on gentle ground, the
// roads linking them (least-cost routes that keep gentle grades), tracks and paths, and a
// railway along the valley. Reads the finished DEM and the water; changes neither.

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/hydrography.hpp"
#include "sheetmill/demo/names.hpp"
#include "sheetmill/demo/random.hpp"
#include "sheetmill/demo/scenario.hpp"

namespace sheetmill::demo {

struct Settlements {
  std::vector<Place> places;
  std::vector<Road> roads;
  std::vector<Track> tracks;
  std::vector<Railway> railways;
};

Settlements lay_out_settlements(const Scenario& s, const FloatGrid& dem, const Hydrography& water,
                                const std::vector<Summit>& summits, NameMaker& names);

// Ground slope (rise over run) at p, from central differences over about 10 m.
double slope_at(const FloatGrid& dem, Point p);

}  // namespace sheetmill::demo
