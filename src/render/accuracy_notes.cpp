#include "render/accuracy_notes.hpp"

#include <fmt/format.h>

#include "sheetmill/accuracy/assess.hpp"
#include "sheetmill/accuracy/summary.hpp"
#include "sheetmill/core/log.hpp"

namespace sheetmill::render {

std::vector<std::string> accuracy_notes(const project::Project& project, double interval_m) {
  if (!project.accuracy) return {};
  const project::AccuracyCheck& check = *project.accuracy;
  accuracy::CheckPointSource src;
  src.path = check.points;
  src.layer = check.layer;
  src.height_field = check.height_field;
  src.id_field = check.id_field;
  src.crs = check.crs;
  src.cover_field = check.cover_field;
  src.height_unit_m = accuracy::height_unit_metres(check.height_unit, "accuracy.height_unit");
  accuracy::AssessOptions options;
  options.dem.assumed_crs = project.elevation.crs;
  options.dem.vertical_unit = project.elevation.vertical_unit;
  options.vegetated_classes = check.vegetated;
  // The statement's date: the test's when stated, else the sheet's revision, so a sheet renders
  // the same on every day.
  options.date = check.date.value_or(project.revision_date);
  accuracy::Assessment a = accuracy::assess_vertical(project.elevation.dem, src, options);
  std::vector<std::string> notes{"Vertical accuracy: " + accuracy::vertical_statement(a, a.date)};
  if (a.has_cover && a.vegetated.count > 0) {
    notes.back() += fmt::format(
        " Vegetated ground: {} m at the 95th percentile (ASPRS 2014; {} "
        "points).",
        accuracy::format_metres(a.vegetated.abs_p95_m), a.vegetated.count);
  }
  if (a.all.max_abs_m == 0) {
    notes.back() += " Every check point equals the DEM exactly, so they do not test it.";
  }
  if (auto warning = accuracy::interval_warning(a, interval_m)) {
    log::warn("{}", *warning);
    notes.push_back(*warning);
  }
  return notes;
}

}  // namespace sheetmill::render
