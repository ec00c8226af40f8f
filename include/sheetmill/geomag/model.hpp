#pragma once
// The World Magnetic Model (WMM), evaluated from a coefficient file in the model's published
// layout: a header "EPOCH NAME RELEASE-DATE", lines "n m g h g_dot h_dot" (nT, nT/yr) for
// 1 <= n <= 12, and a terminating line of nines.
//
// Model::at() follows the WMM technical report (NOAA NCEI / BGS, "The US/UK World Magnetic Model
// for 2025-2030"): geodetic -> geocentric spherical coordinates on WGS 84, Schmidt
// semi-normalised associated Legendre functions, the spherical harmonic sums to degree 12 for the
// main field and its secular variation, and the rotation back to the geodetic frame. A date
// outside [epoch, epoch + 5) is an input error, never an extrapolation.

#include <filesystem>
#include <string>
#include <vector>

namespace sheetmill::geomag {

// Field elements at a point; nT and nT/yr for components, degrees and degrees/yr for angles.
struct Field {
  double north_nT = 0;  // X
  double east_nT = 0;   // Y
  double down_nT = 0;   // Z
  double horizontal_nT = 0;
  double total_nT = 0;
  double declination_deg = 0;    // D, east positive
  double inclination_deg = 0;    // I, down positive
  double annual_change_deg = 0;  // dD/dt, east positive, degrees per year
  double inclination_change_deg = 0;
};

class Model {
 public:
  // Throws Error(input) naming the file for anything not in the published layout.
  static Model load(const std::filesystem::path& path);
  static Model parse(const std::string& text, const std::string& where);

  // lat/lon geodetic degrees (WGS 84), height above the ellipsoid in km, decimal year.
  Field at(double lat_deg, double lon_deg, double height_km, double decimal_year) const;

  double epoch() const { return epoch_; }
  double valid_until() const { return epoch_ + 5.0; }
  const std::string& name() const { return name_; }
  int max_degree() const { return max_n_; }

 private:
  double epoch_ = 0;
  std::string name_;
  int max_n_ = 0;
  // Indexed [n * (n + 1) / 2 + m].
  std::vector<double> g_, h_, gdot_, hdot_;
};

// "YYYY-MM-DD" (the day's start as a fraction of its year) or a decimal year ("2026.5").
// Throws Error(input) for anything else.
double decimal_year(const std::string& date);

}  // namespace sheetmill::geomag
