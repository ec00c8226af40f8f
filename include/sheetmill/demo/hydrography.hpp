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

// The channel-initiation threshold: a cell draining this much is on a stream.
inline constexpr double kChannelThresholdM2 = 250000;

struct Hydrography {
  std::vector<WaterLine> lines;  // the river's parts first, then the streams
  std::vector<WaterArea> areas;  // the lake first
  std::vector<Polyline> river_parts;
  std::vector<StreamLine> streams;
};

Hydrography carve_hydrography(const Scenario& s, FloatGrid& dem, NameMaker& names);

// Stream heads as the finished DEM drains them: its own Priority-Flood D8 routing (the fine
// grid, not the coarse one the streams were found on) decides where a channel has gathered
// threshold_m2. Lines no other line flows into lose their vertices above the first one within
// a cell of such a cell; a line with none is dropped. The carved valley above a trimmed head
// stays (a dry valley head). Returns the number of vertices removed.
int trim_stream_heads(Hydrography& h, const FloatGrid& dem, double threshold_m2);

// Cells inside the lake; true for cells carving must never touch.
std::vector<char> lake_mask(const Scenario& s, const GridSpec& spec);

}  // namespace sheetmill::demo
