#include "sheetmill/contours/ground_plane.hpp"

#include <ogr_spatialref.h>

#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"

namespace sheetmill::contours {

namespace {

struct Plane {
  CoordinateTransformPtr forward, back;
  double k_x = 1, k_y = 1;  // ground metres per CRS unit at the centre
};

// A transverse Mercator plane on the CRS's own geographic base, centred on the grid: scale factor
// 1 on its central meridian and k = 1 + x^2 / 2R^2 to first order at x from it (Snyder 1987,
// from memory), so lengths are true within 1e-4 up to 90 km east or west of the centre.
Plane make_plane(const RasterGrid& grid) {
  gdal_init();
  GdalErrorScope errors;
  OGRSpatialReference src;
  if (grid.crs_wkt.empty() || src.importFromWkt(grid.crs_wkt.c_str()) != OGRERR_NONE)
    throw_input_error("", "the DEM has no coordinate reference system (give one with --dem-crs)");
  src.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  std::unique_ptr<OGRSpatialReference> geog(src.CloneGeogCS());
  if (!geog) throw_input_error("", "the DEM's CRS has no geographic base");
  geog->SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  CoordinateTransformPtr to_geog(OGRCreateCoordinateTransformation(&src, geog.get()));
  if (!to_geog) throw_input_error("", "cannot relate the DEM's CRS to its geographic base");
  const Box b = grid.bounds();
  double cx = b.centre().x, cy = b.centre().y;
  double lon = cx, lat = cy;
  if (!to_geog->Transform(1, &lon, &lat))
    throw_input_error("", "the DEM's centre does not transform to longitude and latitude");
  OGRSpatialReference tm;
  tm.CopyGeogCSFrom(geog.get());
  tm.SetTM(lat, lon, 1.0, 0.0, 0.0);
  tm.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  Plane p;
  p.forward.reset(OGRCreateCoordinateTransformation(&src, &tm));
  p.back.reset(OGRCreateCoordinateTransformation(&tm, &src));
  if (!p.forward || !p.back) throw_input_error("", "cannot build a local plane for the DEM");
  // The CRS's scale at the centre: central differences over one cell each way.
  const double dx = std::abs(grid.cell_x()), dy = std::abs(grid.cell_y());
  double xs[4] = {cx - dx / 2, cx + dx / 2, cx, cx}, ys[4] = {cy, cy, cy - dy / 2, cy + dy / 2};
  if (!p.forward->Transform(4, xs, ys))
    throw_input_error("", "the DEM's centre does not transform to a local plane");
  p.k_x = std::hypot(xs[1] - xs[0], ys[1] - ys[0]) / dx;
  p.k_y = std::hypot(xs[3] - xs[2], ys[3] - ys[2]) / dy;
  return p;
}

void transform_lines(OGRCoordinateTransformation& ct, std::vector<ContourLine>& lines) {
  std::vector<double> xs, ys;
  for (auto& l : lines) {
    const std::size_t n = l.ground.size();
    xs.resize(n);
    ys.resize(n);
    for (std::size_t i = 0; i < n; ++i) xs[i] = l.ground[i].x, ys[i] = l.ground[i].y;
    std::vector<int> ok(n, 0);
    if (n > 0 && !ct.Transform(n, xs.data(), ys.data(), nullptr, ok.data()))
      throw_internal_error("PROJ failed to transform a contour line to or from the local plane");
    for (std::size_t i = 0; i < n; ++i) l.ground[i] = {xs[i], ys[i]};
  }
}

}  // namespace

std::optional<GroundPlane> GroundPlane::for_grid(const RasterGrid& grid) {
  Plane p = make_plane(grid);
  if (std::abs(p.k_x - 1) <= kMaxScaleError && std::abs(p.k_y - 1) <= kMaxScaleError)
    return std::nullopt;
  GroundPlane g;
  g.forward_ = std::move(p.forward);
  g.back_ = std::move(p.back);
  g.k_x_ = p.k_x;
  g.k_y_ = p.k_y;
  g.cell_m_ = std::sqrt(std::abs(grid.cell_x()) * p.k_x * std::abs(grid.cell_y()) * p.k_y);
  return g;
}

void GroundPlane::to_plane(std::vector<ContourLine>& lines) const {
  transform_lines(*forward_, lines);
}

void GroundPlane::from_plane(std::vector<ContourLine>& lines) const {
  transform_lines(*back_, lines);
}

double ground_cell_m(const RasterGrid& grid) {
  Plane p = make_plane(grid);
  return std::sqrt(std::abs(grid.cell_x()) * p.k_x * std::abs(grid.cell_y()) * p.k_y);
}

}  // namespace sheetmill::contours
