#pragma once
// Private: reading elevations and slopes from a terrain::Dem at ground positions. Cell values sit
// at cell centres (GDAL's convention, the same the contour generator uses), so sampling between
// centres is bilinear, as is the generator's interpolation along cell edges.

#include <cmath>
#include <optional>

#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::contours::detail {

class DemSampler {
 public:
  explicit DemSampler(const terrain::Dem& dem) : dem_(dem) {
    const double* gt = dem.grid.geotransform;
    x0_ = gt[0];
    y0_ = gt[3];
    cx_ = gt[1];
    cy_ = -gt[5];
    // Ground metres per CRS unit: 1 for a grid in metres; a geographic grid's cell sides on the
    // ellipsoid at its centre latitude (terrain::Dem), so slopes are true to first order.
    if (dem.cell_x_m > 0 && cx_ != 0) kx_ = dem.cell_x_m / std::abs(cx_);
    if (dem.cell_y_m > 0 && cy_ != 0) ky_ = dem.cell_y_m / std::abs(cy_);
  }

  // The smaller cell side in the grid's CRS units.
  double cell_m() const { return std::min(std::abs(cx_), std::abs(cy_)); }

  // Length of a polyline in ground metres, at the grid's central scale (a threshold's measure).
  double ground_length(const Polyline& p, bool closed) const {
    double s = 0;
    for (std::size_t i = 1; i < p.size(); ++i)
      s += std::hypot((p[i].x - p[i - 1].x) * kx_, (p[i].y - p[i - 1].y) * ky_);
    if (closed && p.size() > 2)
      s += std::hypot((p.back().x - p[0].x) * kx_, (p.back().y - p[0].y) * ky_);
    return s;
  }

  // Bilinear elevation at a ground point; NaN outside the grid or next to nodata.
  double elevation(Point g) const {
    double fx = (g.x - x0_) / cx_ - 0.5;
    double fy = (y0_ - g.y) / cy_ - 0.5;
    int w = dem_.width(), h = dem_.height();
    if (!(fx >= 0 && fy >= 0 && fx <= w - 1 && fy <= h - 1)) return std::nan("");
    int i = std::min(static_cast<int>(fx), w - 2 < 0 ? 0 : w - 2);
    int j = std::min(static_cast<int>(fy), h - 2 < 0 ? 0 : h - 2);
    double tx = fx - i, ty = fy - j;
    int i1 = std::min(i + 1, w - 1), j1 = std::min(j + 1, h - 1);
    double a = at(i, j), b = at(i1, j), c = at(i, j1), d = at(i1, j1);
    return (a * (1 - tx) + b * tx) * (1 - ty) + (c * (1 - tx) + d * tx) * ty;
  }

  // Gradient (dz/dE, dz/dN) per ground metre by central differences of the bilinear surface over
  // one cell; nullopt where the neighbourhood has no data.
  std::optional<Point> gradient(Point g) const {
    double hx = cx_, hy = cy_;
    double e = elevation({g.x + hx, g.y}), w = elevation({g.x - hx, g.y});
    double n = elevation({g.x, g.y + hy}), s = elevation({g.x, g.y - hy});
    if (std::isnan(e) || std::isnan(w)) {
      e = elevation({g.x + hx / 2, g.y});
      w = elevation({g.x - hx / 2, g.y});
      hx /= 2;
    }
    if (std::isnan(n) || std::isnan(s)) {
      n = elevation({g.x, g.y + hy / 2});
      s = elevation({g.x, g.y - hy / 2});
      hy /= 2;
    }
    if (std::isnan(e) || std::isnan(w) || std::isnan(n) || std::isnan(s)) return std::nullopt;
    return Point{(e - w) / (2 * hx * kx_), (n - s) / (2 * hy * ky_)};
  }

 private:
  double at(int i, int j) const { return static_cast<double>(dem_.at(i, j)); }
  const terrain::Dem& dem_;  // not owned; outlives the sampler
  double x0_, y0_, cx_, cy_;
  double kx_ = 1, ky_ = 1;
};

}  // namespace sheetmill::contours::detail
