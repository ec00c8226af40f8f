#pragma once
// The demo area's ground before drainage is carved: valley floor and floodplain, hills of
// ridged fractal noise, the escarpment and its plateau, and the lake set to its level.
// Heights in metres; the grid is the scenario's DEM grid. Deterministic for a seed.

#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/scenario.hpp"

namespace sheetmill::demo {

FloatGrid synthesize_terrain(const Scenario& s);

// Sets every cell whose centre is inside the lake shore to the lake level, exactly.
void flatten_lake(const Scenario& s, FloatGrid& dem);

}  // namespace sheetmill::demo
