#pragma once
// A north-up grid of values over ground metres, the working surface of the demo generator.
//
// Cell (col, row) covers [x0 + col*cell, x0 + (col+1)*cell) east and the row'th band of cell
// metres south of y_top; its value stands for the cell centre (GDAL's pixel-is-area grid with
// values at centres). sample() interpolates bilinearly between centres and clamps outside them,
// the same convention GDAL uses for bilinear resampling.

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <functional>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::demo {

struct GridSpec {
  int width = 0;
  int height = 0;
  double x0 = 0;     // west edge, metres
  double y_top = 0;  // north edge, metres
  double cell_m = 1;

  std::size_t size() const { return static_cast<std::size_t>(width) * height; }
  double centre_x(int col) const { return x0 + (col + 0.5) * cell_m; }
  double centre_y(int row) const { return y_top - (row + 0.5) * cell_m; }
  Point centre(int col, int row) const { return {centre_x(col), centre_y(row)}; }
  // Fractional column/row of a ground point, in the centre-based frame (0 = first centre).
  double col_of(double x) const { return (x - x0) / cell_m - 0.5; }
  double row_of(double y) const { return (y_top - y) / cell_m - 0.5; }
  Box bounds() const { return Box::of(x0, y_top - height * cell_m, x0 + width * cell_m, y_top); }
  bool inside(int col, int row) const {
    return col >= 0 && row >= 0 && col < width && row < height;
  }
  // The cell containing a point, clamped into the grid.
  int col_clamped(double x) const {
    return std::clamp(static_cast<int>(std::floor((x - x0) / cell_m)), 0, width - 1);
  }
  int row_clamped(double y) const {
    return std::clamp(static_cast<int>(std::floor((y_top - y) / cell_m)), 0, height - 1);
  }
};

template <class T>
struct Grid {
  GridSpec spec;
  std::vector<T> values;

  Grid() = default;
  Grid(const GridSpec& s, T fill) : spec(s), values(s.size(), fill) {}
  T& at(int col, int row) { return values[static_cast<std::size_t>(row) * spec.width + col]; }
  const T& at(int col, int row) const {
    return values[static_cast<std::size_t>(row) * spec.width + col];
  }
  std::size_t index(int col, int row) const {
    return static_cast<std::size_t>(row) * spec.width + col;
  }
};

using FloatGrid = Grid<float>;

// Bilinear value at a ground point (clamped to the outermost centres).
template <class T>
double sample(const Grid<T>& g, Point p) {
  double fc = std::clamp(g.spec.col_of(p.x), 0.0, g.spec.width - 1.0);
  double fr = std::clamp(g.spec.row_of(p.y), 0.0, g.spec.height - 1.0);
  int c0 = std::min(static_cast<int>(fc), g.spec.width - 2 < 0 ? 0 : g.spec.width - 2);
  int r0 = std::min(static_cast<int>(fr), g.spec.height - 2 < 0 ? 0 : g.spec.height - 2);
  int c1 = std::min(c0 + 1, g.spec.width - 1);
  int r1 = std::min(r0 + 1, g.spec.height - 1);
  double tx = fc - c0;
  double ty = fr - r0;
  double a = g.at(c0, r0) + tx * (g.at(c1, r0) - g.at(c0, r0));
  double b = g.at(c0, r1) + tx * (g.at(c1, r1) - g.at(c0, r1));
  return a + ty * (b - a);
}

// Runs body(row) for every row, split over the machine's cores. Rows are independent, so the
// result does not depend on the number of threads.
void parallel_rows(int height, const std::function<void(int)>& body);

}  // namespace sheetmill::demo
