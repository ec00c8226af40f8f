#pragma once
// `sheetmill batch`: the whole batch for a project, as the CLI runs it and tests call it.
//
// Reads the project's tile index, names every sheet's output from output.file_names (checking
// the names of ALL index sheets before anything is written), selects and shards, renders on
// worker processes, writes the batch report (JSON and CSV) and optionally one merged PDF.
// Returns 0 when every selected sheet is rendered or up to date, 3 when some failed (the
// others are still rendered). Bad input throws Error(input) before any sheet starts.

#include <filesystem>
#include <optional>
#include <string>

#include "sheetmill/batch/runner.hpp"
#include "sheetmill/batch/selection.hpp"

namespace sheetmill::batch {

inline constexpr int kExitSheetsFailed = 3;

struct BatchRequest {
  std::filesystem::path project;
  std::filesystem::path output_dir;  // empty = "sheets" beside the project file
  int workers = 0;                   // 0 = every usable CPU
  Selection selection;
  std::optional<std::string> shard;  // "K/N" or "auto/N"
  bool force = false;
  bool list_only = false;            // print ID, status and output per sheet; render none
  std::filesystem::path merged_pdf;  // empty = none; relative = inside output_dir
  ProgressMode progress = ProgressMode::automatic;
  // Another batch holds the output folder (batch/folder_lock.hpp): wait for it instead of
  // exiting 2.
  bool wait_for_lock = false;
};

int run_batch_command(const BatchRequest& request);

// The report files of a run: "batch-report" or, for a shard, "batch-report-K-of-N".
std::string report_stem(const std::optional<Shard>& shard);

}  // namespace sheetmill::batch
