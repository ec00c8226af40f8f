#pragma once
// One collision index per sheet, shared by contour labels, feature names and marked obstacles.
// Items are convex quadrilaterals (rotated label boxes, glyph boxes) in page millimetres; the
// test is exact (separating axes), the search uses a uniform grid.

#include <array>
#include <cstddef>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::text {

using Quad = std::array<Point, 4>;  // corners in order (either winding)

// The quad of a w x h box whose bottom-left corner is at `origin`, rotated by `angle_rad`
// (clockwise on the page, y down).
Quad rotated_box(Point origin, double w, double h, double angle_rad);
Quad box_quad(const Box& b);
bool quads_overlap(const Quad& a, const Quad& b);

class CollisionIndex {
 public:
  explicit CollisionIndex(Box page_mm, double cell_mm = 10);

  // True when `q` overlaps nothing inserted so far (and lies inside the bounds, if any).
  bool is_free(const Quad& q) const;
  bool all_free(const std::vector<Quad>& qs) const;
  void insert(const Quad& q);
  void insert_all(const std::vector<Quad>& qs);
  // Only label-free space inside this box counts as free (the map frame).
  void set_bounds(const Box& b) { bounds_ = b; }
  std::size_t size() const { return quads_.size(); }

 private:
  void cells_of(const Quad& q, int& x0, int& y0, int& x1, int& y1) const;
  Box page_;
  Box bounds_;
  double cell_;
  int nx_, ny_;
  std::vector<Quad> quads_;
  std::vector<std::vector<std::size_t>> grid_;
};

}  // namespace sheetmill::text
