#pragma once
// Running a batch: every job's sheet rendered by a pool of worker PROCESSES (forked once each;
// GDAL and fontconfig are safest one per process), with failure isolation, resumption and skips.
//
// Guarantees:
// - A sheet whose render throws, or whose worker dies (crash, out of memory), is reported as
//   failed and the batch goes on; a dead worker is replaced.
// - Outputs appear whole or not at all (the renderer writes atomically, the stamp is written
//   after the output and removed before a re-render), so killing the batch at any moment, even
//   with SIGKILL, leaves only complete outputs; a later run keeps every sheet whose stamp
//   matches its inputs and renders the rest. Leftover temporaries of a killed run are removed.
// - Workers die with the batch process (PR_SET_PDEATHSIG), so no orphan finishes a sheet
//   behind a rerun's back.
// - Memory: each worker holds one sheet at a time; the parent holds the job list and outcomes.

#include <sys/types.h>

#include <cstdint>
#include <filesystem>
#include <functional>
#include <string>
#include <vector>

#include "sheetmill/batch/input_digest.hpp"
#include "sheetmill/batch/sheet_job.hpp"
#include "sheetmill/render/render.hpp"

namespace sheetmill::batch {

enum class SheetStatus { rendered, up_to_date, failed };
const char* status_name(SheetStatus s);

struct SheetOutcome {
  std::string id;
  std::string name;
  SheetStatus status = SheetStatus::failed;
  double seconds = 0;      // wall time in the worker, digest included
  double cpu_seconds = 0;  // user + system CPU time of the worker for this sheet
  std::vector<std::string> warnings;
  std::string error;   // failed: one line
  std::string reason;  // rendered: why ("new", "changed: source:roads", "forced")
  std::filesystem::path output;
  std::uintmax_t output_bytes = 0;
  std::string digest;
  long worker_peak_rss_kib = 0;  // the worker's peak resident memory so far
  int worker = -1;               // worker slot
};

// What a worker does with a sheet. `digest` may be empty (then every sheet is rendered and no
// stamp written); `render` must write job.output atomically.
struct SheetTasks {
  std::function<SheetDigest(const SheetJob&)> digest;
  std::function<render::RenderReport(const SheetJob&)> render;
};
// Called once in each worker process, after the fork: opens what the worker keeps for all its
// sheets (datasets, fonts, caches).
using WorkerSetup = std::function<SheetTasks()>;

enum class ProgressMode { automatic, bar, lines, none };

struct RunOptions {
  int workers = 0;     // 0 = the CPUs this process may use
  bool force = false;  // render even when up to date
  std::string program_version;
  ProgressMode progress = ProgressMode::automatic;
  // Called in the parent as each sheet finishes (for tests and reporting); may be empty.
  std::function<void(const SheetOutcome&)> on_outcome;
};

struct BatchResult {
  std::vector<SheetOutcome> outcomes;  // in the order of the jobs
  double seconds = 0;
  int workers = 0;
  int count(SheetStatus s) const;
};

// Processes one sheet in the calling process: digest, skip if up to date, else clean leftover
// temporaries, remove the stamp, render, stamp. Never throws for a sheet's own failure.
SheetOutcome process_sheet(const SheetJob& job, SheetTasks& tasks, const RunOptions& options);

// Renders `jobs` (outputs already set, unique) on worker processes. Throws only for
// environment faults (cannot fork or make pipes).
BatchResult run_batch(const std::vector<SheetJob>& jobs, const WorkerSetup& setup,
                      const RunOptions& options);

// The CPUs this process may run on (affinity mask; SLURM_CPUS_PER_TASK when smaller).
int usable_cpus();

}  // namespace sheetmill::batch
