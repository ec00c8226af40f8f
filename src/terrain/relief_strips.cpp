#include "sheetmill/terrain/relief_strips.hpp"

#include <algorithm>
#include <limits>

#include "sheetmill/core/error.hpp"

namespace sheetmill::terrain {

std::vector<RowStrip> plan_row_strips(int width, int height, long max_strip_pixels) {
  std::vector<RowStrip> strips;
  const long rows_per_strip =
      std::clamp<long>(max_strip_pixels / std::max(1, width), 1, std::numeric_limits<int>::max());
  for (long row0 = 0; row0 < height; row0 += rows_per_strip) {
    strips.push_back(
        {static_cast<int>(row0), static_cast<int>(std::min<long>(rows_per_strip, height - row0))});
  }
  return strips;
}

ReliefImage render_relief_rows(const ReliefSource& source, int row0, int rows) {
  if (rows <= 0) throw_internal_error("render_relief_rows: no rows");
  const RasterGrid band = sub_grid(source.grid, 0, row0, source.grid.width, rows);
  // As render_relief_window: the band grown by one cell on every side, rendered, cropped.
  const RasterGrid grown = sub_grid(band, -1, -1, band.width + 2, rows + 2);
  const Dem dem = source.reader ? source.reader->read(grown, source.read_options)
                                : read_dem_window(source.dem_path, grown, source.read_options);
  ReliefImage image = render_relief_cropped(dem, source.params, 1);
  if (source.adjust) source.adjust(image, dem, 1);
  return image;
}

namespace {
// Premultiplied ARGB over white: channel + (255 - alpha), at most 255.
inline std::uint8_t over_white(std::uint32_t channel, std::uint32_t inv_alpha) {
  return static_cast<std::uint8_t>(std::min<std::uint32_t>(255, channel + inv_alpha));
}
}  // namespace

std::vector<std::uint8_t> flatten_rgb(const ReliefImage& image) {
  std::vector<std::uint8_t> rgb(image.argb.size() * 3);
  for (std::size_t i = 0; i < image.argb.size(); ++i) {
    const std::uint32_t p = image.argb[i];
    const std::uint32_t inv = 255 - (p >> 24);
    rgb[3 * i] = over_white((p >> 16) & 255, inv);
    rgb[3 * i + 1] = over_white((p >> 8) & 255, inv);
    rgb[3 * i + 2] = over_white(p & 255, inv);
  }
  return rgb;
}

std::vector<std::uint8_t> flatten_grey(const ReliefImage& image) {
  std::vector<std::uint8_t> grey(image.argb.size());
  for (std::size_t i = 0; i < image.argb.size(); ++i) {
    const std::uint32_t p = image.argb[i];
    grey[i] = over_white((p >> 16) & 255, 255 - (p >> 24));
  }
  return grey;
}

}  // namespace sheetmill::terrain
