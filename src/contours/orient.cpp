#include "contours/orient.hpp"

#include <algorithm>
#include <cmath>

namespace sheetmill::contours::detail {

double signed_area(const Polyline& ring) {
  double a = 0;
  for (std::size_t i = 0, n = ring.size(); i < n; ++i) a += cross(ring[i], ring[(i + 1) % n]);
  return a / 2;
}

void orient_uphill_left(ContourLine& line, const DemSampler& dem) {
  const Polyline& p = line.ground;
  std::size_t nseg = line.closed ? p.size() : p.size() - 1;
  if (nseg == 0) return;
  double offset = dem.cell_m() / 3;
  std::size_t step = std::max<std::size_t>(1, nseg / 9);
  int votes = 0;
  for (std::size_t s = 0; s < nseg; s += step) {
    Point a = p[s], b = p[(s + 1) % p.size()];
    Point d = b - a;
    double len = length(d);
    if (len <= 0) continue;
    Point m = (a + b) * 0.5;
    Point left{-d.y / len * offset, d.x / len * offset};
    double zl = dem.elevation(m + left), zr = dem.elevation(m - left);
    if (std::isnan(zl) || std::isnan(zr) || zl == zr) continue;
    votes += zl > zr ? 1 : -1;
  }
  if (votes < 0) std::reverse(line.ground.begin(), line.ground.end());
  line.uphill_known = votes != 0;
}

}  // namespace sheetmill::contours::detail
