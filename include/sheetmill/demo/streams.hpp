#pragma once
// Streams from a flow routing: every cell draining at least threshold_m2 is a stream cell.
// Lines are cut where the Strahler (1957) order changes, run from source downstream, and end on
// the first vertex of the line they join, on the river line, inside the lake, or at the grid
// edge. Vertex positions are cell centres smoothed along the main stem ([1/4, 1/2, 1/4]);
// a cell shared by two lines has the same position in both.
//
// Bed heights (metres, per vertex) never rise downstream: each is the least of the filled
// height minus an incision that grows with drainage area, the ground under the vertex, and
// every bed upstream; beds draining to the river or lake stay at or above its level where
// they join it.

#include <functional>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/demo/drainage.hpp"
#include "sheetmill/demo/grid.hpp"

namespace sheetmill::demo {

enum class Sink : char { none = 0, river = 1, lake = 2 };

struct StreamLine {
  Polyline line;
  std::vector<double> bed_m;
  int strahler = 1;
  double area_km2 = 0;     // drained at the last vertex
  int main_stem = -1;      // lines with the same main_stem form one named watercourse
  int receiver_line = -1;  // the line this one ends on, -1 for river, lake or edge
};

struct StreamInputs {
  const FlowRouting* flow = nullptr;
  const std::vector<Sink>* sinks = nullptr;  // per flow cell
  const FloatGrid* ground = nullptr;         // fine DEM before streams are carved
  // The nearest point of the river line and the river bed there.
  std::function<Point(Point)> river_point;
  std::function<double(Point)> river_bed_m;
  double lake_level_m = 0;
  double threshold_m2 = 250000;
};

std::vector<StreamLine> extract_streams(const StreamInputs& in);

}  // namespace sheetmill::demo
