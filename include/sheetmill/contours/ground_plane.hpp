#pragma once
// A local plane in ground metres for contours of a DEM whose CRS units are not ground metres:
// a geographic grid (degrees), or a projection whose scale at the DEM departs from one (Web
// Mercator, a CRS in feet). Paper lengths (minimum loop, smoothing) and reported lengths must be
// ground metres, so such lines are prepared in a transverse Mercator plane centred on the DEM
// (scale factor 1 at its centre; PROJ does the transformation) and brought back afterwards.

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/contours/contour_line.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/map_frame.hpp"

namespace sheetmill::contours {

class GroundPlane {
 public:
  // The plane for `grid` (its CRS in WKT), or nullopt when the grid's own units are ground
  // metres within kMaxScaleError at its centre (a UTM grid: 0.9996). Throws Error(input) when
  // PROJ cannot relate the CRS to its geographic base.
  static std::optional<GroundPlane> for_grid(const RasterGrid& grid);

  // The ground size of a cell at the grid's centre, metres (geometric mean of the two sides).
  double cell_m() const { return cell_m_; }
  // The scale of the grid's CRS at its centre: ground metres per CRS unit, east and north.
  double metres_per_unit_x() const { return k_x_; }
  double metres_per_unit_y() const { return k_y_; }

  // In place, every vertex: grid CRS -> plane metres, and back. Throws Error(internal) when
  // PROJ fails on a point of the grid.
  void to_plane(std::vector<ContourLine>& lines) const;
  void from_plane(std::vector<ContourLine>& lines) const;

  // Above this relative departure of the CRS's scale from one, lengths are taken in the plane.
  static constexpr double kMaxScaleError = 1e-3;

 private:
  GroundPlane() = default;
  CoordinateTransformPtr forward_, back_;
  double cell_m_ = 0, k_x_ = 1, k_y_ = 1;
};

// The ground size (metres) of a cell of `grid` at its centre, whatever its CRS: the grid's cell
// times the CRS's local scale.
double ground_cell_m(const RasterGrid& grid);

}  // namespace sheetmill::contours
