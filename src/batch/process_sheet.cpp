// One sheet in one worker: decide, clean up, render, stamp.
#include <sys/resource.h>

#include <algorithm>
#include <chrono>

#include "sheetmill/batch/runner.hpp"
#include "sheetmill/batch/stamp.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"

namespace sheetmill::batch {

namespace fs = std::filesystem;

const char* status_name(SheetStatus s) {
  switch (s) {
    case SheetStatus::rendered:
      return "rendered";
    case SheetStatus::up_to_date:
      return "up-to-date";
    case SheetStatus::failed:
      return "failed";
  }
  return "failed";
}

int BatchResult::count(SheetStatus s) const {
  int n = 0;
  for (const auto& o : outcomes) n += o.status == s;
  return n;
}

namespace {

double cpu_seconds_now() {
  rusage u{};
  ::getrusage(RUSAGE_SELF, &u);
  return double(u.ru_utime.tv_sec + u.ru_stime.tv_sec) +
         double(u.ru_utime.tv_usec + u.ru_stime.tv_usec) * 1e-6;
}

long peak_rss_kib() {
  rusage u{};
  ::getrusage(RUSAGE_SELF, &u);
  return u.ru_maxrss;  // Linux: kilobytes
}

std::string change_reason(const std::optional<Stamp>& old, const SheetDigest& now) {
  if (!old) return "new";
  std::string changed;
  for (const auto& [k, v] : now.parts) {
    auto it = old->parts.find(k);
    if (it == old->parts.end() || it->second != v) changed += (changed.empty() ? "" : ", ") + k;
  }
  for (const auto& [k, v] : old->parts) {
    if (!now.parts.count(k)) changed += (changed.empty() ? "" : ", ") + k;
  }
  return changed.empty() ? "output missing or altered" : "changed: " + changed;
}

}  // namespace

SheetOutcome process_sheet(const SheetJob& job, SheetTasks& tasks, const RunOptions& options) {
  auto t0 = std::chrono::steady_clock::now();
  double cpu0 = cpu_seconds_now();
  SheetOutcome o;
  o.id = job.id;
  o.name = job.name;
  o.output = job.output;
  log::WarningCollector warnings;
  try {
    std::error_code ec;
    fs::create_directories(job.output.parent_path(), ec);
    SheetDigest digest;
    if (tasks.digest) {
      digest = tasks.digest(job);
      o.digest = digest.hex;
      if (!options.force && is_up_to_date(job.output, digest.hex)) {
        o.status = SheetStatus::up_to_date;
        o.output_bytes = fs::file_size(job.output, ec);
      }
    }
    if (o.status != SheetStatus::up_to_date) {
      std::optional<Stamp> old = tasks.digest ? read_stamp(job.output) : std::nullopt;
      o.reason = options.force ? "forced" : change_reason(old, digest);
      // No stamp may vouch for the old output while the new one is being made.
      remove_stamp(job.output);
      auto r0 = std::chrono::steady_clock::now();
      render::RenderReport report = tasks.render(job);
      for (const auto& w : report.warnings) o.warnings.push_back(w);
      if (!fs::is_regular_file(job.output, ec)) {
        throw_internal_error("the renderer reported success but wrote no " + job.output.string());
      }
      o.output_bytes = fs::file_size(job.output, ec);
      if (tasks.digest) {
        Stamp s;
        s.sheet_id = job.id;
        s.digest = digest.hex;
        s.parts = digest.parts;
        s.output_bytes = o.output_bytes;
        s.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - r0).count();
        s.rendered_utc = utc_now_iso();
        s.program_version = options.program_version;
        write_stamp(job.output, s);
      }
      o.status = SheetStatus::rendered;
    }
  } catch (const Error& e) {
    o.status = SheetStatus::failed;
    o.error = e.what();
  } catch (const std::exception& e) {
    o.status = SheetStatus::failed;
    o.error = std::string("internal error: ") + e.what();
  }
  // Warnings logged during the sheet that the render report did not already carry.
  for (const auto& w : warnings.warnings()) {
    if (std::find(o.warnings.begin(), o.warnings.end(), w) == o.warnings.end()) {
      o.warnings.push_back(w);
    }
  }
  o.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
  o.cpu_seconds = cpu_seconds_now() - cpu0;
  o.worker_peak_rss_kib = peak_rss_kib();
  return o;
}

}  // namespace sheetmill::batch
