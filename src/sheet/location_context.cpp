// What the location diagram shows around a sheet besides the tile index: the DEM's footprint
// and graticule lines, in the sheet CRS's ground coordinates, over an area a few sheets wide.
#include "sheet/location_context.hpp"

#include <fmt/format.h>

#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/sheet/dem_footprint.hpp"
#include "sheetmill/sheet/dms.hpp"
#include "sheetmill/sheet/nice_numbers.hpp"

namespace sheetmill::sheet {

namespace {

constexpr int kEdgeSteps = 32;  // points per edge: DEM edges curve in another CRS

}  // namespace

Box location_area(const Box& sheet_ground) {
  double half = kLocationContext / 2 * std::max(sheet_ground.width(), sheet_ground.height());
  Point c = sheet_ground.centre();
  return Box::of(c.x - half, c.y - half, c.x + half, c.y + half);
}

std::vector<Point> dem_footprint(const project::Project& project) {
  const auto& el = project.elevation;
  if (el.dem.empty()) return {};
  return dem_footprint(el.dem, el.crs, project.crs);
}

std::vector<Point> dem_footprint(const std::string& dem, const std::optional<std::string>& dem_crs,
                                 const std::string& sheet_crs) {
  DatasetPtr ds = open_raster(dem);
  double gt[6];
  if (ds->GetGeoTransform(gt) != CE_None) return {};
  std::string from;
  if (const OGRSpatialReference* srs = ds->GetSpatialRef()) {
    char* wkt = nullptr;
    srs->exportToWkt(&wkt);
    from = wkt ? wkt : "";
    CPLFree(wkt);
  }
  if (from.empty() && dem_crs) from = *dem_crs;
  if (from.empty()) return {};
  Reprojector to_sheet(from, sheet_crs);
  const double w = ds->GetRasterXSize(), h = ds->GetRasterYSize();
  auto pixel = [&](double col, double row) {
    return Point{gt[0] + col * gt[1] + row * gt[2], gt[3] + col * gt[4] + row * gt[5]};
  };
  std::vector<Point> ring;
  const Point corners[] = {{0, 0}, {w, 0}, {w, h}, {0, h}, {0, 0}};
  for (int e = 0; e < 4; ++e) {
    for (int i = 0; i < kEdgeSteps; ++i) {
      Point cr = corners[e] + (corners[e + 1] - corners[e]) * (double(i) / kEdgeSteps);
      try {
        ring.push_back(to_sheet.forward(pixel(cr.x, cr.y)));
      } catch (const Error&) {
        // Outside the sheet projection's domain: that piece of the edge is left out.
      }
    }
  }
  return ring;
}

LocationGraticule location_graticule(const SheetCrs& crs, const Box& area, double area_mm) {
  LocationGraticule g;
  // The area's extent in latitude and longitude, from its edges.
  Box ll;
  for (int i = 0; i <= kEdgeSteps; ++i) {
    double t = double(i) / kEdgeSteps;
    for (Point p : {Point{area.min_x + t * area.width(), area.min_y},
                    Point{area.min_x + t * area.width(), area.max_y},
                    Point{area.min_x, area.min_y + t * area.height()},
                    Point{area.max_x, area.min_y + t * area.height()}}) {
      try {
        ll.add(crs.to_lonlat(p));
      } catch (const Error&) {
      }
    }
  }
  if (ll.empty()) return g;
  // About three lines across the diagram: a step whose length on the diagram is a quarter of it.
  double mm_per_arcsec = area_mm / (ll.height() * 3600);
  g.step_arcsec = graticule_step_arcsec(mm_per_arcsec, area_mm / 4);
  double step = g.step_arcsec / 3600;
  auto line = [&](Point a, Point b) {
    Polyline out;
    for (int i = 0; i <= kEdgeSteps; ++i) {
      try {
        out.push_back(crs.to_ground(a + (b - a) * (double(i) / kEdgeSteps)));
      } catch (const Error&) {
      }
    }
    if (out.size() >= 2) g.lines.push_back(std::move(out));
  };
  for (double lat = std::ceil(ll.min_y / step) * step; lat <= ll.max_y; lat += step)
    line({ll.min_x, lat}, {ll.max_x, lat});
  for (double lon = std::ceil(ll.min_x / step) * step; lon <= ll.max_x; lon += step)
    line({lon, ll.min_y}, {lon, ll.max_y});
  return g;
}

std::string location_caption(const SheetCrs& crs, const Box& sheet_ground, double step_arcsec,
                             bool has_index, bool has_dem) {
  Point c = crs.to_lonlat(sheet_ground.centre());
  std::string shown = has_index ? "index sheets" : "";
  if (has_dem) shown += std::string(shown.empty() ? "" : ", ") + "DEM coverage shaded";
  double res = step_arcsec >= 3600 ? 60 : 1;
  return fmt::format("Centre {} {}{}{}; graticule every {}",
                     format_dms(c.y, AngleKind::latitude, res),
                     format_dms(c.x, AngleKind::longitude, res), shown.empty() ? "" : "; ", shown,
                     format_dms(step_arcsec / 3600, AngleKind::plain, step_arcsec >= 60 ? 60 : 1));
}

}  // namespace sheetmill::sheet
