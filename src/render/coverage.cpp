#include "render/coverage.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/log.hpp"

namespace sheetmill::render {

double frame_coverage(const terrain::Dem& dem, const MapFrame& frame) {
  const double* gt = dem.grid.geotransform;
  long inside = 0, valid = 0;
  for (int r = 0; r < dem.height(); ++r) {
    const double y = gt[3] + (r + 0.5) * gt[5];
    if (y < frame.ground.min_y || y > frame.ground.max_y) continue;
    for (int c = 0; c < dem.width(); ++c) {
      const double x = gt[0] + (c + 0.5) * gt[1];
      if (x < frame.ground.min_x || x > frame.ground.max_x) continue;
      ++inside;
      valid += !std::isnan(dem.at(c, r));
    }
  }
  return inside == 0 ? 1.0 : static_cast<double>(valid) / static_cast<double>(inside);
}

void warn_frame_coverage(const std::string& dem_path, double share) {
  if (share <= 0) {
    log::warn("{}: no elevation data under the map frame; the sheet has no relief or contours",
              dem_path);
  } else if (share < 1) {
    // Never rounded up to a full 100.0 %: a frame with one cell missing is not covered.
    double percent = std::min(99.9, std::floor(share * 1000) / 10);
    log::warn(
        "{}: the DEM covers {:.1f} % of the map frame; relief and contours are missing "
        "elsewhere",
        dem_path, percent);
  }
}

}  // namespace sheetmill::render
