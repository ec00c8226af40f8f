#pragma once
// Strips of one relief repeat the same DEM warning ("covers 74 % of this window") once per
// strip. While a RepeatFilter lives, warnings on this thread are collected instead of printed
// (the log level is raised to error); on destruction each distinct warning is written once.
// Not for use across threads.

#include <algorithm>
#include <string>
#include <vector>

#include "sheetmill/core/log.hpp"

namespace sheetmill::exhibit::detail {

class RepeatFilter {
 public:
  RepeatFilter() : level_(log::level()) {
    if (level_ < log::Level::error) log::set_level(log::Level::error);
  }
  ~RepeatFilter() {
    log::set_level(level_);
    std::vector<std::string> seen;
    // A copy: writing a warning appends it to collector_, which is still this thread's.
    const std::vector<std::string> all = collector_.warnings();
    for (const std::string& w : all) {
      if (std::find(seen.begin(), seen.end(), w) != seen.end()) continue;
      seen.push_back(w);
      if (level_ <= log::Level::warning) log::write(log::Level::warning, w);
    }
  }
  RepeatFilter(const RepeatFilter&) = delete;
  RepeatFilter& operator=(const RepeatFilter&) = delete;

 private:
  log::Level level_;
  log::WarningCollector collector_;
};

}  // namespace sheetmill::exhibit::detail
