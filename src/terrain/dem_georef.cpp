#include "terrain/dem_georef.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::terrain::detail {

OGRSpatialReference dem_crs(GDALDataset& ds, const DemReadOptions& options,
                            const std::string& path) {
  OGRSpatialReference srs;
  const OGRSpatialReference* own = ds.GetSpatialRef();
  if (own && !own->IsEmpty()) {
    srs = *own;
  } else if (options.assumed_crs && !options.assumed_crs->empty()) {
    GdalErrorScope errors;  // the message below says it better than PROJ's
    if (srs.SetFromUserInput(options.assumed_crs->c_str()) != OGRERR_NONE) {
      throw_input_error(path, "the stated DEM CRS \"" + *options.assumed_crs +
                                  "\" is not a CRS GDAL understands (try EPSG:NNNN)");
    }
  } else {
    throw_input_error(path,
                      "the DEM has no coordinate reference system and none was stated "
                      "(give one, for example EPSG:32633)");
  }
  srs.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  return srs;
}

namespace {
std::string lower(std::string s) {
  std::transform(s.begin(), s.end(), s.begin(),
                 [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return s;
}

// Metres per unit for a unit name, or 0 when the name is not a length we know.
double unit_metres(const std::string& raw) {
  std::string u = lower(raw);
  if (u == "m" || u == "metre" || u == "meter" || u == "metres" || u == "meters") return 1.0;
  if (u == "ft" || u == "foot" || u == "feet" || u == "international foot") {
    return kMetresPerFoot;
  }
  if (u == "us-ft" || u == "ftus" || u == "us survey foot" || u == "us_survey_foot" ||
      u == "foot_us" || u == "us foot") {
    return kMetresPerUsSurveyFoot;
  }
  return 0;
}
}  // namespace

double metres_per_z_unit(GDALRasterBand& band, const OGRSpatialReference& srs,
                         const DemReadOptions& options, const std::string& path) {
  if (options.vertical_unit) {
    double f = unit_metres(*options.vertical_unit);
    if (f == 0) {
      throw_input_error(
          path, "vertical unit \"" + *options.vertical_unit + "\": expected one of m, ft, us-ft");
    }
    return f;
  }
  const char* unit = band.GetUnitType();
  if (unit && *unit) {
    double f = unit_metres(unit);
    if (f != 0) return f;
  }
  if (srs.IsCompound() || srs.IsVertical()) {
    double f = srs.GetTargetLinearUnits("VERT_CS");
    if (f > 0) return f;
  }
  return 1.0;
}

GroundScale ground_scale(const OGRSpatialReference& srs) {
  GroundScale g;
  g.geographic = srs.IsGeographic();
  if (!g.geographic) {
    g.linear_unit_m = srs.GetLinearUnits();
    if (!(g.linear_unit_m > 0)) g.linear_unit_m = 1.0;
    return g;
  }
  OGRErr err = OGRERR_NONE;
  g.semi_major_m = srs.GetSemiMajor(&err);
  const double inv_f = srs.GetInvFlattening(&err);
  const double f = inv_f > 0 ? 1.0 / inv_f : 0.0;
  g.e2 = f * (2 - f);
  g.rad_per_unit = srs.GetAngularUnits();  // radians per degree, usually
  return g;
}

double native_cell_m(GDALDataset& ds, const OGRSpatialReference& srs, const std::string& path) {
  Dem probe;
  probe.grid.width = ds.GetRasterXSize();
  probe.grid.height = ds.GetRasterYSize();
  if (ds.GetGeoTransform(probe.grid.geotransform) != CE_None) {
    throw_input_error(path, "the DEM has no geotransform");
  }
  // Rotated grids: the cell's side lengths, not the geotransform's diagonal terms.
  double* gt = probe.grid.geotransform;
  double sx = std::hypot(gt[1], gt[4]);
  double sy = std::hypot(gt[2], gt[5]);
  gt[1] = sx;
  gt[5] = -sy;
  gt[2] = gt[4] = 0;
  set_ground_cell_size(probe, srs);
  return std::sqrt(probe.cell_x_m * probe.cell_y_m);
}

void set_ground_cell_size(Dem& dem, const OGRSpatialReference& srs) {
  set_ground_cell_size(dem, ground_scale(srs));
}

void set_ground_cell_size(Dem& dem, const GroundScale& g) {
  const double* gt = dem.grid.geotransform;
  dem.row_cell_x_m.clear();
  dem.row_cell_y_m.clear();
  if (!g.geographic) {
    dem.cell_x_m = std::abs(gt[1]) * g.linear_unit_m;
    dem.cell_y_m = std::abs(gt[5]) * g.linear_unit_m;
    return;
  }
  const double a = g.semi_major_m, e2 = g.e2, rad_per_unit = g.rad_per_unit;
  const double dlon = std::abs(gt[1]) * rad_per_unit;
  const double dlat = std::abs(gt[5]) * rad_per_unit;
  auto sides = [&](double lat_units, double& x_m, double& y_m) {
    double phi = lat_units * rad_per_unit;
    double s = std::sin(phi);
    double w2 = 1 - e2 * s * s;
    double n = a / std::sqrt(w2);                    // prime vertical radius
    double m = a * (1 - e2) / (w2 * std::sqrt(w2));  // meridian radius
    x_m = n * std::cos(phi) * dlon;
    y_m = m * dlat;
  };
  const int h = dem.grid.height;
  dem.row_cell_x_m.resize(h);
  dem.row_cell_y_m.resize(h);
  for (int r = 0; r < h; ++r) {
    sides(gt[3] + (r + 0.5) * gt[5], dem.row_cell_x_m[r], dem.row_cell_y_m[r]);
  }
  sides(gt[3] + 0.5 * h * gt[5], dem.cell_x_m, dem.cell_y_m);
}

}  // namespace sheetmill::terrain::detail
