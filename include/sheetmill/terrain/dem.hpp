#pragma once
// Elevation grids for relief and contours, and reading them from any GDAL raster.
//
// A Dem is a north-up grid of elevations in metres, NaN where the source has no data. It owns
// its cells. Its ground cell size is in metres: for a grid in a projected CRS the cell size
// times the CRS's linear unit; for a geographic grid (degrees) the length of a cell's sides on
// the ellipsoid at each row's latitude (row_cell_x_m / row_cell_y_m), so no user scale factor
// is ever needed.

#include <cmath>
#include <cstddef>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/map_frame.hpp"

namespace sheetmill::terrain {

struct Dem {
  RasterGrid grid;                   // geotransform and CRS (WKT) of the cells
  std::vector<float> z;              // row-major, grid.width * grid.height, metres; NaN = nodata
  double cell_x_m = 0;               // ground size of a cell in metres (geographic grids: at the
  double cell_y_m = 0;               // centre latitude)
  std::vector<double> row_cell_x_m;  // per-row ground cell size, or empty when constant
  std::vector<double> row_cell_y_m;  // (geographic grids: cells shrink toward the poles)

  int width() const { return grid.width; }
  int height() const { return grid.height; }
  float at(int col, int row) const { return z[static_cast<std::size_t>(row) * grid.width + col]; }
  double cell_x_m_at(int row) const { return row_cell_x_m.empty() ? cell_x_m : row_cell_x_m[row]; }
  double cell_y_m_at(int row) const { return row_cell_y_m.empty() ? cell_y_m : row_cell_y_m[row]; }
  // Number of cells holding data.
  std::size_t valid_count() const;
};

// What the ground cell size needs from a CRS, read once: OGR's queries go through PROJ and
// cost milliseconds each, too much to repeat for every band of a raster product.
struct GroundScale {
  bool geographic = false;
  double linear_unit_m = 1;                           // projected CRS
  double semi_major_m = 0, e2 = 0, rad_per_unit = 0;  // geographic CRS
};

struct DemReadOptions {
  // Resampling into the target grid: "bilinear" (default, exact on planes), "cubic", "average",
  // "auto" (cubic when the target is finer than the DEM, average when a target cell spans
  // several DEM cells; see resampling.hpp), or GDAL's "cubicspline", "near".
  std::string resampling = "bilinear";
  // The DEM's CRS when the file has none (any string GDAL's SetFromUserInput accepts, for
  // instance "EPSG:32633"). Ignored when the file states its own CRS.
  std::optional<std::string> assumed_crs;
  // Elevation unit when the file does not say, or to override it: "m", "ft" (international
  // foot) or "us-ft" (US survey foot).
  std::optional<std::string> vertical_unit;
  // Log a warning when the DEM covers only part of the target grid. A sheet turns this off and
  // reports the coverage of its map frame once (the grids reach past the frame by a margin).
  bool warn_coverage = true;
};

// Reads the part of the DEM under `target`, warped into exactly that grid with GDAL's warper
// (in memory, both cores). Only the source window under the target is read, chunk by chunk,
// so memory is bounded by the target grid, not by the source. Cells outside the data or in
// the source's nodata are NaN; a log warning says when relief is partly or wholly missing.
// Throws Error(input) for an unreadable file, a non-raster, or a DEM without CRS when none is
// stated.
Dem read_dem_window(const std::string& path, const RasterGrid& target,
                    const DemReadOptions& options = {});

// The same reads from a DEM kept open for many windows of one sheet (relief strips): the
// blocks GDAL has decoded stay in its block cache between reads instead of being decoded again
// for every window. Not for concurrent use: one read at a time.
class DemReader {
 public:
  explicit DemReader(const std::string& path);  // throws like read_dem_window
  ~DemReader();
  DemReader(const DemReader&) = delete;
  DemReader& operator=(const DemReader&) = delete;
  Dem read(const RasterGrid& target, const DemReadOptions& options = {}) const;

 private:
  struct Impl;
  std::string path_;
  std::unique_ptr<Impl> impl_;
};

// The DEM's own cell size in metres (geometric mean of the two sides, at the centre latitude
// for geographic DEMs), for choosing a working resolution.
double native_cell_m(const std::string& path, const DemReadOptions& options = {});

// Metres per unit of the DEM's values: options.vertical_unit when stated, else the band's unit
// type, else the vertical part of a compound CRS, else 1. Sheets show heights in this unit.
double vertical_unit_m(const std::string& path, const DemReadOptions& options = {});

}  // namespace sheetmill::terrain
