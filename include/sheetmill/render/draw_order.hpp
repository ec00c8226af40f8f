#pragma once
// The sheet's drawing sequence inside the map frame: the style's layers in their order, with the
// relief and the contours placed among them by their own order numbers (ReliefStyle::order,
// ContourStyle::order). Relief and contours go after every layer of a lower or equal order, the
// relief before the contours when both share a number. Names, grid and collar follow the sequence.

#include <cstddef>
#include <vector>

#include "sheetmill/style/style.hpp"

namespace sheetmill::render {

struct DrawStep {
  enum class Kind { relief, contours, layer };
  Kind kind = Kind::layer;
  std::size_t layer = 0;  // Kind::layer: index into `layers` of draw_sequence()
};

// Bottom to top. `layers` are in the style's order (sorted by Layer::order, as load_style leaves
// them); every one appears once, and so do the relief and the contours.
std::vector<DrawStep> draw_sequence(const std::vector<const style::Layer*>& layers,
                                    int relief_order, int contours_order);

}  // namespace sheetmill::render
