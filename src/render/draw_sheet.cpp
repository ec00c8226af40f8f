// Phase 4, draw: the prepared sheet and its placed labels onto the canvas, bottom to top
// (render/phases.hpp). Takes values only: nothing here opens a file or a dataset (the relief
// layer's DEM windows are read by the terrain stage; tests/render/no_open_in_draw_test.cpp).

#include <chrono>

#include "render/relief_layer.hpp"
#include "sheetmill/contours/draw_contours.hpp"
#include "sheetmill/render/draw_order.hpp"
#include "sheetmill/render/phases.hpp"
#include "sheetmill/sheet/collar.hpp"
#include "sheetmill/sheet/grid.hpp"

namespace sheetmill::render {

DrawReport draw(pdf::LayeredCanvas& canvas, const SheetInputs& inputs, const PreparedSheet& sheet,
                const Placement& placement) {
  const project::Project& project = *inputs.project;
  const style::Style& style = *inputs.style;
  const MapFrame& frame = sheet.layout.frame;
  DrawReport report;
  // The style's layers with relief and contours at their places in its order (by default area
  // fills, relief, water areas, contours, water lines, transport, buildings), then names, grid
  // and collar. Each layer keeps its own optional content group.
  std::vector<const style::Layer*> drawn_layers;
  for (const PreparedLayer& l : sheet.layers.layers) drawn_layers.push_back(l.layer);
  for (const DrawStep& step :
       draw_sequence(drawn_layers, style.relief.order, style.contours.order)) {
    if (step.kind == DrawStep::Kind::relief) {
      // Multiply: relief over area fills only darkens them, never hides them.
      const auto t0 = std::chrono::steady_clock::now();
      const ReliefDrawn relief = draw_relief(canvas, "relief", pdf::Blend::multiply, project, style,
                                             frame, sheet.contours.interval_m);
      report.relief_drawn = relief.any_data;
      report.strip_seconds = relief.strip_seconds;
      report.seconds_relief =
          std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    } else if (step.kind == DrawStep::Kind::contours) {
      cairo_t* cr = canvas.begin_group("contours");
      cairo_save(cr);
      clip_to_neatline(cr, frame);
      contours::draw_contours(cr, sheet.contours.lines, placement.contour_labels, frame,
                              style.contours);
      contours::draw_spot_heights(cr, sheet.contours.spots, frame, style.contours);
      labels::draw_placed(cr, placement.contour_labels);
      cairo_restore(cr);
      canvas.end_group();
    } else {
      draw_feature_layer(canvas, sheet.layers.layers[step.layer], sheet.layers.clip_page_mm);
    }
  }

  labels::draw_placed(canvas.begin_group("names"), placement.names);
  canvas.end_group();
  sheet::draw_neatline_and_grid(canvas.begin_group("grid"), sheet.layout, style, *inputs.fonts);
  canvas.end_group();
  sheet::draw_collar(canvas.begin_group("collar"), sheet.layout, project, style, sheet.info,
                     sheet.features.legend_rules, *inputs.fonts);
  canvas.end_group();
  return report;
}

}  // namespace sheetmill::render
