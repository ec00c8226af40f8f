#include <chrono>
#include <optional>

#include "render/accuracy_notes.hpp"
#include "render/contour_layer.hpp"
#include "render/coverage.hpp"
#include "render/print_options.hpp"
#include "render/relief_layer.hpp"
#include "sheetmill/contours/draw_contours.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "sheetmill/render/draw_order.hpp"
#include "sheetmill/render/feature_layers.hpp"
#include "sheetmill/render/render.hpp"
#include "sheetmill/sheet/collar.hpp"
#include "sheetmill/sheet/grid.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "sheetmill/text/collision_index.hpp"

namespace sheetmill::render {

namespace {

using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point t0) {
  return std::chrono::duration<double>(Clock::now() - t0).count();
}

pdf::GeoRegistration registration(const MapFrame& frame) {
  pdf::GeoRegistration geo;
  geo.frame_page_mm = frame.page_box_mm();
  std::vector<Point> ring = frame.neatline;
  if (ring.size() < 3) {
    const Box& g = frame.ground;
    ring = {{g.min_x, g.min_y}, {g.max_x, g.min_y}, {g.max_x, g.max_y}, {g.min_x, g.max_y}};
  }
  for (const Point& p : ring) {
    geo.neatline_ground.push_back(p);
    geo.neatline_page_mm.push_back(frame.to_page(p));
  }
  geo.crs_wkt = frame.crs_wkt;
  geo.epsg = frame.epsg;
  return geo;
}

// What the legend lists besides the style's rules: the contour kinds and spot heights drawn,
// and the grid and graticule (draw_neatline_and_grid draws both with its default options).
sheet::SheetContents shown_on_sheet(const SheetContours& c) {
  sheet::SheetContents shown;
  for (const auto& l : c.lines) {
    using K = sheet::ContourKind;
    shown.add(l.supplementary ? K::supplementary
              : l.depression  ? K::depression
              : l.index       ? K::index
                              : K::ordinary);
  }
  for (const auto& s : c.spots) {
    if (s.kind == contours::SpotHeight::Kind::control)
      shown.benchmarks = true;
    else
      shown.spot_heights = true;
  }
  shown.grid = true;
  shown.graticule = sheet::GridOptions{}.graticule;
  return shown;
}

}  // namespace

