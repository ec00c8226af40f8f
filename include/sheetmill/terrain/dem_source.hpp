#pragma once
// A DEM read in its own grid, a band of rows at a time (for raster products of any size).
//
// Elevations come back in metres (band scale/offset and vertical unit applied), NaN where the
// source has nodata, with the ground cell size of every row (see dem.hpp). The source must be
// north-up (no rotation terms); reprojection is read_dem_window()'s job. Not thread-safe: one
// read at a time per DemSource.

#include <ogr_spatialref.h>

#include <string>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::terrain {

class DemSource {
 public:
  // Throws Error(input) for an unreadable or non-raster file, a DEM without CRS when none is
  // stated, or a rotated grid.
  explicit DemSource(const std::string& path, const DemReadOptions& options = {});

  const std::string& path() const { return path_; }
  // The DEM's own grid (geotransform and CRS WKT).
  const RasterGrid& grid() const { return grid_; }
  // Rows [row0, row0 + rows), clipped to the raster.
  Dem read_rows(int row0, int rows) const;
  // The same into `dem`, reusing its storage (for band-by-band loops).
  void read_rows_into(int row0, int rows, Dem& dem) const;
  Dem read_all() const { return read_rows(0, grid_.height); }
  // Ground cell size in metres (geometric mean of the sides, at the centre latitude).
  double native_cell_m() const;
  // The underlying dataset (for block sizes and metadata); owned by this object.
  GDALDataset& dataset() const { return *ds_; }
  // The DEM's CRS (traditional GIS axis order).
  const OGRSpatialReference& crs() const { return srs_; }

 private:
  std::string path_;
  DatasetPtr ds_;
  RasterGrid grid_;
  OGRSpatialReference srs_;
  GroundScale scale_;
  double mul_ = 1, add_ = 0;
  bool has_nodata_ = false;
  double nodata_ = 0;
};

}  // namespace sheetmill::terrain
