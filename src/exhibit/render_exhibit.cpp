#include "sheetmill/exhibit/render_exhibit.hpp"

#include <algorithm>
#include <chrono>
#include <cmath>
#include <system_error>

#include "exhibit/repeat_filter.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_format.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/exhibit/inset_map.hpp"
#include "sheetmill/exhibit/overlays.hpp"
#include "sheetmill/exhibit/pdf_relief.hpp"
#include "sheetmill/exhibit/png_strip_writer.hpp"
#include "sheetmill/exhibit/ramps.hpp"
#include "sheetmill/exhibit/relief_strips.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "sheetmill/pdf/registration.hpp"
#include "sheetmill/sheet/dem_footprint.hpp"

namespace sheetmill::exhibit {

ExhibitFormat format_for_path(const std::filesystem::path& output) {
  return file_format_for(output, {FileFormat::pdf, FileFormat::png}) == FileFormat::png
             ? ExhibitFormat::png
             : ExhibitFormat::pdf;
}

namespace {

terrain::TintRamp ramp_for(const ExhibitProject& project, const MapFrame& frame) {
  if (project.relief.ramp) return *project.relief.ramp;
  auto range = project.relief.range_m ? *project.relief.range_m : elevation_range(project, frame);
  return fit_ramp(shipped_ramp(project.relief.ramp_name), range.first, range.second);
}

// Everything but the relief, in page millimetres: the overlays, each in its named layer, then
// the frame and the furniture.
struct Composition {
  ColourBarReport colour_bar;
  CalloutReport callouts;
};

Composition compose(const OverlayTarget& target, const ExhibitProject& project,
                    const ExhibitLayout& layout, const terrain::TintRamp& ramp,
                    const std::vector<Point>& terrain_ground) {
  Composition c;
  text::FontCache fonts;
  OverlayData data = read_overlays(project, layout.frame);
  c.callouts = draw_overlay_groups(target, project, layout.frame, data, layout.type, fonts);
  cairo_t* cr = target.begin("furniture");
  const Box& m = layout.map_box_mm;
  cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
  cairo_set_line_width(cr, 0.6 * layout.type.factor);
  cairo_rectangle(cr, m.min_x, m.min_y, m.width(), m.height());
  cairo_stroke(cr);
  draw_title(cr, layout, project, fonts);
  c.colour_bar = draw_colour_bar(cr, layout.colour_bar_box_mm, ramp, project.relief.exaggeration,
                                 layout.type, fonts);
  draw_scale_bar(cr, layout.scale_box_mm, layout.frame, layout.type, fonts);
  draw_north_arrow(cr, layout.scale_box_mm, layout.frame, layout.type, fonts);
  draw_inset_map(cr, layout.inset_box_mm, project, layout.frame, ramp, layout.type, fonts,
                 terrain_ground);
  draw_notes(cr, layout.notes_box_mm, project, layout.type, fonts);
  check_cairo(cairo_status(cr), "drawing the exhibit");
  target.end();
  return c;
}

// The composition recorded once (for the PNG bands, which replay it over each band's relief).
struct Recording {
  CairoSurfacePtr surface;
  Composition comp;
};

Recording record(const ExhibitProject& project, const ExhibitLayout& layout,
                 const terrain::TintRamp& ramp, const std::vector<Point>& terrain_ground) {
  Recording r;
  cairo_rectangle_t extents{0, 0, layout.page_w_mm, layout.page_h_mm};
  r.surface.reset(cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, &extents));
  CairoPtr cr(cairo_create(r.surface.get()));
  check_cairo(cairo_status(cr.get()), "exhibit composition");
  cairo_t* ctx = cr.get();
  OverlayTarget one{[ctx](const char*) {
                      cairo_save(ctx);
                      return ctx;
                    },
                    [ctx] { cairo_restore(ctx); }};
  r.comp = compose(one, project, layout, ramp, terrain_ground);
  check_cairo(cairo_status(ctx), "drawing the exhibit");
  return r;
}

// The PDF through the shared finisher: every layer an optional content group, the map frame a
// geospatial viewport. The relief is a layer of tagged placeholders there, swapped for the
// streamed strips afterwards (pdf_relief.hpp), so no strip is held while Cairo writes.
Composition write_pdf(const ExhibitProject& project, const ExhibitLayout& layout,
                      const ReliefPlan& plan, const terrain::TintRamp& ramp,
                      const std::vector<Point>& terrain_ground,
                      const std::filesystem::path& output) {
  AtomicOutput out(output);
  const std::filesystem::path layered_file = sibling_temp_path(output, "layers");
  struct Remove {
    std::filesystem::path p;
    ~Remove() {
      std::error_code ec;
      std::filesystem::remove(p, ec);
    }
  } remove_layered_file{layered_file};
  Composition comp;
  {
    pdf::LayeredCanvas canvas(layout.page_w_mm, layout.page_h_mm);
    paint_relief_placeholders(canvas.begin_group("relief"), plan, layout.map_box_mm);
    canvas.end_group();
    OverlayTarget groups{[&canvas](const char* name) { return canvas.begin_group(name); },
                         [&canvas] { canvas.end_group(); }};
    comp = compose(groups, project, layout, ramp, terrain_ground);
    pdf::Metadata meta;
    meta.title = project.title;
    meta.subject = project.subtitle.empty() ? "Hearing exhibit" : project.subtitle;
    meta.keywords = "hearing exhibit; shaded relief; " + layout.frame.crs_name;
    meta.author = project.producer;
    canvas.finish_pdf(layered_file, pdf::registration_of(layout.frame), meta, output.string());
  }
  detail::RepeatFilter once_per_warning;
  StreamedReliefReport rep = stream_relief_into_pdf(
      layered_file, out.temp_path(), plan, project.relief.compression, project.relief.jpeg_quality);
  log::debug("relief: {} strips streamed into the PDF, {} renders", rep.strips_replaced,
             rep.strip_renders);
  out.commit();
  return comp;
}

void paint_argb(cairo_t* cr, const terrain::ReliefImage& img, Point origin_mm, double px_mm) {
  CairoSurfacePtr s(cairo_image_surface_create_for_data(
      reinterpret_cast<unsigned char*>(const_cast<std::uint32_t*>(img.argb.data())),
      CAIRO_FORMAT_ARGB32, img.width, img.height, img.width * 4));
  check_cairo(cairo_surface_status(s.get()), "relief band");
  cairo_save(cr);
  cairo_translate(cr, origin_mm.x, origin_mm.y);
  cairo_scale(cr, px_mm, px_mm);
  cairo_set_source_surface(cr, s.get(), 0, 0);
  cairo_pattern_set_filter(cairo_get_source(cr), CAIRO_FILTER_NEAREST);
  cairo_paint(cr);
  cairo_restore(cr);
  cairo_surface_finish(s.get());
}

void write_png(const ExhibitLayout& layout, const ReliefPlan& plan, const Recording& comp,
               const std::filesystem::path& output, double dpi, long max_pixels) {
  AtomicOutput out(output);
  const double px_per_mm = dpi / kMmPerInch;
  const int w = static_cast<int>(std::lround(layout.page_w_mm * px_per_mm));
  const int h = static_cast<int>(std::lround(layout.page_h_mm * px_per_mm));
  const int band_rows = static_cast<int>(std::clamp<long>(max_pixels / std::max(1, w), 16, h));
  const Box& map = layout.map_box_mm;
  detail::RepeatFilter once_per_warning;
  {
    PngStripWriter png(out.temp_path(), w, h, dpi);
    std::vector<std::uint8_t> row(static_cast<std::size_t>(w) * 3);
    for (int b0 = 0; b0 < h; b0 += band_rows) {
      const int rows = std::min(band_rows, h - b0);
      CairoSurfacePtr band(cairo_image_surface_create(CAIRO_FORMAT_RGB24, w, rows));
      check_cairo(cairo_surface_status(band.get()), "PNG band");
      {
        CairoPtr cr(cairo_create(band.get()));
        cairo_set_source_rgb(cr.get(), 1, 1, 1);
        cairo_paint(cr.get());
        cairo_scale(cr.get(), px_per_mm, px_per_mm);
        cairo_translate(cr.get(), 0, -b0 / px_per_mm);
        // The relief rows under this band only, read and shaded for it alone.
        const double y0 = b0 / px_per_mm, y1 = (b0 + rows) / px_per_mm;
        const int r0 =
            std::max(0, static_cast<int>(std::floor((y0 - plan.origin_mm.y) / plan.px_mm)));
        const int r1 = std::min(plan.grid.height,
                                static_cast<int>(std::ceil((y1 - plan.origin_mm.y) / plan.px_mm)));
        if (r1 > r0 && y1 > map.min_y && y0 < map.max_y) {
          RasterGrid g = terrain::sub_grid(plan.grid, 0, r0, plan.grid.width, r1 - r0);
          terrain::ReliefImage img =
              terrain::render_relief_window(plan.dem_path, g, plan.read_options, plan.params);
          cairo_save(cr.get());
          cairo_rectangle(cr.get(), map.min_x, map.min_y, map.width(), map.height());
          cairo_clip(cr.get());
          paint_argb(cr.get(), img, {plan.origin_mm.x, plan.origin_mm.y + r0 * plan.px_mm},
                     plan.px_mm);
          cairo_restore(cr.get());
        }
        cairo_set_source_surface(cr.get(), comp.surface.get(), 0, 0);
        cairo_paint(cr.get());
        check_cairo(cairo_status(cr.get()), "drawing the PNG band");
      }
      cairo_surface_flush(band.get());
      const unsigned char* data = cairo_image_surface_get_data(band.get());
      const int stride = cairo_image_surface_get_stride(band.get());
      for (int r = 0; r < rows; ++r) {
        const auto* px = reinterpret_cast<const std::uint32_t*>(data + r * stride);
        for (int x = 0; x < w; ++x) {
          row[3 * x] = static_cast<std::uint8_t>((px[x] >> 16) & 255);
          row[3 * x + 1] = static_cast<std::uint8_t>((px[x] >> 8) & 255);
          row[3 * x + 2] = static_cast<std::uint8_t>(px[x] & 255);
        }
        png.write_row(row.data());
      }
    }
    png.finish();
  }
  out.commit();
}

}  // namespace

