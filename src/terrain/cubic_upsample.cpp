#include "terrain/cubic_upsample.hpp"

#include <cmath>

#include "terrain/parallel_rows.hpp"

namespace sheetmill::terrain::detail {

namespace {

// Keys (1981) cubic convolution weights, a = -0.5, for the four samples around a position at
// fraction t past the second one (the form GDAL's warper uses).
inline void keys_weights(double t, double w[4]) {
  const double t2 = t * t, t3 = t2 * t;
  w[0] = -0.5 * t3 + t2 - 0.5 * t;
  w[1] = 1.5 * t3 - 2.5 * t2 + 1;
  w[2] = -1.5 * t3 + 2 * t2 + 0.5 * t;
  w[3] = 0.5 * t3 - 0.5 * t2;
}

struct Tap {
  int i = 0;  // first of the four source samples, in the read window
  double w[4];
};

}  // namespace

bool cubic_upsample_same_crs(GDALDataset& src, const OGRSpatialReference& src_srs,
                             const OGRSpatialReference& dst_srs, const RasterGrid& target,
                             std::optional<double> nodata, std::vector<float>& z) {
  if (!src_srs.IsSame(&dst_srs)) return false;
  double sgt[6];
  if (src.GetGeoTransform(sgt) != CE_None) return false;
  const double* tgt = target.geotransform;
  if (sgt[2] != 0 || sgt[4] != 0 || tgt[2] != 0 || tgt[4] != 0) return false;
  // GDAL's warper takes its four-sample cubic only when upsampling (scale >= 0.95 each way).
  if (!(std::abs(tgt[1]) <= std::abs(sgt[1]) / 0.95 && std::abs(tgt[5]) <= std::abs(sgt[5]) / 0.95))
    return false;
  const int tw = target.width, th = target.height;
  // Source position (in source pixels) of target column c's and row r's cell centres.
  auto src_x = [&](int c) { return (tgt[0] + (c + 0.5) * tgt[1] - sgt[0]) / sgt[1]; };
  auto src_y = [&](int r) { return (tgt[3] + (r + 0.5) * tgt[5] - sgt[3]) / sgt[5]; };
  auto first = [](double s) { return static_cast<int>(std::floor(s - 0.5)) - 1; };
  int x0 = std::min(first(src_x(0)), first(src_x(tw - 1)));
  int x1 = std::max(first(src_x(0)), first(src_x(tw - 1))) + 4;
  int y0 = std::min(first(src_y(0)), first(src_y(th - 1)));
  int y1 = std::max(first(src_y(0)), first(src_y(th - 1))) + 4;
  GDALRasterBand* band = src.GetRasterBand(1);
  if (x0 < 0 || y0 < 0 || x1 > src.GetRasterXSize() || y1 > src.GetRasterYSize()) return false;
  const int ww = x1 - x0, wh = y1 - y0;
  std::vector<float> win(static_cast<std::size_t>(ww) * wh);
  if (band->RasterIO(GF_Read, x0, y0, ww, wh, win.data(), ww, wh, GDT_Float32, 0, 0, nullptr) !=
      CE_None) {
    return false;
  }
  // Any nodata in the window: the warper's masked path decides, not this one.
  for (float v : win) {
    if (std::isnan(v) || (nodata && static_cast<double>(v) == *nodata)) return false;
  }
  std::vector<Tap> cols(tw), rows(th);
  for (int c = 0; c < tw; ++c) {
    const double s = src_x(c);
    const int i = static_cast<int>(std::floor(s - 0.5));
    cols[c].i = i - 1 - x0;
    keys_weights(s - 0.5 - i, cols[c].w);
  }
  for (int r = 0; r < th; ++r) {
    const double s = src_y(r);
    const int i = static_cast<int>(std::floor(s - 0.5));
    rows[r].i = i - 1 - y0;
    keys_weights(s - 0.5 - i, rows[r].w);
  }
  z.resize(static_cast<std::size_t>(tw) * th);
  parallel_rows(th, [&](int begin, int end) {
    for (int r = begin; r < end; ++r) {
      const Tap& ty = rows[r];
      const float* s0 = win.data() + static_cast<std::size_t>(ty.i) * ww;
      float* out = z.data() + static_cast<std::size_t>(r) * tw;
      for (int c = 0; c < tw; ++c) {
        const Tap& tx = cols[c];
        double v[4];
        for (int k = 0; k < 4; ++k) {
          const float* p = s0 + static_cast<std::size_t>(k) * ww + tx.i;
          v[k] = tx.w[0] * p[0] + tx.w[1] * p[1] + tx.w[2] * p[2] + tx.w[3] * p[3];
        }
        out[c] =
            static_cast<float>(ty.w[0] * v[0] + ty.w[1] * v[1] + ty.w[2] * v[2] + ty.w[3] * v[3]);
      }
    }
  });
  return true;
}

}  // namespace sheetmill::terrain::detail
