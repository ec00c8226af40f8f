#include "sheetmill/accuracy/run.hpp"

#include <filesystem>

#include "sheetmill/accuracy/report_page.hpp"
#include "sheetmill/accuracy/residuals_io.hpp"
#include "sheetmill/accuracy/summary.hpp"
#include "sheetmill/core/error.hpp"

namespace sheetmill::accuracy {

namespace {

// Output names are checked before any work, so a typo costs nothing and leaves nothing behind.
void check_extension(const std::string& path, std::initializer_list<const char*> allowed,
                     const char* what) {
  if (path.empty()) return;
  std::string ext = std::filesystem::path(path).extension().string();
  for (auto& c : ext) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  std::string list;
  for (const char* a : allowed) {
    if (ext == a) return;
    list += (list.empty() ? "" : " or ") + std::string(a);
  }
  throw_input_error(path, std::string("expected ") + what + " ending in " + list);
}

}  // namespace

AccuracyOutcome run_accuracy(const AccuracyRequest& request) {
  check_extension(request.residuals_out, {".csv", ".gpkg"}, "a residuals file");
  check_extension(request.report_out, {".pdf", ".png"}, "a report file");
  AccuracyOutcome out;
  out.assessment = assess_vertical(request.dem, request.points, request.options);
  if (request.map_positions) {
    out.assessment.horizontal =
        assess_horizontal(request.dem, request.points, *request.map_positions, request.options);
  }
  const Assessment& a = out.assessment;
  out.summary = summary_text(a);
  out.summary += "statement             " + vertical_statement(a, a.date) + "\n";
  if (a.horizontal) {
    out.summary += "                      " + horizontal_statement(*a.horizontal, a.date) + "\n";
  }
  if (!request.residuals_out.empty()) write_residuals(a, request.residuals_out);
  if (!request.report_out.empty()) write_report(a, request.report_out, request.options.dem);
  return out;
}

}  // namespace sheetmill::accuracy
