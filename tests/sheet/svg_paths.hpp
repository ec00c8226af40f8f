#pragma once
// Reads back the geometry Cairo drew: a scene is drawn on a Cairo SVG surface (in page mm under
// a scale to points) and every <path> is returned with its points in page millimetres and
// whether it was filled and stroked. Only what the furniture draws is understood: M, L and Z
// commands (no curves), and the surface's own mm-to-pt matrix.

#include <cairo.h>

#include <functional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::test {

struct SvgPath {
  std::vector<std::vector<Point>> subpaths;  // page mm
  bool filled = false;
  bool stroked = false;
  std::string fill_colour;    // "rgb(..)" as Cairo writes it; empty without fill
  std::string stroke_colour;  // likewise
  bool has_curves = false;    // a C command appeared (its points are not read)
};

// Draws `scene` (a context in page mm) on a w x h mm SVG surface and reads back its paths.
std::vector<SvgPath> drawn_paths(double width_mm, double height_mm,
                                 const std::function<void(cairo_t*)>& scene,
                                 const std::string& svg_file);

}  // namespace sheetmill::test
