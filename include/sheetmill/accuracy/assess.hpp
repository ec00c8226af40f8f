#pragma once
// A DEM tested against check points: each point sampled from the DEM (bilinear between the four
// nearest cell centres, in the DEM's own grid and CRS), the residual "DEM minus surveyed" in
// metres (both vertical units reconciled), the refused points with their reason, and the
// statistics of statistics.hpp. Optionally the horizontal test: the check points' surveyed
// positions against the same IDs in a second point source (the map's positions).
//
// The DEM is read two rows at a time around each point, so memory is bounded by the DEM's width,
// never by its size. Throws Error(input) on one line when no check point can be used.

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/accuracy/check_points.hpp"
#include "sheetmill/accuracy/statistics.hpp"
#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::accuracy {

enum class PointStatus { used, outside, nodata, duplicate, no_height };
const char* status_name(PointStatus status);

struct Residual {
  std::string id;
  Point xy;              // in the DEM's CRS
  double z_check_m = 0;  // surveyed
  double z_dem_m = 0;    // sampled (NaN when not sampled)
  double error_m = 0;    // z_dem - z_check (0 when refused)
  PointStatus status = PointStatus::used;
  std::string cover;
  bool vegetated = false;
  bool outlier = false;  // beyond three standard deviations of the used points
};

struct AssessOptions {
  terrain::DemReadOptions dem;
  // Land-cover classes counted as vegetated ground (ASPRS 2014 VVA); the others are
  // non-vegetated (NVA). Used only when the points carry a class.
  std::vector<std::string> vegetated_classes;
  // The date the test stands for (the statement prints it); empty: today (UTC).
  std::string date;
};

struct PositionPair {
  std::string id;
  Point surveyed, mapped;     // projected CRS, metres
  double dx_m = 0, dy_m = 0;  // mapped minus surveyed
};

struct HorizontalAssessment {
  std::string crs_name;  // the projected CRS the differences are measured in
  std::vector<PositionPair> pairs;
  std::size_t unmatched = 0;  // check points with no map position of the same ID
  HorizontalStats stats;
};

struct Assessment {
  std::string dem_path;
  std::string points_path;
  std::string points_layer;
  std::string height_field;
  std::string date;                 // of the test, YYYY-MM-DD
  RasterGrid dem_grid;              // the DEM's own grid (for the report's map)
  double dem_unit_m = 1;            // metres per DEM value
  std::vector<Residual> residuals;  // every point read, in file order
  std::size_t used = 0, outside = 0, nodata = 0, duplicate = 0, no_height = 0;
  VerticalStats all;  // every used point: the NSSDA figures
  bool has_cover = false;
  VerticalStats non_vegetated, vegetated;  // when has_cover
  std::vector<std::string> outlier_ids;
  std::optional<HorizontalAssessment> horizontal;
};

Assessment assess_vertical(const std::string& dem_path, const CheckPointSource& points,
                           const AssessOptions& options = {});

// The surveyed positions (`surveyed`, usually the check points) against the map's positions of
// the same IDs, both in the DEM's CRS when it is projected, else in the surveyed points' CRS.
HorizontalAssessment assess_horizontal(const std::string& dem_path,
                                       const CheckPointSource& surveyed,
                                       const CheckPointSource& mapped,
                                       const AssessOptions& options = {});

}  // namespace sheetmill::accuracy
