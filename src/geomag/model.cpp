#include "sheetmill/geomag/model.hpp"

#include <cmath>
#include <fstream>
#include <sstream>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::geomag {

namespace {

constexpr int kMaxDegree = 12;
constexpr double kRefRadiusKm = 6371.2;  // WMM geomagnetic reference radius
constexpr double kWgs84A = 6378.137;     // WGS 84 semi-major axis, km
constexpr double kWgs84F = 1 / 298.257223563;

int idx(int n, int m) {
  return n * (n + 1) / 2 + m;
}

}  // namespace

Model Model::parse(const std::string& text, const std::string& where) {
  Model model;
  std::istringstream in(text);
  std::string line;
  int line_no = 0;
  auto fail = [&](const std::string& msg) {
    throw_input_error(SourceLocation{where, line_no, 0, ""}, msg);
  };
  if (!std::getline(in, line)) fail("empty magnetic model file");
  ++line_no;
  {
    std::istringstream h(line);
    if (!(h >> model.epoch_ >> model.name_) || model.epoch_ < 1900 || model.epoch_ > 2200) {
      fail("expected the header 'EPOCH MODEL-NAME RELEASE-DATE' of a WMM coefficient file");
    }
  }
  int size = idx(kMaxDegree, kMaxDegree) + 1;
  model.g_.assign(size, 0);
  model.h_.assign(size, 0);
  model.gdot_.assign(size, 0);
  model.hdot_.assign(size, 0);
  bool terminated = false;
  while (std::getline(in, line)) {
    ++line_no;
    if (line.find_first_not_of(" \t\r") == std::string::npos) continue;
    if (line.find("9999") != std::string::npos) {
      terminated = true;
      break;
    }
    std::istringstream l(line);
    int n = 0, m = 0;
    double g = 0, h = 0, gd = 0, hd = 0;
    if (!(l >> n >> m >> g >> h >> gd >> hd)) fail("expected 'n m g h g_dot h_dot'");
    if (n < 1 || n > kMaxDegree || m < 0 || m > n) fail("degree/order out of range 1..12");
    model.g_[idx(n, m)] = g;
    model.h_[idx(n, m)] = h;
    model.gdot_[idx(n, m)] = gd;
    model.hdot_[idx(n, m)] = hd;
    model.max_n_ = std::max(model.max_n_, n);
  }
  if (!terminated) fail("missing the closing line of nines (truncated file?)");
  if (model.max_n_ < 1) fail("no coefficients");
  return model;
}

Model Model::load(const std::filesystem::path& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw_input_error(path.string(), "cannot read the magnetic model file");
  std::stringstream ss;
  ss << in.rdbuf();
  return parse(ss.str(), path.string());
}