ExhibitReport render_exhibit(const ExhibitProject& project, const std::filesystem::path& output,
                             const ExhibitOptions& options) {
  const auto start = std::chrono::steady_clock::now();
  ExhibitReport rep;
  rep.output = output;
  // Read: the DEM's footprint, once, for the frame's growth and the inset. A DEM that does not
  // open is reported by the relief reader with its own message.
  std::vector<Point> terrain_ground;
  try {
    terrain_ground = sheet::dem_footprint(project.relief.dem, project.relief.dem_crs, project.crs);
  } catch (const Error&) {
    terrain_ground.clear();
  }
  rep.layout = compute_exhibit_layout(project, terrain_ground);
  rep.ramp = ramp_for(project, rep.layout.frame);
  const double dpi = options.format == ExhibitFormat::png
                         ? options.png_dpi
                         : options.relief_dpi.value_or(project.relief.dpi);
  ReliefPlan plan = plan_relief(project, rep.layout.frame, rep.ramp, dpi, options.max_strip_pixels);
  rep.relief_strips = static_cast<int>(plan.strips.size());
  rep.relief_width_px = plan.grid.width;
  rep.relief_height_px = plan.grid.height;
  Composition comp;
  if (options.format == ExhibitFormat::pdf) {
    comp = write_pdf(project, rep.layout, plan, rep.ramp, terrain_ground, output);
  } else {
    Recording r = record(project, rep.layout, rep.ramp, terrain_ground);
    write_png(rep.layout, plan, r, output, options.png_dpi, options.max_strip_pixels);
    comp = r.comp;
  }
  rep.colour_bar = comp.colour_bar;
  rep.callouts_forced = comp.callouts.placed_forced;
  rep.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  return rep;
}

}  // namespace sheetmill::exhibit
