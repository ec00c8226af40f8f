#include "sheetmill/sheet/dms.hpp"

#include <cmath>
#include <cstdio>

namespace sheetmill::sheet {

std::string format_dms(double degrees, AngleKind kind, double resolution_arcsec) {
  bool negative = degrees < 0;
  double res = resolution_arcsec >= 3600 ? 3600 : resolution_arcsec >= 60 ? 60 : 1;
  long long total = std::llround(std::abs(degrees) * 3600.0 / res) * static_cast<long long>(res);
  long long d = total / 3600, m = (total / 60) % 60, s = total % 60;
  char buf[64];
  if (res >= 3600) {
    std::snprintf(buf, sizeof buf, "%lld\u00B0", d);
  } else if (res >= 60) {
    std::snprintf(buf, sizeof buf, "%lld\u00B0%02lld\u2032", d, m);
  } else {
    std::snprintf(buf, sizeof buf, "%lld\u00B0%02lld\u2032%02lld\u2033", d, m, s);
  }
  std::string out = buf;
  if (total == 0) return out;
  switch (kind) {
    case AngleKind::latitude:
      out += negative ? " S" : " N";
      break;
    case AngleKind::longitude:
      out += negative ? " W" : " E";
      break;
    case AngleKind::plain:
      if (negative) out = "-" + out;
      break;
  }
  return out;
}

std::string format_east_west(double degrees, int decimals) {
  char buf[64];
  double shown = std::abs(degrees);
  std::snprintf(buf, sizeof buf, "%.*f\u00B0", decimals, shown);
  std::string out = buf;
  double unit = std::pow(10.0, -decimals) / 2;
  if (shown < unit) return out;
  return out + (degrees < 0 ? " W" : " E");
}

}  // namespace sheetmill::sheet
