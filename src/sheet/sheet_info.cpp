#include "sheetmill/sheet/sheet_info.hpp"

#include <fmt/format.h>

#include <chrono>
#include <cmath>
#include <cstdio>
#include <optional>

#include "sheet/location_context.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/geomag/model.hpp"
#include "sheetmill/sheet/dms.hpp"
#include "sheetmill/sheet/nice_numbers.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"

namespace sheetmill::sheet {

namespace {

constexpr double kLocationDiagramMm = 30;  // about the location diagram's width in the panel

std::string today() {
  auto now = std::chrono::system_clock::now();
  std::chrono::year_month_day ymd{std::chrono::floor<std::chrono::days>(now)};
  char buf[16];
  std::snprintf(buf, sizeof buf, "%04d-%02u-%02u", static_cast<int>(ymd.year()),
                static_cast<unsigned>(ymd.month()), static_cast<unsigned>(ymd.day()));
  return buf;
}

void fill_north(NorthInfo& n, const project::Project& project, const SheetCrs& crs,
                const Layout& layout, const geomag::Model* loaded) {
  Point c = crs.to_lonlat(layout.frame.ground.centre());
  n.centre_lonlat = c;
  PointFactors f = crs.factors_at(c);
  n.grid_convergence_deg = f.grid_convergence_deg;
  n.scale_factor = f.scale_factor;
  const auto& mag = project.magnetic;
  n.date = mag.date.value_or(today());
  if (mag.declination_deg) {
    n.declination_deg = mag.declination_deg;
    n.annual_change_deg = mag.annual_change_deg;
    n.source = "stated in the project";
  } else if (mag.model_file) {
    std::optional<geomag::Model> own;
    const geomag::Model& model =
        loaded ? *loaded : own.emplace(geomag::Model::load(*mag.model_file));
    double year = 0;
    try {
      year = geomag::decimal_year(n.date);
    } catch (const Error& e) {
      throw_input_error(SourceLocation{project.file.string(), 0, 0, "magnetic.date"}, e.message());
    }
    // The sheet centre's latitude is on the CRS's own datum; the difference to WGS 84 (metres)
    // is far below what changes the declination at the diagram's precision.
    geomag::Field field;
    try {
      field = model.at(c.y, c.x, 0.0, year);
    } catch (const Error& e) {
      throw_input_error(SourceLocation{project.file.string(), 0, 0, "magnetic.date"}, e.message());
    }
    n.declination_deg = field.declination_deg;
    n.annual_change_deg = field.annual_change_deg;
    n.source = model.name();
  }
}

// The location diagram's outlines. A small index is drawn whole. A large one (a national series
// of thousands) would be a grey smear at diagram size and would cost every sheet time in
// proportion to the index, so it gets the sheets within a few sheet widths of this one, inside
// the outline of the whole index's extent.
void location_outlines(const TileIndexContents& index, const IndexSheet& sheet, SheetInfo& info) {
  if (index.sheets.size() <= kLocationWholeIndex) {
    for (const auto& o : index.sheets) info.index_outlines.push_back(o.outline);
    info.location_caption.clear();  // the diagram's caption names the index sheets
    return;
  }
  Box all;
  const Box near = Box::of(sheet.bounds.min_x - kLocationReach * sheet.bounds.width(),
                           sheet.bounds.min_y - kLocationReach * sheet.bounds.height(),
                           sheet.bounds.max_x + kLocationReach * sheet.bounds.width(),
                           sheet.bounds.max_y + kLocationReach * sheet.bounds.height());
  for (const auto& o : index.sheets) {
    all.add({o.bounds.min_x, o.bounds.min_y});
    all.add({o.bounds.max_x, o.bounds.max_y});
    if (o.bounds.intersects(near)) info.index_outlines.push_back(o.outline);
  }
  info.index_outlines.push_back({{all.min_x, all.min_y},
                                 {all.max_x, all.min_y},
                                 {all.max_x, all.max_y},
                                 {all.min_x, all.max_y}});
  info.location_caption =
      fmt::format("Nearby sheets, in the extent of all {}", index.sheets.size());
}

}  // namespace

SheetInfo describe_sheet(const project::Project& project, const Layout& layout,
                         const TileIndexContents* index, const geomag::Model* model) {
  SheetInfo info;
  SheetCrs crs = SheetCrs::resolve(project.crs, "crs");
  info.crs_name = crs.name();
  info.datum_name = crs.datum_name();
  info.projection_name = crs.projection_name();
  info.epsg = crs.epsg();
  info.grid_interval_m = grid_interval_m(layout.frame.scale_denominator);
  if (project.elevation.vertical_datum) info.vertical_datum = *project.elevation.vertical_datum;
  info.sea_level_m = project.elevation.sea_level_m;
  if (project.contours.interval_m) info.contour_interval_m = *project.contours.interval_m;
  const auto& vu = project.elevation.vertical_unit;
  info.scale_bar_units = project.scale_bars;
  // Heights in feet until the render states the DEM's own unit.
  if (vu && (*vu == "ft" || *vu == "us-ft")) {
    info.height_unit_m = *vu == "ft" ? kMetresPerFoot : kMetresPerUsSurveyFoot;
    info.height_unit_symbol = "ft";
    info.height_unit_name = "feet";
  }
  fill_north(info.north, project, crs, layout, model);

  // Read the index here when the caller did not (a single render); batch renders pass theirs.
  std::optional<TileIndexContents> own_index;
  if (!index && layout.index_sheet && project.tile_index) {
    own_index = read_tile_index(*project.tile_index, project.crs);
    index = &*own_index;
  }
  if (layout.index_sheet) {
    const IndexSheet& s = *layout.index_sheet;
    info.sheet_id = s.id;
    info.sheet_name = s.name;
    if (index) {
      Point c = s.bounds.centre();
      for (const IndexSheet* n : adjoining_sheets(*index, s)) {
        Point d = n->bounds.centre() - c;
        AdjoiningSheet a{n->id, n->name, 0, 0};
        if (std::abs(d.x) > 0.25 * s.bounds.width()) a.column = d.x > 0 ? 1 : -1;
        if (std::abs(d.y) > 0.25 * s.bounds.height()) a.row = d.y > 0 ? -1 : 1;
        if (a.column != 0 || a.row != 0) info.neighbours.push_back(a);
      }
      location_outlines(*index, s, info);
    }
  }
  // The location diagram: the sheet among its index sheets and over its DEM, five sheet sizes
  // across (whatever the scale), with parallels and meridians a reader can place.
  const Box& sheet_ground = layout.frame.ground;
  info.location_area = location_area(sheet_ground);
  info.dem_footprint = dem_footprint(project);
  auto graticule = location_graticule(crs, info.location_area, kLocationDiagramMm);
  info.location_graticule = std::move(graticule.lines);
  std::string index_caption = info.location_caption;
  info.location_caption =
      location_caption(crs, sheet_ground, graticule.step_arcsec, !info.index_outlines.empty(),
                       !info.dem_footprint.empty());
  if (!index_caption.empty()) info.location_caption = index_caption + ". " + info.location_caption;
  return info;
}

}  // namespace sheetmill::sheet
