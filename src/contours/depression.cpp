#include "contours/depression.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

#include "contours/orient.hpp"

namespace sheetmill::contours::detail {

Enclosed enclosed_ground(const ContourLine& line, const terrain::Dem& dem,
                         const DemSampler& sampler) {
  const Polyline& p = line.ground;
  if (!line.closed || p.size() < 3) return Enclosed::unknown;
  for (const Point& v : p)
    if (std::isnan(sampler.elevation(v))) return Enclosed::unknown;
  const double* gt = dem.grid.geotransform;
  const int w = dem.width(), h = dem.height();
  Box b;
  for (const Point& v : p) b.add(v);
  // Rows and columns whose centres may lie inside.
  auto col_of = [&](double x) { return (x - gt[0]) / gt[1] - 0.5; };
  auto row_of = [&](double y) { return (y - gt[3]) / gt[5] - 0.5; };
  const int c0 =
      std::max(0, static_cast<int>(std::floor(std::min(col_of(b.min_x), col_of(b.max_x)))));
  const int c1 =
      std::min(w - 1, static_cast<int>(std::ceil(std::max(col_of(b.min_x), col_of(b.max_x)))));
  const int r0 =
      std::max(0, static_cast<int>(std::floor(std::min(row_of(b.min_y), row_of(b.max_y)))));
  const int r1 =
      std::min(h - 1, static_cast<int>(std::ceil(std::max(row_of(b.min_y), row_of(b.max_y)))));
  if (c1 < c0 || r1 < r0) return Enclosed::unknown;
  const int bw = c1 - c0 + 1, bh = r1 - r0 + 1;
  std::vector<char> inside(static_cast<std::size_t>(bw) * bh, 0);
  std::vector<double> xs;
  const std::size_t n = p.size();
  for (int r = r0; r <= r1; ++r) {
    // Even-odd scanline through the row of centres (half-open edges: no vertex counted twice).
    const double y = gt[3] + (r + 0.5) * gt[5];
    xs.clear();
    for (std::size_t i = 0; i < n; ++i) {
      Point a = p[i], c = p[(i + 1) % n];
      if ((a.y > y) == (c.y > y)) continue;
      xs.push_back(a.x + (y - a.y) / (c.y - a.y) * (c.x - a.x));
    }
    std::sort(xs.begin(), xs.end());
    for (std::size_t k = 0; k + 1 < xs.size(); k += 2) {
      int from = std::max(c0, static_cast<int>(std::ceil(col_of(xs[k]))));
      int to = std::min(c1, static_cast<int>(std::floor(col_of(xs[k + 1]))));
      for (int c = from; c <= to; ++c) inside[static_cast<std::size_t>(r - r0) * bw + (c - c0)] = 1;
    }
  }
  auto in = [&](int c, int r) {
    return c >= c0 && c <= c1 && r >= r0 && r <= r1 &&
           inside[static_cast<std::size_t>(r - r0) * bw + (c - c0)];
  };
  long below = 0, above = 0, cells = 0;
  for (int r = r0; r <= r1; ++r) {
    for (int c = c0; c <= c1; ++c) {
      if (!in(c, r)) continue;
      ++cells;
      const float z = dem.at(c, r);
      if (std::isnan(z) || c == 0 || r == 0 || c == w - 1 || r == h - 1) return Enclosed::unknown;
      const bool rim = !in(c - 1, r) || !in(c + 1, r) || !in(c, r - 1) || !in(c, r + 1);
      if (!rim) continue;
      below += z < line.elevation_m;
      above += z > line.elevation_m;
    }
  }
  if (cells == 0 || below == above) return Enclosed::unknown;
  return below > above ? Enclosed::lower : Enclosed::higher;
}

void classify_loop(ContourLine& line, const terrain::Dem& dem, const DemSampler& sampler) {
  line.depression = false;
  if (!line.closed) return;
  const Enclosed e = enclosed_ground(line, dem, sampler);
  if (e == Enclosed::unknown) return;
  // Higher ground on the left: a hill runs counter-clockwise, a depression clockwise.
  const bool ccw = signed_area(line.ground) > 0;
  if ((e == Enclosed::higher) != ccw) std::reverse(line.ground.begin(), line.ground.end());
  line.uphill_known = true;
  line.depression = e == Enclosed::lower;
}

}  // namespace sheetmill::contours::detail