RenderReport render_sheet(const project::Project& project, const style::Style& style,
                          const std::filesystem::path& output, const RenderOptions& options) {
  gdal_init();
  const auto t_start = Clock::now();
  const LinkPolicy links =
      options.write_through_link ? LinkPolicy::write_through : LinkPolicy::refuse;
  // Before any data is read: a missing or read-only folder, or a device at the target, is
  // found in milliseconds, not after the whole sheet.
  check_output_target(output, links);
  RenderReport report;
  report.output = output;
  log::WarningCollector warnings;
  std::optional<text::FontCache> own_fonts;
  text::FontCache& fonts = options.fonts ? *options.fonts : own_fonts.emplace();
  // Both the layout and the diagrams need the index: read it once (or take the batch's).
  std::optional<sheet::TileIndexContents> own_index;
  const sheet::TileIndexContents* tile_index = options.tile_index;
  if (!tile_index && (options.sheet_id || project.extent.sheet_id) && project.tile_index) {
    tile_index = &own_index.emplace(sheet::read_tile_index(*project.tile_index, project.crs));
  }

  // Prepare: where the frame lies on the paper and on the ground.
  sheet::Layout layout = sheet::compute_layout(project, style, options.sheet_id, tile_index);
  const MapFrame& frame = layout.frame;
  pdf::LayeredCanvas canvas(layout.page_w_mm, layout.page_h_mm);

  // Read and prepare the features first: names and contour labels are placed together, and
  // contours need the lakes they must not cross.
  auto t0 = Clock::now();
  PreparedLayers prepared;
  FeatureLayersResult features = prepare_feature_layers(project, style, frame, fonts, prepared);
  report.layers = features.reports;
  report.seconds_features = seconds_since(t0);

  t0 = Clock::now();
  SheetContours sheet_contours =
      build_contours(project, style, frame, features.water_polygons_ground, fonts);
  report.seconds_contours = seconds_since(t0);
  // Once per sheet, for the frame itself (relief and contours read the DEM silently).
  if (!project.elevation.dem.empty())
    warn_frame_coverage(project.elevation.dem, frame_coverage(sheet_contours.dem, frame));

  // Place every label on the sheet against one collision index.
  t0 = Clock::now();
  text::CollisionIndex index(Box::of(0, 0, layout.page_w_mm, layout.page_h_mm));
  index.set_bounds(frame.page_box_mm());
  index.insert_all(features.obstacles);
  for (const Box& b : sheet::grid_labels_in_frame(layout, style, fonts))
    index.insert(text::box_quad(b));
  std::vector<labels::Candidate> candidates = std::move(features.name_candidates);
  const std::size_t first_contour_label = candidates.size();
  for (auto& c : sheet_contours.labels) candidates.push_back(std::move(c));
  auto counts = labels::place(candidates, index);
  for (auto& layer : report.layers) {
    auto it = counts.find(layer.layer);
    if (it == counts.end()) continue;
    layer.labels_placed = it->second.placed;
    layer.labels_dropped = it->second.dropped;
  }
  for (const auto& [layer, count] : counts) {
    log::debug("labels {}: {} placed, {} dropped", layer, count.placed, count.dropped);
  }
  std::vector<labels::Candidate> contour_labels(
      std::make_move_iterator(candidates.begin() + first_contour_label),
      std::make_move_iterator(candidates.end()));
  candidates.resize(first_contour_label);
  report.seconds_labels = seconds_since(t0);

  // Draw, bottom to top: the style's layers with relief and contours at their places in its
  // order (by default area fills, relief, water areas, contours, water lines, transport,
  // buildings), then names, grid and collar. Each layer keeps its own optional content group.
  std::vector<const style::Layer*> drawn_layers;
  for (const PreparedLayer& l : prepared.layers) drawn_layers.push_back(l.layer);
  for (const DrawStep& step :
       draw_sequence(drawn_layers, style.relief.order, style.contours.order)) {
    if (step.kind == DrawStep::Kind::relief) {
      // Multiply: relief over area fills only darkens them, never hides them.
      t0 = Clock::now();
      if (!draw_relief(canvas.begin_group("relief", pdf::Blend::multiply), project, style, frame,
                       sheet_contours.interval_m)) {
        report.warnings.push_back("no relief under the map frame");
      }
      canvas.end_group();
      report.seconds_relief = seconds_since(t0);
    } else if (step.kind == DrawStep::Kind::contours) {
      cairo_t* cr = canvas.begin_group("contours");
      cairo_save(cr);
      clip_to_neatline(cr, frame);
      contours::draw_contours(cr, sheet_contours.lines, contour_labels, frame, style.contours);
      contours::draw_spot_heights(cr, sheet_contours.spots, frame, style.contours);
      labels::draw_placed(cr, contour_labels);
      cairo_restore(cr);
      canvas.end_group();
    } else {
      draw_feature_layer(canvas, prepared.layers[step.layer], prepared.clip_page_mm);
    }
  }

  cairo_t* cr = canvas.begin_group("names");
  labels::draw_placed(cr, candidates);
  canvas.end_group();

  sheet::SheetInfo info = sheet::describe_sheet(project, layout, tile_index);
  info.contour_interval_m = sheet_contours.interval_m;
  info.height_unit_m = sheet_contours.unit.metres;
  info.height_unit_symbol = sheet_contours.unit.symbol;
  info.height_unit_name = sheet_contours.unit.name;
  info.accuracy_notes = accuracy_notes(project, sheet_contours.interval_m);
  info.shown = shown_on_sheet(sheet_contours);
  sheet::draw_neatline_and_grid(canvas.begin_group("grid"), layout, style, fonts);
  canvas.end_group();
  sheet::draw_collar(canvas.begin_group("collar"), layout, project, style, info,
                     features.legend_rules, fonts);
  canvas.end_group();

  // Finish: the file appears whole or not at all.
  t0 = Clock::now();
  AtomicOutput out(output, links);
  const std::string shown = output.string();
  if (options.format == OutputFormat::png) {
    canvas.finish_png(out.temp_path(), options.raster_dpi, shown);
  } else if (options.format == OutputFormat::geotiff) {
    canvas.finish_geotiff(out.temp_path(), options.raster_dpi, registration(frame), shown);
  } else {
    pdf::Metadata meta;
    meta.title = project.title;
    meta.subject = project.subtitle.empty() ? "Topographic sheet" : project.subtitle;
    meta.keywords = "topographic map; contours; " + frame.crs_name;
    meta.author = project.producer;
    if (options.print_profile) {
      TempFile screen(sibling_temp_path(output, "screen"), shown);
      canvas.finish_pdf(screen.path(), registration(frame), meta, shown);
      print::write_pdfx(screen.path(), out.temp_path(), pdfx_options(style, *options.print_profile),
                        shown);
    } else {
      canvas.finish_pdf(out.temp_path(), registration(frame), meta, shown);
    }
  }
  out.commit();
  report.seconds_finish = seconds_since(t0);
  report.seconds_total = seconds_since(t_start);
  report.warnings.insert(report.warnings.end(), warnings.warnings().begin(),
                         warnings.warnings().end());
  return report;
}

}  // namespace sheetmill::render
