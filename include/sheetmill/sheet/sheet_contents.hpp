#pragma once
// What the render drew on the map face besides the style's own layers, so the legend can list
// exactly that: the kinds of contour, spot heights, benchmarks, the grid and the graticule.
// Plain flags filled by the render after drawing; an empty value lists nothing.

#include <vector>

namespace sheetmill::sheet {

// The kinds of contour a sheet can carry, in legend order.
enum class ContourKind { ordinary, index, supplementary, depression, depth };

struct SheetContents {
  std::vector<ContourKind> contours;  // each kind drawn at least once (any order, no repeats)
  bool spot_heights = false;          // summit or depression figures from the DEM
  bool benchmarks = false;            // control points with surveyed heights
  bool grid = false;                  // the projected grid, as lines or ticks
  bool graticule = false;             // latitude and longitude ticks and crosses

  bool has(ContourKind k) const {
    for (auto c : contours)
      if (c == k) return true;
    return false;
  }
  void add(ContourKind k) {
    if (!has(k)) contours.push_back(k);
  }
};

}  // namespace sheetmill::sheet
