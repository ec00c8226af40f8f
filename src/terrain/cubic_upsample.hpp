#pragma once
// Internal to the terrain stage: read_dem_window's own path for the common relief case, the
// DEM upsampled into a grid of the same CRS with cubic convolution (Keys 1981, a = -0.5), in
// rows on both cores, without GDAL's warper.
//
// It computes what GDAL's warper computes for that case (GWK's four-sample cubic: the source
// position of a target cell centre through the two geotransforms, i = floor(s - 0.5), the
// weights of Keys' kernel at s - 0.5 - i, rows convolved first, then the column), so the
// elevations agree with the warper's to float rounding. It applies only when the whole 4 x 4
// neighbourhood of every target cell lies inside the raster and holds data; otherwise it
// declines and the caller warps with GDAL.

#include <gdal_priv.h>
#include <ogr_spatialref.h>

#include <optional>
#include <vector>

#include "sheetmill/core/map_frame.hpp"

namespace sheetmill::terrain::detail {

// Fills `z` (target.width * target.height, row-major) and returns true, or returns false and
// leaves `z` alone when the case does not apply. `nodata`: the band's nodata value, if any.
bool cubic_upsample_same_crs(GDALDataset& src, const OGRSpatialReference& src_srs,
                             const OGRSpatialReference& dst_srs, const RasterGrid& target,
                             std::optional<double> nodata, std::vector<float>& z);

}  // namespace sheetmill::terrain::detail
