#include "sheetmill/terrain/shade.hpp"

#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/terrain/shade_kernel.hpp"
#include "terrain/parallel_rows.hpp"

namespace sheetmill::terrain {

ShadeMethod parse_shade_method(const std::string& name) {
  if (name == "horn") return ShadeMethod::horn;
  if (name == "zevenbergen-thorne") return ShadeMethod::zevenbergen_thorne;
  if (name == "multidirectional") return ShadeMethod::multidirectional;
  throw_input_error(
      std::string(),
      "method \"" + name + "\": expected one of horn, zevenbergen-thorne, multidirectional");
}

const char* shade_method_name(ShadeMethod method) {
  switch (method) {
    case ShadeMethod::horn:
      return "horn";
    case ShadeMethod::zevenbergen_thorne:
      return "zevenbergen-thorne";
    case ShadeMethod::multidirectional:
      return "multidirectional";
  }
  return "?";
}

namespace detail {
ShadeCoefficients shade_coefficients(const ShadeParams& params, double cell_x_m, double cell_y_m) {
  ShadeCoefficients k;
  k.method = params.method;
  // Horn's weights 1-2-1 on both sides span 8 cell widths; Zevenbergen-Thorne's span 2.
  const double span = params.method == ShadeMethod::zevenbergen_thorne ? 2.0 : 8.0;
  k.kx = static_cast<float>(params.exaggeration / (span * cell_x_m));
  k.ky = static_cast<float>(params.exaggeration / (span * cell_y_m));
  const double alt = params.altitude_deg * kDegToRad, az = params.azimuth_deg * kDegToRad;
  k.sin_alt = static_cast<float>(std::sin(alt));
  k.cos_alt = static_cast<float>(std::cos(alt));
  k.sin_az_cos_alt = static_cast<float>(std::sin(az) * std::cos(alt));
  k.cos_az_cos_alt = static_cast<float>(std::cos(az) * std::cos(alt));
  return k;
}
}  // namespace detail

namespace {
void check_params(const Dem& dem, const ShadeParams& params) {
  if (dem.z.size() != static_cast<std::size_t>(dem.width()) * dem.height()) {
    throw_internal_error("hillshade: Dem cell count does not match its grid");
  }
  if (!(dem.cell_x_m > 0 && dem.cell_y_m > 0)) {
    throw_internal_error("hillshade: Dem has no ground cell size");
  }
  if (!(params.altitude_deg >= 0 && params.altitude_deg <= 90)) {
    throw_input_error(std::string(), "altitude: expected 0 to 90 degrees");
  }
  if (!std::isfinite(params.azimuth_deg) || !std::isfinite(params.exaggeration) ||
      params.exaggeration <= 0) {
    throw_input_error(std::string(),
                      "azimuth and exaggeration: expected finite numbers, "
                      "exaggeration above 0");
  }
}
}  // namespace

void hillshade_rows(const Dem& dem, const ShadeParams& params, int row0, int row1,
                    std::uint8_t* out) {
  check_params(dem, params);
  const int w = dem.width(), h = dem.height();
  const float* z = dem.z.data();
  detail::ShadeCoefficients k = detail::shade_coefficients(params, dem.cell_x_m, dem.cell_y_m);
  const bool per_row = !dem.row_cell_x_m.empty();
  for (int r = row0; r < row1; ++r) {
    if (per_row) k = detail::shade_coefficients(params, dem.cell_x_m_at(r), dem.cell_y_m_at(r));
    const float* mid = z + static_cast<std::size_t>(r) * w;
    const float* above = r > 0 ? mid - w : nullptr;
    const float* below = r + 1 < h ? mid + w : nullptr;
    detail::shade_row(above, mid, below, w, k, out + static_cast<std::size_t>(r - row0) * w);
  }
}

double flat_illumination(const ShadeParams& params) {
  // Single light: cos i = sin(alt) at p = q = 0 (shade_kernel.hpp); Mark (1992) as GDAL weights
  // it returns sin(alt) for a flat cell by definition (illumination_multi()).
  return std::sin(params.altitude_deg * kDegToRad);
}

std::vector<std::uint8_t> hillshade(const Dem& dem, const ShadeParams& params) {
  check_params(dem, params);
  std::vector<std::uint8_t> out(static_cast<std::size_t>(dem.width()) * dem.height());
  detail::parallel_rows(dem.height(), [&](int begin, int end) {
    hillshade_rows(dem, params, begin, end,
                   out.data() + static_cast<std::size_t>(begin) * dem.width());
  });
  return out;
}

}  // namespace sheetmill::terrain
