#pragma once
// The batch report: one record per selected sheet (status, time, warnings, output path and
// size, error), as JSON (with totals) and as CSV, both written atomically.

#include <filesystem>
#include <optional>
#include <string>

#include "sheetmill/batch/runner.hpp"
#include "sheetmill/batch/selection.hpp"

namespace sheetmill::batch {

struct ReportContext {
  std::string project;
  std::string program_version;
  std::optional<Shard> shard;
  int index_sheets = 0;  // sheets in the whole index
};

void write_report_json(const BatchResult& result, const ReportContext& context,
                       const std::filesystem::path& path);
void write_report_csv(const BatchResult& result, const std::filesystem::path& path);

}  // namespace sheetmill::batch
