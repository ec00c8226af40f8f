#include "sheetmill/terrain/relief.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/terrain/shade_kernel.hpp"
#include "terrain/parallel_rows.hpp"

namespace sheetmill::terrain {

namespace {
// 0..1 to 0..255, rounded (half up; the values are never negative).
std::uint32_t to_byte(double v) {
  return static_cast<std::uint32_t>(std::clamp(v, 0.0, 1.0) * 255.0 + 0.5);
}
std::uint32_t pack(double a, double r_premul, double g_premul, double b_premul) {
  return (to_byte(a) << 24) | (to_byte(r_premul) << 16) | (to_byte(g_premul) << 8) |
         to_byte(b_premul);
}

// Composes the block of `dem` at rows [row0, row1), columns [col0, col0 + out_w) into `out`
// (out_w pixels per row, first row = row0). `shade` holds hillshade bytes for the same rows
// at the Dem's full width (null: no shading).
void compose(const Dem& dem, const ReliefParams& params, const std::uint8_t* shade, int row0,
             int row1, int col0, int out_w, std::uint32_t* out) {
  const int w = dem.width();
  const double s = std::clamp(params.shade_strength, 0.0, 1.0);
  const double opacity = std::clamp(params.tint_strength, 0.0, 1.0);
  // The shading factor and the ink pixel depend only on the hillshade byte: tabulate them.
  // White flat ground divides by the decoded byte of level ground (not by sin(altitude)
  // itself), so level ground maps to exactly 1 whatever the rounding of its byte.
  const double flat =
      (detail::encode_shade(static_cast<float>(flat_illumination(params.shading))) - 1) / 254.0;
  const bool normalise = params.flat_ground_white && flat > 0;
  double factor_of[256];
  std::uint32_t ink_of[256];
  for (int b = 0; b < 256; ++b) {
    double illum = b == 0 ? 0.0 : (b - 1) / 254.0;
    if (normalise) illum = std::min(1.0, illum / flat);
    factor_of[b] = 1.0 - s + s * illum;
    ink_of[b] = pack(1.0 - factor_of[b], 0, 0, 0);  // black ink: multiplies what lies under it
  }
  const std::uint32_t unshaded_ink = pack(0, 0, 0, 0);
  for (int r = row0; r < row1; ++r) {
    const float* zrow = dem.z.data() + static_cast<std::size_t>(r) * w + col0;
    const std::uint8_t* srow =
        shade ? shade + static_cast<std::size_t>(r - row0) * w + col0 : nullptr;
    std::uint32_t* orow = out + static_cast<std::size_t>(r - row0) * out_w;
    for (int c = 0; c < out_w; ++c) {
      const float z = zrow[c];
      if (std::isnan(z)) {
        orow[c] = 0;
      } else if (params.tint) {
        const double factor = srow ? factor_of[srow[c]] : 1.0;
        const Colour t = tint_colour(params.ramp, z);
        const double a = opacity * t.a;
        orow[c] = pack(a, t.r * factor * a, t.g * factor * a, t.b * factor * a);
      } else {
        orow[c] = srow ? ink_of[srow[c]] : unshaded_ink;
      }
    }
  }
}

}  // namespace

ReliefImage render_relief_cropped(const Dem& dem, const ReliefParams& params, int margin) {
  if (params.tint) validate_ramp(params.ramp, "relief tint");
  ReliefImage img;
  img.width = std::max(0, dem.width() - 2 * margin);
  img.height = std::max(0, dem.height() - 2 * margin);
  img.argb.assign(static_cast<std::size_t>(img.width) * img.height, 0);
  if (img.argb.empty()) return img;
  const bool shaded = params.shade && params.shade_strength > 0;
  const int w = dem.width();
  std::vector<std::uint8_t> shade(shaded ? static_cast<std::size_t>(w) * img.height : 0);
  detail::parallel_rows(img.height, [&](int begin, int end) {
    std::uint8_t* sh = shaded ? shade.data() + static_cast<std::size_t>(begin) * w : nullptr;
    if (sh) hillshade_rows(dem, params.shading, margin + begin, margin + end, sh);
    compose(dem, params, sh, margin + begin, margin + end, margin, img.width,
            img.argb.data() + static_cast<std::size_t>(begin) * img.width);
  });
  return img;
}

ReliefImage render_relief(const Dem& dem, const ReliefParams& params) {
  if (params.shade && params.shade_strength > 0 && !dem.z.empty()) {
    hillshade_rows(dem, params.shading, 0, 0, nullptr);  // validates the parameters up front
  }
  return render_relief_cropped(dem, params, 0);
}

RasterGrid sub_grid(const RasterGrid& grid, int col0, int row0, int width, int height) {
  RasterGrid g = grid;
  g.width = width;
  g.height = height;
  const double* gt = grid.geotransform;
  g.geotransform[0] = gt[0] + col0 * gt[1] + row0 * gt[2];
  g.geotransform[3] = gt[3] + col0 * gt[4] + row0 * gt[5];
  return g;
}

ReliefImage render_relief_window(const std::string& dem_path, const RasterGrid& grid,
                                 const DemReadOptions& read_options, const ReliefParams& params) {
  Dem dem = read_dem_window(dem_path, sub_grid(grid, -1, -1, grid.width + 2, grid.height + 2),
                            read_options);
  return render_relief_cropped(dem, params, 1);
}

void render_relief_strips(const std::string& dem_path, const RasterGrid& grid,
                          const DemReadOptions& read_options, const ReliefParams& params,
                          int strip_rows,
                          const std::function<void(int, const ReliefImage&)>& sink) {
  if (strip_rows <= 0) throw_internal_error("render_relief_strips: strip_rows must be > 0");
  for (int row0 = 0; row0 < grid.height; row0 += strip_rows) {
    int rows = std::min(strip_rows, grid.height - row0);
    RasterGrid strip = sub_grid(grid, 0, row0, grid.width, rows);
    sink(row0, render_relief_window(dem_path, strip, read_options, params));
  }
}

}  // namespace sheetmill::terrain
