#pragma once
// Contour lines to and from GDAL vector sources.

#include <filesystem>
#include <string>
#include <vector>

#include "sheetmill/contours/contour_line.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::contours {

// Writes `lines` as a GeoPackage layer "contours" (LineString, CRS from `crs_wkt`, may be empty)
// with fields elevation (real), index, depression, supplementary (integers 1/0). Atomic: the
// file appears complete under `out` or not at all. Throws Error(input) when it cannot be written.
void write_geopackage(const std::filesystem::path& out, const std::vector<ContourLine>& lines,
                      const std::string& crs_wkt);

// Reads supplied contours (any GDAL vector source) with an elevation attribute: the lines
// meeting `ground` (sheet CRS metres), transformed into `target_crs_wkt` (empty: taken as is),
// flagged as index lines by `params`, and prepared for print. `layer` empty = the first layer.
// With a DEM the lines are oriented (higher ground left) and depressions found; without one
// uphill_known is false. Throws Error(input) naming the file for a missing layer or field.
std::vector<ContourLine> read_layer(const std::string& path, const std::string& layer,
                                    const std::string& elevation_field, const Box& ground,
                                    const std::string& target_crs_wkt, const ContourParams& params,
                                    const terrain::Dem* dem = nullptr);

// What `sheetmill contours` does: reads the whole DEM in its own grid, contours it (interval
// proposed from the scale and relief when `params.interval_m` is 0), writes the GeoPackage.
struct ContourFileReport {
  double interval_m = 0;
  long lines = 0;
  long vertices = 0;
  double length_m = 0;
};
ContourFileReport contour_file(const std::string& dem_path, const std::filesystem::path& out,
                               ContourParams params, bool prepare = true);

}  // namespace sheetmill::contours
