#include "sheetmill/exhibit/inset_map.hpp"

#include <algorithm>
#include <cmath>

#include "exhibit/text_helpers.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/terrain/relief.hpp"

namespace sheetmill::exhibit {

void draw_inset_map(cairo_t* cr, const Box& box, const ExhibitProject& project,
                    const MapFrame& frame, const terrain::TintRamp& ramp, const TypeScale& type,
                    text::FontCache& fonts, const std::vector<Point>& terrain_ground) {
  const double heading_h = type.heading_pt * kMmPerPt;
  detail::put_text(cr, fonts, detail::bold(), type.heading_pt, "Location",
                   {box.min_x, box.min_y + heading_h}, detail::Align::left, {0.1, 0.1, 0.1, 1});
  Box map = Box::of(box.min_x, box.min_y + heading_h * 1.6, box.max_x, box.max_y);
  // The inset keeps the frame's proportions, three times its extent, centred on it.
  const double aspect = frame.ground.width() / frame.ground.height();
  double w = map.width(), h = w / aspect;
  if (h > map.height()) {
    h = map.height();
    w = h * aspect;
  }
  map = Box::of(map.min_x, map.min_y, map.min_x + w, map.min_y + h);
  const double k = 3.0;
  const Point c = frame.ground.centre();
  const Box ground =
      Box::of(c.x - k * frame.ground.width() / 2, c.y - k * frame.ground.height() / 2,
              c.x + k * frame.ground.width() / 2, c.y + k * frame.ground.height() / 2);
  // About 100 cells per inch on paper: plenty for an overview, a few hundred kilobytes.
  RasterGrid g;
  g.width = std::max(8, static_cast<int>(w / kMmPerInch * 100));
  const double cell = ground.width() / g.width;
  g.height = std::max(8, static_cast<int>(std::round(ground.height() / cell)));
  g.geotransform[0] = ground.min_x;
  g.geotransform[1] = cell;
  g.geotransform[3] = ground.max_y;
  g.geotransform[5] = -cell;
  g.crs_wkt = frame.crs_wkt;
  terrain::ReliefParams params;
  params.shading.method = terrain::ShadeMethod::multidirectional;
  params.shade_strength = 0.4;
  params.tint = true;
  params.ramp = ramp;
  params.tint_strength = 0.8;
  terrain::DemReadOptions opts;
  opts.assumed_crs = project.relief.dem_crs;
  // The inset reaches three frames across, past the DEM by design: grey there says "no data"
  // on the page, and a log warning about it would only alarm whoever prints the exhibit.
  opts.warn_coverage = false;

  cairo_save(cr);
  cairo_rectangle(cr, map.min_x, map.min_y, map.width(), map.height());
  cairo_set_source_rgb(cr, 0.93, 0.93, 0.92);  // beyond the data: neutral paper grey
  cairo_fill_preserve(cr);
  cairo_clip(cr);
  {
    terrain::ReliefImage img = terrain::render_relief_window(project.relief.dem, g, opts, params);
    CairoSurfacePtr s(cairo_image_surface_create(CAIRO_FORMAT_ARGB32, img.width, img.height));
    check_cairo(cairo_surface_status(s.get()), "inset image");
    cairo_surface_flush(s.get());
    unsigned char* data = cairo_image_surface_get_data(s.get());
    const int stride = cairo_image_surface_get_stride(s.get());
    for (int r = 0; r < img.height; ++r) {
      std::copy(img.argb.begin() + static_cast<std::ptrdiff_t>(r) * img.width,
                img.argb.begin() + static_cast<std::ptrdiff_t>(r + 1) * img.width,
                reinterpret_cast<std::uint32_t*>(data + r * stride));
    }
    cairo_surface_mark_dirty(s.get());
    cairo_save(cr);
    cairo_translate(cr, map.min_x, map.min_y);
    cairo_scale(cr, w / img.width, h / img.height);
    cairo_set_source_surface(cr, s.get(), 0, 0);
    cairo_paint(cr);
    cairo_restore(cr);
  }
  // The terrain data's extent, so the exhibit is seen inside something known.
  if (terrain_ground.size() >= 3) {
    cairo_new_path(cr);
    for (const Point& g : terrain_ground) {
      cairo_line_to(cr, map.min_x + (g.x - ground.min_x) / ground.width() * w,
                    map.min_y + (ground.max_y - g.y) / ground.height() * h);
    }
    cairo_close_path(cr);
    const double dash[] = {1.6 * type.factor, 0.8 * type.factor};
    cairo_set_dash(cr, dash, 2, 0);
    cairo_set_source_rgb(cr, 0.25, 0.25, 0.25);
    cairo_set_line_width(cr, 0.4 * type.factor);
    cairo_stroke(cr);
    cairo_set_dash(cr, nullptr, 0, 0);
  }
  // The exhibit's frame: the middle third.
  cairo_set_source_rgb(cr, 0.78, 0.12, 0.35);
  cairo_set_line_width(cr, 0.8 * type.factor);
  cairo_rectangle(cr, map.min_x + w / 3, map.min_y + h / 3, w / 3, h / 3);
  cairo_stroke(cr);
  cairo_restore(cr);
  cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
  cairo_set_line_width(cr, 0.35 * type.factor);
  cairo_rectangle(cr, map.min_x, map.min_y, map.width(), map.height());
  cairo_stroke(cr);
}

}  // namespace sheetmill::exhibit
