#pragma once
// Internal to the terrain stage: what a DEM's georeferencing means on the ground.

#include <gdal_priv.h>
#include <ogr_spatialref.h>

#include <string>

#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::terrain::detail {

// The DEM's CRS (traditional lon/lat axis order), or options.assumed_crs when the file has
// none. Throws Error(input) naming `path` when neither exists or the stated one is invalid.
OGRSpatialReference dem_crs(GDALDataset& ds, const DemReadOptions& options,
                            const std::string& path);

// Metres per elevation unit: the option when given, else the band's unit type, else the
// vertical part of a compound CRS, else 1 (metres).
double metres_per_z_unit(GDALRasterBand& band, const OGRSpatialReference& srs,
                         const DemReadOptions& options, const std::string& path);

// Fills dem.cell_x_m / cell_y_m (and the per-row vectors for geographic grids) from the grid's
// geotransform interpreted in `srs`. Geographic cells are measured on the CRS's ellipsoid:
// east-west N(phi) cos(phi) dlambda, north-south M(phi) dphi (radii of curvature in the prime
// vertical and the meridian).
GroundScale ground_scale(const OGRSpatialReference& srs);
void set_ground_cell_size(Dem& dem, const GroundScale& scale);
void set_ground_cell_size(Dem& dem, const OGRSpatialReference& srs);

// The DEM's own cell size in ground metres (geometric mean of the two sides, at the centre
// latitude for geographic DEMs). Throws Error(input) naming `path` without a geotransform.
double native_cell_m(GDALDataset& ds, const OGRSpatialReference& srs, const std::string& path);

}  // namespace sheetmill::terrain::detail
