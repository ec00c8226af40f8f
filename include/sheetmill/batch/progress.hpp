#pragma once
// Progress of a batch on stderr: a one-line bar redrawn in place on a terminal (done/total,
// rate, time left), or one plain log line per finished sheet otherwise (logs, job schedulers).

#include <chrono>
#include <string>

#include "sheetmill/batch/runner.hpp"

namespace sheetmill::batch {

class Progress {
 public:
  Progress(int total, ProgressMode mode);
  void sheet_done(const SheetOutcome& o);
  // Redraws the bar (time left changes even when no sheet finishes).
  void tick();
  void finish();

  // "12/40 sheets  3.1/min  4 min 10 s left" (no bar); exposed for tests.
  static std::string summary(int done, int total, double elapsed_s);

 private:
  void draw();
  int total_;
  int done_ = 0;
  int failed_ = 0;
  bool bar_ = false;
  bool lines_ = false;
  std::chrono::steady_clock::time_point start_;
  std::chrono::steady_clock::time_point last_draw_;
};

}  // namespace sheetmill::batch
