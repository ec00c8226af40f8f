#include "sheetmill/accuracy/dem_sampler.hpp"

#include <algorithm>
#include <cmath>

namespace sheetmill::accuracy {

namespace {

// Linear between a and b. A term of weight zero is left out, so a nodata (NaN) cell that is not
// needed (a point on a cell centre's row or column, or the grid's last one) cannot turn the
// sample into NaN (NaN x 0 is NaN); a nodata cell with a nonzero weight does, as it should.
double lerp(double a, double b, double t) {
  if (t == 0) return a;
  if (t == 1) return b;
  return a * (1 - t) + b * t;
}

}  // namespace

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
  double top = lerp(z(c0, r0), z(c1, r0), u);
  double bottom = v == 0 ? 0 : lerp(z(c0, r1), z(c1, r1), u);
  return lerp(top, bottom, v);
}

}  // namespace sheetmill::accuracy
