#include <charconv>
#include <cstdio>

#include "sheetmill/core/error.hpp"
#include "sheetmill/geomag/model.hpp"

namespace sheetmill::geomag {

namespace {
bool leap(int y) {
  return (y % 4 == 0 && y % 100 != 0) || y % 400 == 0;
}
}  // namespace

double decimal_year(const std::string& date) {
  auto bad = [&]() -> double {
    throw_input_error(SourceLocation{"", 0, 0, "date"},
                      "'" + date + "' is not a date (expected YYYY-MM-DD or a decimal year)");
  };
  int y = 0, m = 0, d = 0;
  char tail = 0;
  if (date.size() == 10 && std::sscanf(date.c_str(), "%4d-%2d-%2d%c", &y, &m, &d, &tail) == 3) {
    static const int days[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    if (m < 1 || m > 12) return bad();
    int dim = days[m - 1] + (m == 2 && leap(y) ? 1 : 0);
    if (d < 1 || d > dim) return bad();
    int doy = d - 1;
    for (int i = 0; i < m - 1; ++i) doy += days[i] + (i == 1 && leap(y) ? 1 : 0);
    return y + doy / (leap(y) ? 366.0 : 365.0);
  }
  double v = 0;
  auto [ptr, ec] = std::from_chars(date.data(), date.data() + date.size(), v);
  if (ec != std::errc() || ptr != date.data() + date.size() || v < 1900 || v > 2200) return bad();
  return v;
}

}  // namespace sheetmill::geomag
