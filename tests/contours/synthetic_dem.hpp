#pragma once
// Analytic surfaces sampled at cell centres, for tests with known answers.

#include <functional>

#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::contours::synthetic {

// A north-up grid of w x h cells of `cell_m`, origin (x0, y0 top), z = f(E, N) at cell centres.
inline terrain::Dem make_dem(int w, int h, double cell_m, double x0, double y0,
                             const std::function<double(double, double)>& f) {
  terrain::Dem d;
  d.grid.width = w;
  d.grid.height = h;
  double gt[6] = {x0, cell_m, 0, y0, 0, -cell_m};
  std::copy(gt, gt + 6, d.grid.geotransform);
  d.cell_x_m = d.cell_y_m = cell_m;
  d.z.resize(static_cast<std::size_t>(w) * h);
  for (int j = 0; j < h; ++j)
    for (int i = 0; i < w; ++i)
      d.z[static_cast<std::size_t>(j) * w + i] =
          static_cast<float>(f(x0 + (i + 0.5) * cell_m, y0 - (j + 0.5) * cell_m));
  return d;
}

}  // namespace sheetmill::contours::synthetic
