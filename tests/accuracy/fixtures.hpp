#pragma once
// Synthetic inputs for the accuracy tests: a GeoTIFF plane (bilinear sampling is exact on a
// plane, so a check point's DEM height is known analytically) and point layers written with OGR.

#include <filesystem>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::accuracy::fixture {

// z = a + b (x - ox) + c (y - oy): heights of a few hundred metres near the origin, so float32
// cells hold them to about 1e-5 m.
struct Plane {
  double a = 250, b = 0.01, c = 0.02;
  double ox = 400000, oy = 5200000;
  double at(Point p) const { return a + b * (p.x - ox) + c * (p.y - oy); }
};
// The plane over a north-up grid with its top-left corner at (x0, y0), EPSG `epsg`.
void write_plane_dem(const std::filesystem::path& path, const Plane& plane, int width, int height,
                     double x0, double y0, double cell_m, int epsg,
                     std::optional<float> nodata_in_first_row = std::nullopt);

struct PointRecord {
  std::string id;
  Point xy;
  std::optional<double> height;  // written to field `height_field` (null when empty)
  std::string cover;
};
// A GeoPackage layer "points" (fields id, the height field unless empty, cover) in EPSG `epsg`
// (0: no CRS stated).
void write_points(const std::filesystem::path& path, const std::vector<PointRecord>& points,
                  int epsg, const std::string& height_field = "elevation_m");

}  // namespace sheetmill::accuracy::fixture
