#pragma once
// Flow routing on a grid by Priority-Flood (Barnes, Lehman & Mulla 2014, "Priority-Flood: An
// optimal depression-filling and watershed-labeling algorithm", Computers & Geosciences 62).
//
// The flood starts from the grid edge and from caller-given sink cells (river, lake) and
// grows inward in order of height. Each cell's receiver is the neighbour it was reached from,
// so every cell drains, flats and pits included, without an epsilon; the pop order lists
// every receiver before its donors, which makes accumulation a single reverse pass.

#include <cstdint>
#include <vector>

#include "sheetmill/demo/grid.hpp"

namespace sheetmill::demo {

struct FlowRouting {
  GridSpec spec;
  std::vector<float> filled;           // depression-filled heights, metres
  std::vector<std::int32_t> receiver;  // downstream cell, -1 at the edge and at sinks
  std::vector<std::int32_t> order;     // every cell once, receivers before donors
  std::vector<float> area_m2;          // contributing area including the cell itself
};

// The mean of each factor x factor block (the last blocks may be partial).
FloatGrid downsample(const FloatGrid& dem, int factor);

// sinks[i] != 0 marks cells that take water out of the grid (they get receiver -1).
FlowRouting route_flow(const FloatGrid& dem, const std::vector<char>& sinks);

// Raises every cell to the lowest level from which water can run off the grid edge or into a
// cell with keep[i] != 0 (a closed depression that must stay). Plain Priority-Flood, no epsilon:
// filled pits become exact flats. keep may be empty.
void fill_depressions(FloatGrid& dem, const std::vector<char>& keep);

}  // namespace sheetmill::demo
