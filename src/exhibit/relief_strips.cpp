#include "sheetmill/exhibit/relief_strips.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

#include "sheetmill/core/error.hpp"

namespace sheetmill::exhibit {

namespace {
terrain::DemReadOptions read_options_for(const ExhibitProject& project) {
  terrain::DemReadOptions o;
  o.assumed_crs = project.relief.dem_crs;
  return o;
}
}  // namespace

ReliefPlan plan_relief(const ExhibitProject& project, const MapFrame& frame,
                       const terrain::TintRamp& ramp, double dpi, long max_strip_pixels) {
  ReliefPlan plan;
  plan.grid = grid_for_frame(frame, dpi, 0);
  plan.dem_path = project.relief.dem;
  plan.read_options = read_options_for(project);
  terrain::ReliefParams& p = plan.params;
  p.shade = project.relief.shade_strength > 0;
  // Mark (1992) multidirectional oblique weighting: no single light direction to hide
  // features that run along it, which suits a sheet read by many people from many angles.
  p.shading.method = terrain::ShadeMethod::multidirectional;
  p.shading.altitude_deg = project.relief.altitude_deg;
  p.shading.exaggeration = project.relief.exaggeration;
  p.shade_strength = project.relief.shade_strength;
  p.tint = true;
  p.ramp = ramp;
  p.tint_strength = 1;
  const int rows_per_strip = static_cast<int>(std::clamp<long>(
      max_strip_pixels / std::max(1, plan.grid.width), 1, std::numeric_limits<int>::max()));
  for (int row0 = 0; row0 < plan.grid.height; row0 += rows_per_strip) {
    plan.strips.push_back({row0, std::min(rows_per_strip, plan.grid.height - row0)});
  }
  plan.px_mm = plan.grid.cell_x() * frame.mm_per_metre();
  plan.origin_mm = frame.to_page({plan.grid.geotransform[0], plan.grid.geotransform[3]});
  return plan;
}

terrain::ReliefImage render_strip_argb(const ReliefPlan& plan, std::size_t index) {
  if (index >= plan.strips.size()) throw_internal_error("relief strip index out of range");
  const ReliefStrip& s = plan.strips[index];
  RasterGrid g = terrain::sub_grid(plan.grid, 0, s.row0, plan.grid.width, s.rows);
  return terrain::render_relief_window(plan.dem_path, g, plan.read_options, plan.params);
}

std::vector<std::uint8_t> render_strip_rgb(const ReliefPlan& plan, std::size_t index) {
  terrain::ReliefImage img = render_strip_argb(plan, index);
  std::vector<std::uint8_t> rgb(img.argb.size() * 3);
  // Premultiplied ARGB over white paper: c + (1 - a) * 255.
  for (std::size_t i = 0; i < img.argb.size(); ++i) {
    const std::uint32_t p = img.argb[i];
    const std::uint32_t inv = 255 - (p >> 24);
    rgb[3 * i] = static_cast<std::uint8_t>(std::min<std::uint32_t>(255, ((p >> 16) & 255) + inv));
    rgb[3 * i + 1] =
        static_cast<std::uint8_t>(std::min<std::uint32_t>(255, ((p >> 8) & 255) + inv));
    rgb[3 * i + 2] = static_cast<std::uint8_t>(std::min<std::uint32_t>(255, (p & 255) + inv));
  }
  return rgb;
}

std::pair<double, double> elevation_range(const ExhibitProject& project, const MapFrame& frame) {
  RasterGrid g;
  const double cell = std::max(frame.ground.width(), frame.ground.height()) / 512.0;
  g.width = std::max(1, static_cast<int>(std::ceil(frame.ground.width() / cell)));
  g.height = std::max(1, static_cast<int>(std::ceil(frame.ground.height() / cell)));
  g.geotransform[0] = frame.ground.min_x;
  g.geotransform[1] = cell;
  g.geotransform[3] = frame.ground.max_y;
  g.geotransform[5] = -cell;
  g.crs_wkt = frame.crs_wkt;
  terrain::Dem dem = terrain::read_dem_window(project.relief.dem, g, read_options_for(project));
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  for (float z : dem.z) {
    if (std::isnan(z)) continue;
    lo = std::min(lo, static_cast<double>(z));
    hi = std::max(hi, static_cast<double>(z));
  }
  if (!(hi >= lo)) {
    throw_input_error(project.relief.dem, "no elevation data under the exhibit's map frame");
  }
  return {lo, hi};
}

}  // namespace sheetmill::exhibit
