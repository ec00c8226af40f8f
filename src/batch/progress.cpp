#include "sheetmill/batch/progress.hpp"

#include <fmt/format.h>
#include <unistd.h>

#include <cmath>
#include <cstdio>

#include "sheetmill/batch/json_text.hpp"
#include "sheetmill/core/log.hpp"

namespace sheetmill::batch {

namespace {
std::string duration_text(double s) {
  long t = std::lround(s);
  if (t >= 3600) return fmt::format("{} h {:02} min", t / 3600, (t % 3600) / 60);
  if (t >= 60) return fmt::format("{} min {:02} s", t / 60, t % 60);
  return fmt::format("{} s", t);
}
}  // namespace

Progress::Progress(int total, ProgressMode mode)
    : total_(total), start_(std::chrono::steady_clock::now()), last_draw_(start_) {
  bool quiet = log::level() > log::Level::info;
  if (mode == ProgressMode::automatic) mode = ::isatty(2) ? ProgressMode::bar : ProgressMode::lines;
  bar_ = mode == ProgressMode::bar && !quiet;
  lines_ = mode == ProgressMode::lines && !quiet;
}

std::string Progress::summary(int done, int total, double elapsed_s) {
  std::string s = fmt::format("{}/{} sheets", done, total);
  if (done > 0 && elapsed_s > 0) {
    s += fmt::format("  {:.1f}/min", done / elapsed_s * 60.0);
    if (done < total) s += "  " + duration_text(elapsed_s / done * (total - done)) + " left";
  }
  return s;
}

void Progress::draw() {
  double elapsed = std::chrono::duration<double>(std::chrono::steady_clock::now() - start_).count();
  constexpr int kWidth = 30;
  int filled = total_ > 0 ? done_ * kWidth / total_ : kWidth;
  std::string bar(static_cast<std::size_t>(filled), '#');
  bar.resize(kWidth, '.');
  std::string failed = failed_ ? fmt::format("  {} failed", failed_) : "";
  std::fprintf(stderr, "\r\033[K[%s] %s%s", bar.c_str(), summary(done_, total_, elapsed).c_str(),
               failed.c_str());
  std::fflush(stderr);
  last_draw_ = std::chrono::steady_clock::now();
}

void Progress::sheet_done(const SheetOutcome& o) {
  ++done_;
  failed_ += o.status == SheetStatus::failed;
  if (bar_) {
    if (o.status == SheetStatus::failed) {
      std::fprintf(stderr, "\r\033[K");
      log::warn("sheet {} failed: {}", display_text(o.id), display_text(o.error));
    }
    draw();
  } else if (lines_) {
    double elapsed =
        std::chrono::duration<double>(std::chrono::steady_clock::now() - start_).count();
    std::string what =
        o.status == SheetStatus::failed
            ? "failed: " + display_text(o.error)
            : fmt::format(
                  "{} in {:.1f} s{}", status_name(o.status), o.seconds,
                  o.warnings.empty() ? "" : fmt::format(" ({} warnings)", o.warnings.size()));
    log::info("batch: {} {}  [{}]", display_text(o.id), what, summary(done_, total_, elapsed));
  }
}

void Progress::tick() {
  if (bar_ && std::chrono::steady_clock::now() - last_draw_ > std::chrono::seconds(1)) draw();
}

void Progress::finish() {
  if (bar_) {
    draw();
    std::fprintf(stderr, "\n");
  }
}

}  // namespace sheetmill::batch
