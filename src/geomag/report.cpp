#include "sheetmill/geomag/report.hpp"

#include <fmt/format.h>

namespace sheetmill::geomag {

std::string declination_report(const Model& model, const DeclinationQuery& q) {
  double year = decimal_year(q.date);
  Field f = model.at(q.lat_deg, q.lon_deg, q.height_km, year);
  return fmt::format(
      "{:.4f} declination in degrees, east positive\n"
      "{:.4f} annual change in degrees per year, east positive\n"
      "model {} (valid {:.1f} to {:.1f}), date {:.4f}, latitude {:.6f}, longitude {:.6f}, "
      "height {:.3f} km above the WGS 84 ellipsoid\n"
      "inclination {:.4f} deg, horizontal intensity {:.1f} nT, total intensity {:.1f} nT\n",
      f.declination_deg, f.annual_change_deg, model.name(), model.epoch(), model.valid_until(),
      year, q.lat_deg, q.lon_deg, q.height_km, f.inclination_deg, f.horizontal_nT, f.total_nT);
}

}  // namespace sheetmill::geomag
