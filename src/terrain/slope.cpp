#include "sheetmill/terrain/slope.hpp"

#include <cmath>
#include <limits>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/terrain/window3x3.hpp"
#include "terrain/parallel_rows.hpp"

namespace sheetmill::terrain {

SlopeUnits parse_slope_units(const std::string& name) {
  if (name == "degrees") return SlopeUnits::degrees;
  if (name == "percent") return SlopeUnits::percent;
  throw_input_error(std::string(), "units \"" + name + "\": expected degrees or percent");
}

void slope_rows(const Dem& dem, const SlopeParams& params, int row0, int row1, float* out) {
  const int w = dem.width(), h = dem.height();
  const double span = params.zevenbergen_thorne ? 2.0 : 8.0;
  for (int r = row0; r < row1; ++r) {
    const float* mid = dem.z.data() + static_cast<std::size_t>(r) * w;
    const float* above = r > 0 ? mid - w : nullptr;
    const float* below = r + 1 < h ? mid + w : nullptr;
    const double kx = 1.0 / (span * dem.cell_x_m_at(r));
    const double ky = 1.0 / (span * dem.cell_y_m_at(r));
    float* o = out + static_cast<std::size_t>(r - row0) * w;
    for (int c = 0; c < w; ++c) {
      float win[9];
      if (!detail::gather_window(above, mid, below, w, c, win)) {
        o[c] = std::numeric_limits<float>::quiet_NaN();
        continue;
      }
      float gx, gy;
      if (params.zevenbergen_thorne) {
        detail::zt_differences(win, gx, gy);
      } else {
        detail::horn_differences(win, gx, gy);
      }
      const double p = gx * kx, q = gy * ky;
      const double rise = std::sqrt(p * p + q * q);
      o[c] = static_cast<float>(params.units == SlopeUnits::degrees ? std::atan(rise) * kRadToDeg
                                                                    : 100.0 * rise);
    }
  }
}

std::vector<float> slope(const Dem& dem, const SlopeParams& params) {
  if (!(dem.cell_x_m > 0 && dem.cell_y_m > 0)) {
    throw_internal_error("slope: Dem has no ground cell size");
  }
  std::vector<float> out(static_cast<std::size_t>(dem.width()) * dem.height());
  detail::parallel_rows(dem.height(), [&](int begin, int end) {
    slope_rows(dem, params, begin, end, out.data() + static_cast<std::size_t>(begin) * dem.width());
  });
  return out;
}

}  // namespace sheetmill::terrain
