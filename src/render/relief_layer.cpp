#include "render/relief_layer.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/terrain/relief.hpp"

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
void tint_sea(terrain::ReliefImage& image, const terrain::Dem& dem, double sea_level_m,
              const style::Style& style) {
  const style::DepthStyle& ds = style.contours.depths;
  const std::size_t n = std::min(image.argb.size(), dem.z.size());
  for (std::size_t i = 0; i < n; ++i) {
    if (!(dem.z[i] < sea_level_m)) continue;
    double lightness = 1;
    if (ds.sea_shaded) {
      const std::uint32_t p = image.argb[i];
      const double a = (p >> 24) & 255, r = (p >> 16) & 255, g = (p >> 8) & 255, b = p & 255;
      // Premultiplied ARGB over white: channel + (255 - alpha).
      lightness = (0.299 * (r + 255 - a) + 0.587 * (g + 255 - a) + 0.114 * (b + 255 - a)) / 255;
    }
    auto channel = [&](double c) {
      return static_cast<std::uint32_t>(std::lround(std::clamp(c * lightness, 0.0, 1.0) * 255));
    };
    image.argb[i] =
        0xFF000000u | channel(ds.sea.r) << 16 | channel(ds.sea.g) << 8 | channel(ds.sea.b);
  }
}

}  // namespace

bool draw_relief(cairo_t* cr, const project::Project& project, const style::Style& style,
                 const MapFrame& frame, double contour_interval_m) {
  const style::ReliefStyle& rs = style.relief;
  if (project.elevation.dem.empty() || (!rs.hillshade && !rs.tint)) return true;
  double dpi = project.output.relief_dpi > 0 ? project.output.relief_dpi : rs.dpi;
  // Two cells of margin: the gradient kernels read one neighbour, resampling another.
  const int margin = 2;
  RasterGrid grid = grid_for_frame(frame, dpi, margin);
  terrain::DemReadOptions read_options = dem_options(project);
  read_options.resampling = rs.resampling;  // auto: cubic when upsampling, else average
  terrain::Dem dem = terrain::read_dem_window(project.elevation.dem, grid, read_options);
  if (dem.valid_count() == 0) return false;  // render_sheet has said so
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
  terrain::ReliefImage image = terrain::render_relief(dem, params);
  if (project.elevation.sea_level_m) tint_sea(image, dem, *project.elevation.sea_level_m, style);

  // The canvas's recording surface keeps the image surface past this function: the surface owns
  // its pixels through Cairo user data, freed when Cairo lets the surface go.
  auto* pixels = new std::vector<std::uint32_t>(std::move(image.argb));
  CairoSurfacePtr surface(cairo_image_surface_create_for_data(
      reinterpret_cast<unsigned char*>(pixels->data()), CAIRO_FORMAT_ARGB32, image.width,
      image.height, image.width * 4));
  static cairo_user_data_key_t pixels_key;
  if (cairo_surface_set_user_data(surface.get(), &pixels_key, pixels, [](void* p) {
        delete static_cast<std::vector<std::uint32_t>*>(p);
      }) != CAIRO_STATUS_SUCCESS) {
    delete pixels;
    throw_internal_error("relief image: cannot attach pixels");
  }
  check_cairo(cairo_surface_status(surface.get()), "relief image");
  cairo_save(cr);
  clip_to_neatline(cr, frame);
  Point origin = frame.to_page({grid.geotransform[0], grid.geotransform[3]});
  double px_mm = grid.cell_x() * frame.mm_per_metre();
  cairo_translate(cr, origin.x, origin.y);
  cairo_scale(cr, px_mm, px_mm);
  cairo_set_source_surface(cr, surface.get(), 0, 0);
  // Pixels are cells: no smoothing between them when a reader zooms in.
  cairo_pattern_set_filter(cairo_get_source(cr), CAIRO_FILTER_GOOD);
  cairo_paint(cr);
  cairo_restore(cr);
  return true;
}

}  // namespace sheetmill::render
