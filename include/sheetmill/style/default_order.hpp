#pragma once
// The drawing order of a layer in a style that numbers none of its layers (no `order` anywhere):
// its place in the usual stack (common practice) by what the layer draws, so a style without
// numbers still gets area fills, relief, water areas, contours, water lines, transport, buildings,
// names from bottom to top.

#include "sheetmill/style/style.hpp"

namespace sheetmill::style {

// The stack's numbers, those of the stock styles; relief (15) and contours (22) fall between.
inline constexpr int kAreaFillOrder = 10;
inline constexpr int kWaterAreaOrder = 20;
inline constexpr int kWaterLineOrder = 25;
inline constexpr int kTransportOrder = 50;
inline constexpr int kBuildingOrder = 70;
inline constexpr int kPointSymbolOrder = 80;
inline constexpr int kNamesOrder = 90;

// The layer's kind, from its rules and flags:
//   a water layer (water_surface, or the group "water"): its areas 20, its lines 25;
//   buildings (the group "buildings"): 70;
//   other layers with area symbols: area fills, 10;
//   line symbols: transport and the like, 50;
//   point symbols only: 80;
//   labels only: names, 90.
int default_layer_order(const Layer& layer);

}  // namespace sheetmill::style
