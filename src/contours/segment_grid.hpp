#pragma once
// Private: a uniform grid over the segments of many lines, for clearance and crossing queries.
// Built once (compressed rows), read concurrently by any number of threads.

#include <cstdint>
#include <vector>

#include "sheetmill/contours/contour_line.hpp"

namespace sheetmill::contours::detail {

struct SegRef {
  std::uint32_t line = 0;
  std::uint32_t seg = 0;
};

inline std::size_t segment_count(const ContourLine& l) {
  if (l.ground.size() < 2) return 0;
  return l.closed ? l.ground.size() : l.ground.size() - 1;
}
inline Point seg_a(const ContourLine& l, std::size_t s) {
  return l.ground[s];
}
inline Point seg_b(const ContourLine& l, std::size_t s) {
  return l.ground[(s + 1) % l.ground.size()];
}

// Distance between segments ab and cd (0 when they intersect or touch).
double segment_distance(Point a, Point b, Point c, Point d);
// True when the closed segments ab and cd share at least one point.
bool segments_intersect(Point a, Point b, Point c, Point d);

class SegmentGrid {
 public:
  // `cell_hint` is the preferred cell size in line units; grown if the grid would be too large.
  SegmentGrid(const std::vector<ContourLine>& lines, double cell_hint);

  // Calls f(SegRef) for every segment registered in a cell that `box` overlaps. A segment may
  // be reported more than once.
  template <class F>
  void query(const Box& box, F&& f) const {
    if (nx_ == 0) return;
    int x0, y0, x1, y1;
    cells(box, x0, y0, x1, y1);
    for (int y = y0; y <= y1; ++y) {
      for (int x = x0; x <= x1; ++x) {
        std::size_t c = static_cast<std::size_t>(y) * nx_ + x;
        for (std::uint32_t k = start_[c]; k < start_[c + 1]; ++k) f(items_[k]);
      }
    }
  }

 private:
  void cells(const Box& b, int& x0, int& y0, int& x1, int& y1) const;
  Box bounds_;
  double cell_ = 1;
  int nx_ = 0, ny_ = 0;
  std::vector<std::uint32_t> start_;
  std::vector<SegRef> items_;
};

}  // namespace sheetmill::contours::detail
