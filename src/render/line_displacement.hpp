#pragma once
// Private to the render stage: line displacement across the prepared layers that take part
// (style key `displacement`), between reading the layers and placing their names.

#include <cstddef>
#include <vector>

#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/render/feature_layers.hpp"

namespace sheetmill::render {

// A line feature of a prepared layer: pr.lines[line] of rule `rule` (ring outlines drawn with
// line symbols are not line features).
struct LineRef {
  std::size_t rule = 0;
  std::size_t line = 0;
};

// How far a line symbol's ink reaches either side of its centre line: strokes with their
// offsets, ticks with half their pen, marks' symbols with their radius.
double symbol_half_width_mm(const style::LineSymbol& s);

// Displaces the line features `refs` (per prepared layer) of the layers that take part; conflicts
// beyond a layer's limit are warnings (log and render report) with their place on the ground.
void displace_layers(PreparedLayers& out, const std::vector<std::vector<LineRef>>& refs,
                     const MapFrame& frame);

}  // namespace sheetmill::render
