#include "sheetmill/render/check_project.hpp"

#include <fmt/format.h>

#include <algorithm>

#include "render/relief_layer.hpp"
#include "sheetmill/contours/generate.hpp"
#include "sheetmill/contours/spot_heights.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/plural.hpp"
#include "sheetmill/features/reader.hpp"
#include "sheetmill/render/feature_layers.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::render {

namespace {

// The DEM is read at about 1 mm on paper: enough for the elevation range and the coverage,
// cheap on any sheet size.
constexpr double kCheckDpi = 25.4;

void check_elevation(const project::Project& project, const style::Style& style,
                     const MapFrame& frame, ProjectCheck& out) {
  const terrain::DemReadOptions options = dem_options(project);
  const contours::HeightUnit unit =
      project.elevation.dem.empty()
          ? contours::HeightUnit{}
          : contours::height_unit(terrain::vertical_unit_m(project.elevation.dem, options));
  out.height_unit = unit.symbol;
  if (project.contours.interval_m) {
    out.interval = *project.contours.interval_m / unit.metres;
    out.interval_from = "the project";
  } else if (style.contours.interval_m) {
    out.interval = *style.contours.interval_m / unit.metres;
    out.interval_from = "the style";
  }
  if (project.elevation.dem.empty()) return;
  out.dem = project.elevation.dem;
  out.dem_cell_m = terrain::native_cell_m(project.elevation.dem, options);
  terrain::Dem dem =
      terrain::read_dem_window(project.elevation.dem, grid_for_frame(frame, kCheckDpi), options);
  out.dem_coverage =
      dem.z.empty() ? 0.0
                    : static_cast<double>(dem.valid_count()) / static_cast<double>(dem.z.size());
  if (dem.valid_count() == 0) return;
  auto [lo, hi] = contours::elevation_range(dem);
  out.min_height = lo / unit.metres;
  out.max_height = hi / unit.metres;
  if (out.interval_from.empty()) {
    out.interval =
        contours::propose_interval_m(frame.scale_denominator, hi - lo, unit.metres) / unit.metres;
    out.interval_from = "proposed from the scale and the relief";
  }
}

void check_layers(const project::Project& project, const style::Style& style, const MapFrame& frame,
                  ProjectCheck& out) {
  const Box clip = frame.ground.expanded(kClipMarginMm * frame.metres_per_mm());
  for (const style::Layer& layer : style.layers) {
    LayerCheck c;
    c.layer = layer.id;
    c.source = layer.source;
    c.visible = layer_visible(layer, frame.scale_denominator);
    if (!c.visible) {
      out.layers.push_back(c);
      continue;
    }
    if (project.sources.find(layer.source) == project.sources.end() &&
        project.vector_data.empty()) {
      c.found = false;
      c.required = false;
      c.problem = "the project maps no source '" + layer.source + "'";
      out.layers.push_back(c);
      continue;
    }
    project::Source source = project::source_for(project, layer.source);
    c.required = source.required;
    // Read as optional so that every missing source is listed, then report the first
    // required one exactly as render would.
    project::Source probe = source;
    probe.required = true;
    try {
      features::ReadRequest request{frame.crs_wkt, clip, {}};
      features::read_features(probe, request, [&c](const features::Feature&) { ++c.features; });
    } catch (const Error& e) {
      if (e.kind() != Error::Kind::input) throw;
      c.found = false;
      c.problem = e.message();
      if (c.required && !out.first_error) out.first_error = e;
    }
    out.layers.push_back(c);
  }
}

std::string grouped(double v) {
  std::string s = fmt::format("{:.0f}", v);
  const bool negative = !s.empty() && s[0] == '-';
  std::string digits = negative ? s.substr(1) : s;
  for (int i = static_cast<int>(digits.size()) - 3; i > 0; i -= 3) digits.insert(i, " ");
  return (negative ? "-" : "") + digits;
}

}  // namespace

ProjectCheck check_project(const project::Project& project, const style::Style& style,
                           const std::optional<std::string>& sheet_id) {
  ProjectCheck out;
  out.title = project.title;
  out.style_name = style.name;
  sheet::Layout layout = sheet::compute_layout(project, style, sheet_id);
  const MapFrame& frame = layout.frame;
  out.scale_denominator = frame.scale_denominator;
  out.paper =
      fmt::format("{}, {:.0f} x {:.0f} mm", project.paper.name, layout.page_w_mm, layout.page_h_mm);
  out.frame_w_mm = frame.width_mm();
  out.frame_h_mm = frame.height_mm();
  out.ground = frame.ground;
  out.crs_name = frame.crs_name;
  out.epsg = frame.epsg;
  if (project.tile_index) {
    out.index_sheets =
        static_cast<long>(sheet::read_tile_index(*project.tile_index, project.crs).sheets.size());
  }
  check_elevation(project, style, frame, out);
  check_layers(project, style, frame, out);
  return out;
}

std::string describe_check(const ProjectCheck& c) {
  std::string s;
  s += fmt::format("project: {}\n", c.title);
  s += fmt::format("style: {}\n", c.style_name.empty() ? "(unnamed)" : c.style_name);
  s += fmt::format("scale: 1:{}\n", grouped(c.scale_denominator));
  s += fmt::format("paper: {}\n", c.paper);
  s += fmt::format("frame: {:.1f} x {:.1f} mm, {:.2f} x {:.2f} km on the ground\n", c.frame_w_mm,
                   c.frame_h_mm, c.ground.width() / 1000, c.ground.height() / 1000);
  s += fmt::format("extent: {:.0f}, {:.0f} to {:.0f}, {:.0f}\n", c.ground.min_x, c.ground.min_y,
                   c.ground.max_x, c.ground.max_y);
  s += fmt::format("crs: {}{}\n", c.crs_name, c.epsg ? fmt::format(" (EPSG:{})", c.epsg) : "");
  if (c.dem.empty()) {
    s += "elevation: none (the project names no DEM: no relief, no contours from one)\n";
  } else {
    s += fmt::format("elevation: {}, cells of {:.1f} m, {:.1f} % of the frame covered", c.dem,
                     c.dem_cell_m, c.dem_coverage * 100);
    if (c.dem_coverage > 0) {
      s += fmt::format(", heights {:.0f} to {:.0f} {}", c.min_height, c.max_height, c.height_unit);
    }
    s += "\n";
  }
  if (c.interval > 0) {
    s +=
        fmt::format("contour interval: {:g} {} ({})\n", c.interval, c.height_unit, c.interval_from);
  } else {
    s += c.dem.empty() ? "contour interval: none\n"
                       : "contour interval: none (no DEM data under the frame)\n";
  }
  if (c.index_sheets) s += fmt::format("tile index: {}\n", counted(*c.index_sheets, "sheet"));
  long shown = 0, missing = 0;
  for (const auto& l : c.layers) shown += l.visible;
  s += fmt::format("layers: {} in the style, {} drawn at this scale\n", c.layers.size(), shown);
  for (const auto& l : c.layers) {
    if (!l.visible) {
      s += fmt::format("  {:<16} not drawn at 1:{}\n", l.layer, grouped(c.scale_denominator));
    } else if (!l.found) {
      ++missing;
      s += fmt::format("  {:<16} MISSING{}: {}\n", l.layer, l.required ? "" : " (optional)",
                       l.problem);
    } else {
      s += fmt::format("  {:<16} {} from source '{}'\n", l.layer, counted(l.features, "feature"),
                       l.source);
    }
  }
  s += missing == 0 ? "missing sources: none\n" : fmt::format("missing sources: {}\n", missing);
  return s;
}

}  // namespace sheetmill::render
