#include "render/contour_layer.hpp"

#include <algorithm>

#include "render/relief_layer.hpp"
#include "sheetmill/contours/contour_labels.hpp"
#include "sheetmill/contours/contour_layer.hpp"
#include "sheetmill/contours/generate.hpp"
#include "sheetmill/contours/ground_plane.hpp"
#include "sheetmill/contours/spot_heights.hpp"
#include "sheetmill/contours/water_clip.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/terrain/dem_source.hpp"

namespace sheetmill::render {

namespace {

// The DEM's cell on the ground: a Web Mercator cell of 3710 m is about 2434 m at 49 degrees, so
// its CRS units would make the contour grid a third too coarse. Rotated grids (which DemSource
// does not read) keep terrain's measure.
double native_ground_cell_m(const project::Project& project) {
  const terrain::DemReadOptions options = dem_options(project);
  try {
    return contours::ground_cell_m(terrain::DemSource(project.elevation.dem, options).grid());
  } catch (const Error&) {
    return terrain::native_cell_m(project.elevation.dem, options);
  }
}

// Contours come from a grid at about the DEM's own resolution on the ground: finer adds nothing
// but vertices, and a line 0.1 mm apart on paper is the finest a pen can separate.
RasterGrid contour_grid(const project::Project& project, const MapFrame& frame) {
  double native = native_ground_cell_m(project);
  double finest = 0.1 * frame.metres_per_mm();
  double cell = std::max(native, finest);
  double dpi = kMmPerInch / (cell * frame.mm_per_metre());
  return grid_for_frame(frame, dpi, 3);
}

}  // namespace

SheetContours build_contours(const project::Project& project, const style::Style& style,
                             const MapFrame& frame, const std::vector<std::vector<Polyline>>& water,
                             text::FontCache& fonts) {
  SheetContours out;
  const style::ContourStyle& cs = style.contours;
  contours::ContourParams params;
  params.index_every = cs.index_every;
  params.base_m = project.contours.base_m;
  params.scale_denominator = frame.scale_denominator;
  params.smoothing_mm = cs.smoothing_mm;
  params.min_loop_mm = cs.min_loop_mm;
  params.supplementary = cs.supplementary.has_value();
  params.supplementary_max_slope_deg = cs.supplementary_max_slope_deg;
  params.sea_level_m = project.elevation.sea_level_m;

  bool have_dem = !project.elevation.dem.empty();
  if (have_dem) {
    out.unit = contours::height_unit(
        terrain::vertical_unit_m(project.elevation.dem, dem_options(project)));
    out.dem = terrain::read_dem_window(project.elevation.dem, contour_grid(project, frame),
                                       dem_options(project));
  }
  if (project.contours.interval_m) {
    params.interval_m = *project.contours.interval_m;
  } else if (cs.interval_m) {
    params.interval_m = *cs.interval_m;
  } else if (have_dem && out.dem.valid_count() > 0) {
    auto [lo, hi] = contours::elevation_range(out.dem);
    params.interval_m =
        contours::propose_interval_m(frame.scale_denominator, hi - lo, out.unit.metres);
    log::info("contour interval {:g} {} proposed from the scale and {:.0f} m of relief",
              params.interval_m / out.unit.metres, out.unit.symbol, hi - lo);
  } else {
    return out;
  }
  out.interval_m = params.interval_m;

  const bool dem_has_data = have_dem && out.dem.valid_count() > 0;
  if (project.contours.from_layer) {
    const project::Source& src = *project.contours.from_layer;
    out.lines = contours::read_layer(src.path, src.layer, project.contours.elevation_field,
                                     frame.ground.expanded(frame.metres_per_mm() * 5),
                                     frame.crs_wkt, params, dem_has_data ? &out.dem : nullptr);
  } else if (dem_has_data) {
    out.lines = contours::generate(out.dem, params);
  } else {
    return out;
  }
  // Contours do not cross a lake surface.
  contours::clip_out_polygons(out.lines, water);
  if (!dem_has_data) return out;
  out.labels = contours::label_candidates(out.lines, out.dem, frame, cs, fonts, out.unit.metres);
  out.spots = contours::find_summits(out.dem, cs.spot_min_prominence_m);
  // The window reaches a few cells past the frame: a summit there is off the sheet.
  std::erase_if(out.spots,
                [&](const contours::SpotHeight& s) { return !frame.ground.contains(s.ground); });
  for (auto& c : contours::spot_label_candidates(out.spots, frame, cs, fonts, out.unit.metres)) {
    out.labels.push_back(std::move(c));
  }
  return out;
}

}  // namespace sheetmill::render
