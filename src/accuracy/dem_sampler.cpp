#include "sheetmill/accuracy/dem_sampler.hpp"

#include <algorithm>
#include <cmath>

namespace sheetmill::accuracy {

DemSampler::DemSampler(const std::string& path, const terrain::DemReadOptions& options)
    : source_(path, options) {}

std::optional<double> DemSampler::at(Point xy) const {
  const RasterGrid& g = source_.grid();
  const double* gt = g.geotransform;
  // Pixel coordinates (north-up grid: DemSource refuses rotated ones).
  double px = (xy.x - gt[0]) / gt[1];
  double py = (xy.y - gt[3]) / gt[5];
  if (!(px >= 0 && py >= 0 && px <= g.width && py <= g.height)) return std::nullopt;
  // Cell centres sit at half-integers; u, v are the fractions between the two centres around.
  double cx = std::clamp(px - 0.5, 0.0, g.width - 1.0);
  double cy = std::clamp(py - 0.5, 0.0, g.height - 1.0);
  int c0 = std::min(static_cast<int>(std::floor(cx)), std::max(g.width - 2, 0));
  int r0 = std::min(static_cast<int>(std::floor(cy)), std::max(g.height - 2, 0));
  int c1 = std::min(c0 + 1, g.width - 1), r1 = std::min(r0 + 1, g.height - 1);
  double u = cx - c0, v = cy - r0;
  if (rows_from_ != r0) {
    source_.read_rows_into(r0, 2, rows_);
    rows_from_ = r0;
  }
  auto z = [&](int c, int r) { return static_cast<double>(rows_.at(c, r - r0)); };
  double top = z(c0, r0) * (1 - u) + z(c1, r0) * u;
  double bottom = z(c0, r1) * (1 - u) + z(c1, r1) * u;
  // A weight of zero must not let a nodata neighbour through as NaN * 0; nor hide one with a
  // nonzero weight: NaN propagates through the sums when its weight is not zero.
  if (u == 0) {
    top = z(c0, r0);
    bottom = z(c0, r1);
  }
  if (v == 0) return top;
  return top * (1 - v) + bottom * v;
}

}  // namespace sheetmill::accuracy
