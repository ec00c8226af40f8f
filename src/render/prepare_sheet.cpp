// Phase 2, prepare: the frame on the paper, the features and contours in page geometry, the
// collar's facts (render/phases.hpp).

#include <chrono>

#include "render/accuracy_notes.hpp"
#include "render/contour_layer.hpp"
#include "render/coverage.hpp"
#include "sheetmill/render/phases.hpp"
#include "sheetmill/sheet/grid.hpp"

namespace sheetmill::render {

namespace {

using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point t0) {
  return std::chrono::duration<double>(Clock::now() - t0).count();
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

PreparedSheet prepare(const SheetInputs& inputs) {
  const project::Project& project = *inputs.project;
  const style::Style& style = *inputs.style;
  text::FontCache& fonts = *inputs.fonts;
  PreparedSheet sheet;
  sheet.layout = sheet::compute_layout(project, style, inputs.sheet_id, inputs.tile_index);
  const MapFrame& frame = sheet.layout.frame;

  // Features first: names and contour labels are placed together, and contours need the lakes
  // they must not cross.
  auto t0 = Clock::now();
  sheet.features = prepare_feature_layers(project, style, frame, fonts, sheet.layers);
  sheet.seconds_features = seconds_since(t0);

  t0 = Clock::now();
  sheet.contours =
      build_contours(project, style, frame, sheet.features.water_polygons_ground, fonts);
  sheet.seconds_contours = seconds_since(t0);
  // Once per sheet, for the frame itself (relief and contours read the DEM silently).
  if (!project.elevation.dem.empty())
    warn_frame_coverage(project.elevation.dem, frame_coverage(sheet.contours.dem, frame));

  sheet.grid_labels = sheet::grid_labels_in_frame(sheet.layout, style, fonts);

  sheet.info =
      sheet::describe_sheet(project, sheet.layout, inputs.tile_index, inputs.magnetic_model);
  sheet.info.contour_interval_m = sheet.contours.interval_m;
  sheet.info.height_unit_m = sheet.contours.unit.metres;
  sheet.info.height_unit_symbol = sheet.contours.unit.symbol;
  sheet.info.height_unit_name = sheet.contours.unit.name;
  sheet.info.accuracy_notes = accuracy_notes(project, sheet.contours.interval_m);
  sheet.info.shown = shown_on_sheet(sheet.contours);
  return sheet;
}

}  // namespace sheetmill::render
