#pragma once
// Relief by horizontal strips, so that no full-page raster is ever held (issue 16).
//
// A StripPlan cuts a relief grid into strips of whole rows of at most `max_strip_pixels` cells.
// render_relief_rows() renders any band of rows of the grid on its own: the band is read from
// the DEM with a one-cell margin (render_relief_window), so bands join without a seam and each
// cell equals the cell of the whole grid rendered at once (within the warper's rounding).
// Memory is bounded by one band: about rows * width * 30 bytes while it is rendered.
//
// The flattened forms are what a reader sees over white paper: premultiplied ARGB composited
// over white, c + (255 - a). Composed with the Multiply blend, a flattened pixel darkens what
// lies under it exactly as the ARGB pixel does (B * (1 - a) + a * B * C = B * (c + 1 - a)).

#include <cstdint>
#include <functional>
#include <memory>
#include <string>
#include <vector>

#include "sheetmill/terrain/relief.hpp"

namespace sheetmill::terrain {

struct RowStrip {
  int row0 = 0;  // first row in the grid
  int rows = 0;
};

inline constexpr long kDefaultStripPixels = 4L * 1024 * 1024;

// Strips of whole rows covering [0, height), top to bottom, each at most max_strip_pixels cells
// (at least one row).
std::vector<RowStrip> plan_row_strips(int width, int height,
                                      long max_strip_pixels = kDefaultStripPixels);

// Called with each band's image and the DEM it was rendered from (the image's cell (c, r) is the
// DEM's cell (c + margin, r + margin)), before the DEM is dropped: for per-cell changes that need
// the elevations (a sea tint).
using ReliefAdjust = std::function<void(ReliefImage& image, const Dem& dem, int margin)>;

struct ReliefSource {
  std::string dem_path;
  RasterGrid grid;  // the whole relief grid
  DemReadOptions read_options;
  ReliefParams params;
  ReliefAdjust adjust;  // may be empty
  // The DEM kept open between bands (null: opened for each band). Bands are then rendered one
  // at a time.
  std::shared_ptr<const DemReader> reader;
};

// Rows [row0, row0 + rows) of the source's grid, grid.width wide. The rows may reach beyond the
// grid (they are then rendered from whatever the DEM has there).
ReliefImage render_relief_rows(const ReliefSource& source, int row0, int rows);

// Over white paper: 3 bytes (R, G, B) per pixel.
std::vector<std::uint8_t> flatten_rgb(const ReliefImage& image);
// Over white paper, for ink without colour (every pixel grey): 1 byte per pixel, the red channel
// of flatten_rgb.
std::vector<std::uint8_t> flatten_grey(const ReliefImage& image);

}  // namespace sheetmill::terrain
