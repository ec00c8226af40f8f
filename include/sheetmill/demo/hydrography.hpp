#pragma once
// The demo area's water: the river (east to west, through the lake), the lake, and the streams
// found by flow routing; all of them carved into the DEM so that every water line runs
// downhill in it. Modifies the DEM in place (lowers cells; the lake is set to its level).

#include <vector>

#include "sheetmill/demo/features.hpp"
#include "sheetmill/demo/grid.hpp"
#include "sheetmill/demo/names.hpp"
#include "sheetmill/demo/scenario.hpp"
#include "sheetmill/demo/streams.hpp"

namespace sheetmill::demo {

struct Hydrography {
  std::vector<WaterLine> lines;  // the river's parts first, then the streams
  std::vector<WaterArea> areas;  // the lake first
  std::vector<Polyline> river_parts;
  std::vector<StreamLine> streams;
};

Hydrography carve_hydrography(const Scenario& s, FloatGrid& dem, NameMaker& names);

// Cells inside the lake; true for cells carving must never touch.
std::vector<char> lake_mask(const Scenario& s, const GridSpec& spec);

}  // namespace sheetmill::demo
