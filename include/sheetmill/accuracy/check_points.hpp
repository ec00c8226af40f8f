#pragma once
// Check points read from any OGR point source: an ID, a surveyed height and, when asked, a
// land-cover class, with positions reprojected (PROJ through OGR) into a target CRS.
//
// A points file that states no CRS must be given one (`crs`); heights come from the named field,
// or the first of the usual names present. Read errors throw Error(input) naming the file (and
// the field) on one line. Memory is one record per point.

#include <ogr_spatialref.h>

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::accuracy {

struct CheckPointSource {
  std::string path;          // file or OGR connection string
  std::string layer;         // empty: the only (or first point) layer
  std::string height_field;  // empty: elevation_m, elevation, height_m, height, z (first present)
  std::string id_field;      // empty: "id" when present, else the feature ID
  std::string cover_field;   // empty: no land-cover classes
  std::optional<std::string> crs;  // the points' CRS when the file states none
  double height_unit_m = 1;        // metres per unit of the height field
  bool heights_required = true;    // false for map positions (horizontal matching)
};

struct CheckPoint {
  std::string id;
  Point xy;                   // in the target CRS (traditional GIS order: x east, y north)
  std::optional<double> z_m;  // surveyed height in metres; empty when the field is null
  std::string cover;          // land-cover class, "" when none
};

struct CheckPointSet {
  std::string layer_name;
  std::string height_field;  // the field actually read ("" when heights are not required)
  std::vector<CheckPoint> points;
};

// Reads every point of the layer, reprojected into `target` (when null: left in the file's CRS).
CheckPointSet read_check_points(const CheckPointSource& source, const OGRSpatialReference* target);

// "m", "ft" (international foot, 0.3048 m) or "us-ft" (US survey foot, 1200/3937 m); throws
// Error(input) naming `what` otherwise.
double height_unit_metres(const std::string& unit, const std::string& what);

}  // namespace sheetmill::accuracy
