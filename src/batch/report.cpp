#include "sheetmill/batch/report.hpp"

#include <fmt/format.h>

#include <algorithm>

#include "sheetmill/batch/json_text.hpp"
#include "sheetmill/batch/stamp.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"

namespace sheetmill::batch {

namespace fs = std::filesystem;

void write_report_json(const BatchResult& r, const ReportContext& c, const fs::path& path) {
  long peak = 0;
  double sheet_seconds = 0, sheet_cpu = 0;
  for (const auto& o : r.outcomes) {
    peak = std::max(peak, o.worker_peak_rss_kib);
    if (o.status == SheetStatus::rendered) {
      sheet_seconds += o.seconds;
      sheet_cpu += o.cpu_seconds;
    }
  }
  int rendered = r.count(SheetStatus::rendered);
  std::string t = "{\n";
  t += "  \"format\": \"sheetmill-batch-report-1\",\n";
  t += "  \"project\": " + json_quote(c.project) + ",\n";
  t += "  \"program_version\": " + json_quote(c.program_version) + ",\n";
  t += "  \"finished_utc\": " + json_quote(utc_now_iso()) + ",\n";
  t += c.shard ? fmt::format("  \"shard\": {{\"number\": {}, \"count\": {}}},\n", c.shard->number(),
                             c.shard->count)
               : "  \"shard\": null,\n";
  t += fmt::format("  \"index_sheets\": {},\n  \"selected\": {},\n", c.index_sheets,
                   r.outcomes.size());
  t += fmt::format("  \"rendered\": {},\n  \"up_to_date\": {},\n  \"failed\": {},\n", rendered,
                   r.count(SheetStatus::up_to_date), r.count(SheetStatus::failed));
  t += fmt::format("  \"workers\": {},\n  \"seconds\": {:.3f},\n", r.workers, r.seconds);
  t += fmt::format("  \"sheets_per_minute\": {:.2f},\n",
                   r.seconds > 0 ? rendered / r.seconds * 60.0 : 0.0);
  t += fmt::format("  \"mean_seconds_per_rendered_sheet\": {:.3f},\n",
                   rendered ? sheet_seconds / rendered : 0.0);
  t += fmt::format("  \"mean_cpu_seconds_per_rendered_sheet\": {:.3f},\n",
                   rendered ? sheet_cpu / rendered : 0.0);
  t += fmt::format("  \"peak_worker_rss_kib\": {},\n", peak);
  t += "  \"sheets\": [";
  for (std::size_t i = 0; i < r.outcomes.size(); ++i) {
    const SheetOutcome& o = r.outcomes[i];
    t += i ? ",\n    {" : "\n    {";
    t += "\"id\": " + json_quote(o.id) + ", \"name\": " + json_quote(o.name);
    t += ", \"status\": " + json_quote(status_name(o.status));
    t += fmt::format(", \"seconds\": {:.3f}, \"cpu_seconds\": {:.3f}", o.seconds, o.cpu_seconds);
    t += ", \"output\": " + json_quote(o.output.string());
    t += fmt::format(", \"output_bytes\": {}", o.output_bytes);
    t += ", \"reason\": " + json_quote(o.reason);
    t += ", \"error\": " + json_quote(o.error);
    t += fmt::format(", \"worker\": {}, \"worker_peak_rss_kib\": {}", o.worker,
                     o.worker_peak_rss_kib);
    t += ", \"warnings\": [";
    for (std::size_t k = 0; k < o.warnings.size(); ++k) {
      t += (k ? ", " : "") + json_quote(o.warnings[k]);
    }
    t += "]}";
  }
  t += "\n  ]\n}\n";
  write_file_atomically(path, t);
}

void write_report_csv(const BatchResult& r, const fs::path& path) {
  std::string t = "id,name,status,seconds,cpu_seconds,warnings,output,output_bytes,reason,error\n";
  for (const auto& o : r.outcomes) {
    std::string warnings;
    for (const auto& w : o.warnings) warnings += (warnings.empty() ? "" : " | ") + w;
    t += csv_field(o.id) + "," + csv_field(o.name) + "," + status_name(o.status) + "," +
         fmt::format("{:.3f},{:.3f}", o.seconds, o.cpu_seconds) + "," + csv_field(warnings) + "," +
         csv_field(o.output.string()) + "," + std::to_string(o.output_bytes) + "," +
         csv_field(o.reason) + "," + csv_field(o.error) + "\n";
  }
  write_file_atomically(path, t);
}

}  // namespace sheetmill::batch
