#pragma once
// The relief layer of a sheet: hillshade and hypsometric tint as one image for Cairo.
//
// Pixels are premultiplied ARGB32 in native byte order (CAIRO_FORMAT_ARGB32, stride 4 * width),
// row-major, transparent (0) where the DEM has no data. With a tint, the tint is multiplied by
// the shading:  out = tint * (1 - s + s * shade),  s = shade_strength, shade = illumination in
// 0..1 (as encoded by hillshade()), and the tint layer's opacity is tint_strength times the ramp
// colour's alpha. Without a tint the image is a black ink layer of alpha s * (1 - shade):
// painted over anything (paper, area fills) it multiplies what is under it by (1 - s + s*shade),
// the same blend.
//
// `flat_ground_white` changes what `shade` is: tone = min(1, I / I_flat) with I_flat the
// illumination of level ground (sin(altitude), for one light and for the multidirectional
// kernel alike), so flat ground and slopes facing the light print paper-white and only shadows
// add tone, as printed topographic relief does (common practice). Without it `shade` is the
// illumination itself, and flat ground is darkened by s * (1 - sin(altitude)).

#include <cstdint>
#include <functional>
#include <string>
#include <vector>

#include "sheetmill/terrain/dem.hpp"
#include "sheetmill/terrain/shade.hpp"
#include "sheetmill/terrain/tint.hpp"

namespace sheetmill::terrain {

struct ReliefParams {
  bool shade = true;
  ShadeParams shading;
  double shade_strength = 0.5;     // 0..1
  bool flat_ground_white = false;  // tone = min(1, I / I_flat), see above
  bool tint = false;
  TintRamp ramp;
  double tint_strength = 1.0;  // 0..1
};

struct ReliefImage {
  int width = 0, height = 0;
  std::vector<std::uint32_t> argb;
};

// The whole Dem as an image of the same size. Cells at the Dem's edge are shaded from what
// exists (see shade.hpp); to avoid any edge effect read the Dem with a one-cell margin and crop,
// as render_relief_window() does. Uses both cores.
ReliefImage render_relief(const Dem& dem, const ReliefParams& params);

// The relief of `dem` without `margin` cells on every side (they only feed the neighbours of the
// cells kept). Uses both cores.
ReliefImage render_relief_cropped(const Dem& dem, const ReliefParams& params, int margin);

// Reads `grid` grown by one cell on every side from the DEM (read_dem_window), renders it and
// returns exactly `grid`'s cells: the frame edge gets true neighbours, no seam.
ReliefImage render_relief_window(const std::string& dem_path, const RasterGrid& grid,
                                 const DemReadOptions& read_options, const ReliefParams& params);

// The same in strips of at most `strip_rows` rows, top to bottom, for sheets too large to hold
// at once: sink(first_row, strip) receives each strip (width = grid.width). Memory is bounded by
// one strip plus its margin. Strips join without seams (each is read with a one-cell margin).
void render_relief_strips(const std::string& dem_path, const RasterGrid& grid,
                          const DemReadOptions& read_options, const ReliefParams& params,
                          int strip_rows,
                          const std::function<void(int first_row, const ReliefImage& strip)>& sink);

// A sub-grid of `grid`: columns [col0, col0 + width), rows [row0, row0 + height); the ranges may
// extend beyond `grid` (for margins).
RasterGrid sub_grid(const RasterGrid& grid, int col0, int row0, int width, int height);

}  // namespace sheetmill::terrain
