#pragma once
// The text `sheetmill declination` prints: the declination in decimal degrees (east positive) as
// the first number of the first line, the annual change as the first number of the second line,
// then where and when the values hold.

#include <string>

#include "sheetmill/geomag/model.hpp"

namespace sheetmill::geomag {

struct DeclinationQuery {
  double lat_deg = 0;
  double lon_deg = 0;
  double height_km = 0;
  std::string date;  // YYYY-MM-DD or decimal year
};

// Evaluates `model` for the query and formats the report. Throws Error(input) for a bad date or
// one outside the model's validity.
std::string declination_report(const Model& model, const DeclinationQuery& query);

}  // namespace sheetmill::geomag
