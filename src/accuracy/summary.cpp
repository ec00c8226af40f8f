#include "sheetmill/accuracy/summary.hpp"

#include <fmt/format.h>

#include <cmath>

namespace sheetmill::accuracy {

std::string format_metres(double m) {
  if (!std::isfinite(m)) return "n/a";
  double a = std::abs(m);
  int decimals = a >= 100 ? 0 : a >= 10 ? 1 : a >= 1 ? 2 : 3;
  return fmt::format("{:.{}f}", m, decimals);
}

namespace {

// Contour intervals as people write them, to three significant digits: 10, 2.5, 0.08, 24.1.
std::string interval_text(double m) {
  return fmt::format("{:.3g}", m);
}

std::string signed_metres(double m) {
  return (m >= 0 ? "+" : "") + format_metres(m);
}

void vertical_block(std::string& out, const VerticalStats& s, const char* indent) {
  out += fmt::format("{}mean error (bias)     {} m   (DEM minus check point)\n", indent,
                     signed_metres(s.mean_m));
  out += fmt::format("{}standard deviation    {} m\n", indent, format_metres(s.sd_m));
  out += fmt::format("{}RMSE_z                {} m\n", indent, format_metres(s.rmse_m));
}

}  // namespace

std::string summary_text(const Assessment& a) {
  std::string out;
  out += fmt::format("Accuracy of {} against {} (layer {}, heights from {})\n", a.dem_path,
                     a.points_path, a.points_layer, a.height_field);
  std::size_t refused = a.residuals.size() - a.used;
  out += fmt::format(
      "check points          {} read, {} used, {} refused ({} outside the DEM, {} on nodata, {} "
      "duplicate, {} without height)\n",
      a.residuals.size(), a.used, refused, a.outside, a.nodata, a.duplicate, a.no_height);
  vertical_block(out, a.all, "");
  out += fmt::format(
      "NSSDA Accuracy_z      {} m at 95 % confidence (1.9600 x RMSE_z, "
      "FGDC-STD-007.3-1998)\n",
      format_metres(a.all.nssda_95_m));
  if (a.used < kNssdaMinimumPoints) {
    out +=
        fmt::format("                      (from {} points; the standard asks for at least {})\n",
                    a.used, kNssdaMinimumPoints);
  }
  if (a.has_cover) {
    out += fmt::format("non-vegetated ground  {} points\n", a.non_vegetated.count);
    if (a.non_vegetated.count > 0) {
      vertical_block(out, a.non_vegetated, "  ");
      out += fmt::format("  NVA                 {} m at 95 % (1.96 x RMSE_z, ASPRS 2014)\n",
                         format_metres(a.non_vegetated.nssda_95_m));
    }
    out += fmt::format("vegetated ground      {} points\n", a.vegetated.count);
    if (a.vegetated.count > 0) {
      out += fmt::format("  VVA                 {} m (95th percentile of |error|, ASPRS 2014)\n",
                         format_metres(a.vegetated.abs_p95_m));
    }
  }
  double ci = a.all.nmas_interval_m;
  out += fmt::format(
      "NMAS 1947 interval    {} m or more (90 % of points within half an interval); "
      "finest usual interval {} m\n",
      interval_text(ci), interval_text(usual_interval_at_least(ci)));
  out += "outliers beyond 3 SD  ";
  if (a.outlier_ids.empty()) out += "none";
  for (std::size_t i = 0; i < a.outlier_ids.size(); ++i) {
    out += (i ? ", " : "") + a.outlier_ids[i];
  }
  out += "\n";
  if (a.all.max_abs_m == 0) {
    out +=
        "note                  every used check point equals the DEM exactly; the check points "
        "are not independent of the DEM\n";
  }
  if (a.horizontal) {
    const HorizontalStats& h = a.horizontal->stats;
    out += fmt::format("horizontal            {} points matched by ID, {} unmatched (in {})\n",
                       h.count, a.horizontal->unmatched, a.horizontal->crs_name);
    out += fmt::format("  RMSE_x {} m, RMSE_y {} m, RMSE_r {} m\n", format_metres(h.rmse_x_m),
                       format_metres(h.rmse_y_m), format_metres(h.rmse_r_m));
    out += fmt::format(
        "  NSSDA Accuracy_r    {} m at 95 % confidence (2.4477 x 0.5 x (RMSE_x + "
        "RMSE_y), Appendix 3-A){}\n",
        format_metres(h.nssda_95_m),
        h.approximation_holds() ? ""
                                : "; RMSE_min/RMSE_max below 0.6, outside the "
                                  "range where the approximation holds");
  }
  return out;
}

std::string vertical_statement(const Assessment& a, const std::string& date) {
  return fmt::format(
      "Tested {} metres vertical accuracy at 95 % confidence level (NSSDA; {} check "
      "points, {}).",
      format_metres(a.all.nssda_95_m), a.used, date);
}

std::string horizontal_statement(const HorizontalAssessment& h, const std::string& date) {
  return fmt::format(
      "Tested {} metres horizontal accuracy at 95 % confidence level (NSSDA; {} "
      "check points, {}).",
      format_metres(h.stats.nssda_95_m), h.stats.count, date);
}

std::optional<std::string> interval_warning(const Assessment& a, double interval_m) {
  if (!(interval_m > 0) || interval_m >= a.all.nmas_interval_m) return std::nullopt;
  return fmt::format(
      "WARNING: the {} m contour interval is finer than the {} m the DEM supports by the 1947 "
      "National Map Accuracy Standards (more than 10 % of the {} check points are in error by "
      "more than {} m, half the interval); read the contours as approximate.",
      interval_text(interval_m), interval_text(a.all.nmas_interval_m), a.used,
      interval_text(interval_m / 2));
}

}  // namespace sheetmill::accuracy