Field Model::at(double lat_deg, double lon_deg, double height_km, double year) const {
  if (!(year >= epoch_ && year < valid_until())) {
    char buf[160];
    std::snprintf(buf, sizeof buf, "date %.3f is outside the validity of %s (%.1f to %.1f)", year,
                  name_.c_str(), epoch_, valid_until());
    throw_input_error(SourceLocation{"", 0, 0, "date"}, buf);
  }
  if (!(lat_deg >= -90 && lat_deg <= 90)) {
    throw_input_error(SourceLocation{"", 0, 0, "lat"}, "latitude must be within -90..90");
  }
  const double dt = year - epoch_;
  const double phi = lat_deg * kDegToRad, lambda = lon_deg * kDegToRad;

  // WMM report, eq. 17: geodetic (phi, h) -> geocentric spherical (phi', r) on WGS 84.
  const double e2 = kWgs84F * (2 - kWgs84F);
  const double sin_phi = std::sin(phi), cos_phi = std::cos(phi);
  const double rc = kWgs84A / std::sqrt(1 - e2 * sin_phi * sin_phi);
  const double p = (rc + height_km) * cos_phi;
  const double z = (rc * (1 - e2) + height_km) * sin_phi;
  const double r = std::hypot(p, z);
  const double phi_c = std::asin(z / r);

  // Schmidt semi-normalised associated Legendre functions P[n][m](sin phi') and their
  // derivatives with respect to colatitude theta, by the standard recursions.
  const int N = max_n_;
  const double ct = std::sin(phi_c);  // cos(theta)
  const double st = std::cos(phi_c);  // sin(theta)
  std::vector<double> P(idx(N, N) + 1, 0), dP(idx(N, N) + 1, 0);
  P[idx(0, 0)] = 1;
  dP[idx(0, 0)] = 0;
  for (int n = 1; n <= N; ++n) {
    // Sectoral terms.
    if (n == 1) {
      P[idx(1, 1)] = st;
      dP[idx(1, 1)] = ct;
    } else {
      double k = std::sqrt((2.0 * n - 1) / (2.0 * n));
      P[idx(n, n)] = k * st * P[idx(n - 1, n - 1)];
      dP[idx(n, n)] = k * (st * dP[idx(n - 1, n - 1)] + ct * P[idx(n - 1, n - 1)]);
    }
    for (int m = 0; m < n; ++m) {
      double a = (2.0 * n - 1) / std::sqrt(double(n * n - m * m));
      double b = n >= 2 ? std::sqrt(double((n - 1) * (n - 1) - m * m) / (n * n - m * m)) : 0;
      double p2 = (n >= 2 && m <= n - 2) ? P[idx(n - 2, m)] : 0;
      double dp2 = (n >= 2 && m <= n - 2) ? dP[idx(n - 2, m)] : 0;
      P[idx(n, m)] = a * ct * P[idx(n - 1, m)] - b * p2;
      dP[idx(n, m)] = a * (ct * dP[idx(n - 1, m)] - st * P[idx(n - 1, m)]) - b * dp2;
    }
  }

  // WMM report, eqs. 10-11: the field and its secular variation in spherical components.
  double Xs = 0, Ys = 0, Zs = 0, dXs = 0, dYs = 0, dZs = 0;
  for (int n = 1; n <= N; ++n) {
    double rr = std::pow(kRefRadiusKm / r, n + 2);
    for (int m = 0; m <= n; ++m) {
      int i = idx(n, m);
      double g = g_[i] + dt * gdot_[i], h = h_[i] + dt * hdot_[i];
      double cm = std::cos(m * lambda), sm = std::sin(m * lambda);
      double gc = g * cm + h * sm, gs = g * sm - h * cm;
      double dgc = gdot_[i] * cm + hdot_[i] * sm, dgs = gdot_[i] * sm - hdot_[i] * cm;
      Xs += rr * gc * dP[i];
      Ys += rr * m * gs * P[i];
      Zs -= rr * (n + 1) * gc * P[i];
      dXs += rr * dgc * dP[i];
      dYs += rr * m * dgs * P[i];
      dZs -= rr * (n + 1) * dgc * P[i];
    }
  }
  // Y' carries 1/cos(phi'); at the geographic poles the WMM report's special case applies, but
  // a map sheet never sits exactly on a pole: guard only against division by zero.
  double cpc = std::max(std::cos(phi_c), 1e-12);
  Ys /= cpc;
  dYs /= cpc;

  // WMM report, eq. 16: rotate from geocentric to geodetic (ellipsoidal) components.
  double psi = phi_c - phi;
  double cpsi = std::cos(psi), spsi = std::sin(psi);
  Field f;
  f.north_nT = Xs * cpsi - Zs * spsi;
  f.east_nT = Ys;
  f.down_nT = Xs * spsi + Zs * cpsi;
  double dX = dXs * cpsi - dZs * spsi, dY = dYs, dZ = dXs * spsi + dZs * cpsi;
  f.horizontal_nT = std::hypot(f.north_nT, f.east_nT);
  f.total_nT = std::hypot(f.horizontal_nT, f.down_nT);
  f.declination_deg = std::atan2(f.east_nT, f.north_nT) * kRadToDeg;
  f.inclination_deg = std::atan2(f.down_nT, f.horizontal_nT) * kRadToDeg;
  // WMM report, eq. 22: dD/dt = (X dY - Y dX) / H^2, dI/dt = (H dZ - Z dH) / F^2.
  double H2 = f.horizontal_nT * f.horizontal_nT;
  double dH = (f.north_nT * dX + f.east_nT * dY) / f.horizontal_nT;
  f.annual_change_deg = (f.north_nT * dY - f.east_nT * dX) / H2 * kRadToDeg;
  f.inclination_change_deg =
      (f.horizontal_nT * dZ - f.down_nT * dH) / (f.total_nT * f.total_nT) * kRadToDeg;
  return f;
}

}  // namespace sheetmill::geomag
