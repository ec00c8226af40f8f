#pragma once
// Least-cost routes over the DEM for roads, tracks and the railway: A* (Hart, Nilsson & Raphael
// 1968) on a grid of nodes with 32 move directions (knight moves and (3,1), (3,2) moves), so a
// route can hold a grade across a slope at angles 8-connectivity cannot.
//
// A move costs its length times 1 + (grade / comfortable_grade)^exponent, so cost rises
// steeply above the comfortable grade; crossing water (nodes near a water line) costs
// bridge_factor per metre and ignores grade (a bridge or culvert); lake nodes are impassable.
// Nodes already on a route may be made cheaper so later routes join earlier ones.

#include <cstdint>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/demo/grid.hpp"

namespace sheetmill::demo {

enum class NodeKind : std::uint8_t { land = 0, bridge = 1, blocked = 2 };

struct RouteCost {
  double comfortable_grade = 0.08;
  double exponent = 6;
  double bridge_factor = 4;
};

class RouteGrid {
 public:
  // Nodes at the centres of cell_m cells over the DEM's ground; heights sampled from the DEM.
  RouteGrid(const FloatGrid& dem, double cell_m);

  const GridSpec& spec() const { return spec_; }
  int node_at(Point p) const {
    return spec_.row_clamped(p.y) * spec_.width + spec_.col_clamped(p.x);
  }
  Point position(int node) const { return spec_.centre(node % spec_.width, node / spec_.width); }
  double height(int node) const { return z_[node]; }
  NodeKind kind(int node) const { return kind_[node]; }
  void set_kind(int node, NodeKind k) { kind_[node] = k; }
  // Multiplies the cost of moves into `node` (0 < factor <= 1 to attract later routes).
  void set_discount(int node, float factor) { discount_[node] = factor; }
  // Marks nodes within radius_m of the line.
  void mark_line(const Polyline& line, double radius_m, NodeKind k);

  // The cheapest node path from `from` to any node with target[node] != 0 (or to `to` when
  // targets is empty), first node `from`. Empty when unreachable.
  std::vector<int> route(int from, int to, const RouteCost& cost) const;
  std::vector<int> route_to_any(int from, const std::vector<char>& targets,
                                const RouteCost& cost) const;

 private:
  std::vector<int> search(int from, int to, const std::vector<char>* targets,
                          const RouteCost& cost) const;
  GridSpec spec_;
  std::vector<float> z_;
  std::vector<NodeKind> kind_;
  std::vector<float> discount_;
};

// Node path to a polyline: bridge nodes inside the path are dropped (the line spans them),
// then one pass of [1/4, 1/2, 1/4] smoothing wherever it does not steepen the road.
Polyline path_to_line(const RouteGrid& grid, const std::vector<int>& path, const FloatGrid& dem);

}  // namespace sheetmill::demo
