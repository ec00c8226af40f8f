#include "render/relief_layer.hpp"

#include <algorithm>
#include <chrono>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/terrain/relief.hpp"
#include "sheetmill/terrain/tint.hpp"

namespace sheetmill::render {

terrain::DemReadOptions dem_options(const project::Project& project) {
  terrain::DemReadOptions o;
  o.assumed_crs = project.elevation.crs;
  o.vertical_unit = project.elevation.vertical_unit;
  o.warn_coverage = false;  // render_sheet reports the frame's coverage once
  return o;
}

void clip_to_neatline(cairo_t* cr, const MapFrame& frame) {
  cairo_new_path(cr);
  if (frame.neatline.size() >= 3) {
    for (std::size_t i = 0; i < frame.neatline.size(); ++i) {
      Point p = frame.to_page(frame.neatline[i]);
      if (i == 0) {
        cairo_move_to(cr, p.x, p.y);
      } else {
        cairo_line_to(cr, p.x, p.y);
      }
    }
    cairo_close_path(cr);
  } else {
    Box b = frame.page_box_mm();
    cairo_rectangle(cr, b.min_x, b.min_y, b.width(), b.height());
  }
  cairo_clip(cr);
}

namespace {
terrain::ShadeMethod shade_method(const std::string& name) {
  if (name == "horn") return terrain::ShadeMethod::horn;
  if (name == "zevenbergen-thorne") return terrain::ShadeMethod::zevenbergen_thorne;
  return terrain::ShadeMethod::multidirectional;
}
// Cells below the sea level take the style's sea colour, opaque; shaded, it is darkened by the
// relief's own lightness there (the relief over white paper), so the sea floor's form shows.
// The image's cell (c, r) is the DEM's cell (c + margin, r + margin).
void tint_sea(terrain::ReliefImage& image, const terrain::Dem& dem, int margin, double sea_level_m,
              const style::DepthStyle& ds) {
  for (int r = 0; r < image.height; ++r) {
    const float* z = dem.z.data() + static_cast<std::size_t>(r + margin) * dem.width() + margin;
    std::uint32_t* row = image.argb.data() + static_cast<std::size_t>(r) * image.width;
    for (int c = 0; c < image.width; ++c) {
      if (!(z[c] < sea_level_m)) continue;
      double lightness = 1;
      if (ds.sea_shaded) {
        const std::uint32_t p = row[c];
        const double a = (p >> 24) & 255, rr = (p >> 16) & 255, g = (p >> 8) & 255, b = p & 255;
        // Premultiplied ARGB over white: channel + (255 - alpha).
        lightness = (0.299 * (rr + 255 - a) + 0.587 * (g + 255 - a) + 0.114 * (b + 255 - a)) / 255;
      }
      auto channel = [&](double v) {
        return static_cast<std::uint32_t>(std::lround(std::clamp(v * lightness, 0.0, 1.0) * 255));
      };
      row[c] = 0xFF000000u | channel(ds.sea.r) << 16 | channel(ds.sea.g) << 8 | channel(ds.sea.b);
    }
  }
}

terrain::ReliefParams relief_params(const style::ReliefStyle& rs, double contour_interval_m) {
  terrain::ReliefParams params;
  params.shade = rs.hillshade;
  params.shading.method = shade_method(rs.method);
  params.shading.azimuth_deg = rs.azimuth_deg;
  params.shading.altitude_deg = rs.altitude_deg;
  params.shading.exaggeration = rs.exaggeration;
  params.shade_strength = rs.shade_strength;
  params.flat_ground_white = rs.flat_ground_white;
  params.tint = rs.tint;
  for (const auto& s : rs.tint_stops) params.ramp.stops.emplace_back(s.elevation_m, s.colour);
  params.ramp.stepped = rs.tint_stepped;
  if (rs.tint_stepped && rs.tint_steps_follow_contours) params.ramp.step_m = contour_interval_m;
  params.tint_strength = rs.tint_strength;
  return params;
}

// Whether the DEM has any data under `grid`, from a coarse read (at most ~256 cells on the long
// side, averaged, so a cell with any data under it has a value).
bool any_data_under(const std::string& dem_path, const RasterGrid& grid,
                    terrain::DemReadOptions options) {
  const double factor = std::max(1.0, std::max(grid.width, grid.height) / 256.0);
  RasterGrid coarse = grid;
  coarse.width = std::max(1, static_cast<int>(std::ceil(grid.width / factor)));
  coarse.height = std::max(1, static_cast<int>(std::ceil(grid.height / factor)));
  coarse.geotransform[1] = grid.geotransform[1] * factor;
  coarse.geotransform[5] = grid.geotransform[5] * factor;
  options.resampling = "average";
  return terrain::read_dem_window(dem_path, coarse, options).valid_count() > 0;
}

}  // namespace

ReliefDrawn draw_relief(pdf::LayeredCanvas& canvas, const std::string& group, pdf::Blend blend,
                        const project::Project& project, const style::Style& style,
                        const MapFrame& frame, double contour_interval_m, long max_strip_pixels) {
  ReliefDrawn drawn;
  const style::ReliefStyle& rs = style.relief;
  // Nothing to draw: the layer still exists, empty, so every sheet lists the same layers.
  auto empty_layer = [&] {
    canvas.begin_group(group, blend);
    canvas.end_group();
    return drawn;
  };
  if (project.elevation.dem.empty() || (!rs.hillshade && !rs.tint)) return empty_layer();
  double dpi = project.output.relief_dpi > 0 ? project.output.relief_dpi : rs.dpi;
  // Two cells of margin: the gradient kernels read one neighbour, resampling another.
  const int margin = 2;
  auto source = std::make_shared<terrain::ReliefSource>();
  source->dem_path = project.elevation.dem;
  source->reader = std::make_shared<const terrain::DemReader>(source->dem_path);
  source->grid = grid_for_frame(frame, dpi, margin);
  source->read_options = dem_options(project);
  source->read_options.resampling = rs.resampling;  // auto: cubic when upsampling, else average
  source->params = relief_params(rs, contour_interval_m);
  if (source->params.tint) terrain::validate_ramp(source->params.ramp, "relief tint");
  if (!any_data_under(source->dem_path, source->grid, source->read_options)) {
    drawn.any_data = false;
    return empty_layer();
  }
  const bool sea = project.elevation.sea_level_m.has_value();
  if (sea) {
    const double sea_level_m = *project.elevation.sea_level_m;
    const style::DepthStyle ds = style.contours.depths;
    source->adjust = [sea_level_m, ds](terrain::ReliefImage& image, const terrain::Dem& dem,
                                       int m) { tint_sea(image, dem, m, sea_level_m, ds); };
  }

  pdf::StreamedRaster raster;
  const RasterGrid& grid = source->grid;
  raster.width = grid.width;
  raster.height = grid.height;
  // Ink without colour (hillshade alone) is grey over paper: one channel.
  raster.channels = rs.tint || sea ? 3 : 1;
  for (const terrain::RowStrip& s :
       terrain::plan_row_strips(grid.width, grid.height, max_strip_pixels)) {
    raster.strips.push_back({s.row0, s.rows});
  }
  raster.origin_mm = frame.to_page({grid.geotransform[0], grid.geotransform[3]});
  raster.px_mm = grid.cell_x() * frame.mm_per_metre();
  if (frame.neatline.size() >= 3) {
    for (const Point& p : frame.neatline) raster.clip_page_mm.push_back(frame.to_page(p));
  } else {
    const Box b = frame.page_box_mm();
    raster.clip_page_mm = {
        {b.min_x, b.min_y}, {b.max_x, b.min_y}, {b.max_x, b.max_y}, {b.min_x, b.max_y}};
  }
  const int channels = raster.channels;
  raster.render = [source, channels, seconds = drawn.strip_seconds](int row0, int rows) {
    const auto t0 = std::chrono::steady_clock::now();
    const terrain::ReliefImage image = terrain::render_relief_rows(*source, row0, rows);
    auto pixels = channels == 1 ? terrain::flatten_grey(image) : terrain::flatten_rgb(image);
    *seconds += std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    return pixels;
  };
  raster.compression = project.output.relief_compression == "jpeg" ? pdf::RasterCompression::jpeg
                                                                   : pdf::RasterCompression::flate;
  raster.jpeg_quality = project.output.jpeg_quality;
  canvas.add_streamed_raster(group, blend, std::move(raster));
  return drawn;
}

}  // namespace sheetmill::render
