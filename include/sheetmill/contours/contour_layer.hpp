#pragma once
// Contour lines to and from GDAL vector sources.

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/contours/contour_line.hpp"
#include "sheetmill/contours/spot_heights.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::contours {

// A placed index-contour label, for users' own GIS work.
struct LabelPoint {
  Point ground;          // centre of the figures, on the line
  double elevation = 0;  // in the unit of the figures
  std::string text;      // the figures as drawn
  double angle_deg = 0;  // baseline direction, counter-clockwise from grid east
  double up_deg = 0;     // direction from baseline to the tops of the figures, likewise
};

// Writes `lines` as a GeoPackage layer "contours" (LineString, CRS from `crs_wkt`, may be empty)
// with fields elevation (real), index, depression, supplementary, depth (below the sea level),
// coastline (at it) (integers 1/0), and, when
// `labels` is given, a point layer "contour_labels" (elevation, text, angle_deg, up_deg). Atomic:
// the file appears complete under `out` or not at all. Throws Error(input) when it cannot be
// written.
// `unit_m`: metres per unit of the elevation field (1: metres).
void write_geopackage(const std::filesystem::path& out, const std::vector<ContourLine>& lines,
                      const std::string& crs_wkt, const std::vector<LabelPoint>* labels = nullptr,
                      double unit_m = 1.0);

// Places index-contour labels for `lines` at the scale of `params` on a frame covering the DEM
// (the spacing, type and orientation rule from `style`), with the sheet's collision rules.
std::vector<LabelPoint> place_labels(const std::vector<ContourLine>& lines, const terrain::Dem& dem,
                                     const ContourParams& params, const style::ContourStyle& style,
                                     double unit_m = 1.0);

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
// proposed from the scale and relief when `params.interval_m` is 0), writes the GeoPackage in the
// DEM's CRS. params.interval_m, base_m and sea_level_m are in units of options.unit_m (the DEM's
// unit when unset). The paper lengths of `params` (minimum loop, smoothing) are ground lengths at
// the scale: a DEM whose CRS units are not ground metres (geographic, Web Mercator, feet) is
// prepared in a local plane of ground metres (contours/ground_plane.hpp).
struct ContourFileReport {
  double interval = 0;  // in `unit`
  long lines = 0;
  long closed = 0;  // closed lines among them
  long vertices = 0;
  double length_m = 0;  // ground metres
  long labels = 0;
  HeightUnit unit;  // of the interval and the elevation field
};
struct ContourFileOptions {
  bool prepare = true;  // false: the generator's raw lines
  bool labels = false;  // also place index-contour labels (layer "contour_labels")
  style::ContourStyle style;
  // Metres per unit of the interval, base, elevation field and figures; unset: the DEM's own
  // vertical unit (terrain::vertical_unit_m), so a DEM in feet gets contours in feet.
  std::optional<double> unit_m;
  // The DEM's CRS when the file states none (any definition GDAL accepts, e.g. "EPSG:4326").
  std::optional<std::string> dem_crs;
};
ContourFileReport contour_file(const std::string& dem_path, const std::filesystem::path& out,
                               ContourParams params, const ContourFileOptions& options = {});

}  // namespace sheetmill::contours
