#pragma once
// The sheet's projected CRS, resolved once with PROJ, and what the furniture needs from it:
// ground <-> longitude/latitude on the CRS's own datum, grid convergence and point scale factor,
// and names for the collar notes.
//
// Longitude/latitude are degrees, east and north positive, always in that order (PROJ's
// normalisation for visualisation). Ground coordinates are easting/northing in metres. A SheetCrs
// owns its PROJ context and objects; it is move-only and belongs to one thread.

#include <memory>
#include <string>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::sheet {

struct PointFactors {
  // Angle from true north to grid north, degrees, positive when grid north lies east of
  // (clockwise from) true north. East of a transverse Mercator central meridian in the northern
  // hemisphere it is positive, about (lon - lon0) sin(lat) (first order, common practice).
  double grid_convergence_deg = 0;
  double scale_factor = 1;  // point scale factor k (parallel scale for conformal projections)
};

class SheetCrs {
 public:
  // `definition` is anything PROJ accepts for a CRS: "EPSG:32633", WKT, or a PROJ string with
  // +type=crs. Throws Error(input) naming `where` when PROJ cannot resolve it or it is not a
  // projected CRS.
  static SheetCrs resolve(const std::string& definition, const std::string& where = "crs");

  SheetCrs(SheetCrs&&) noexcept;
  SheetCrs& operator=(SheetCrs&&) noexcept;
  ~SheetCrs();

  const std::string& wkt2() const;  // WKT2:2019
  const std::string& wkt1() const;  // WKT1 in GDAL's dialect (for the PDF viewport)
  const std::string& name() const;  // "WGS 84 / UTM zone 33N"
  const std::string& datum_name() const;
  const std::string& projection_name() const;  // the conversion's method ("Transverse Mercator")
  int epsg() const;                            // 0 when PROJ names no EPSG code

  // Throws Error(internal) when PROJ fails for the point (outside the projection's domain).
  Point to_lonlat(Point ground) const;
  Point to_ground(Point lonlat_deg) const;
  PointFactors factors_at(Point lonlat_deg) const;

 private:
  struct Impl;
  explicit SheetCrs(std::unique_ptr<Impl> impl);
  std::unique_ptr<Impl> impl_;
};

// A transformation between two CRSs, axis order normalised (x = easting or longitude). For the
// second grid and for tile-index features in another CRS. Move-only.
class Reprojector {
 public:
  Reprojector(const std::string& from_definition, const std::string& to_definition);
  Reprojector(Reprojector&&) noexcept;
  ~Reprojector();
  Point forward(Point p) const;  // throws Error(internal) when PROJ fails
  Point inverse(Point p) const;
  bool target_is_geographic() const;
  bool source_is_geographic() const;

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace sheetmill::sheet
