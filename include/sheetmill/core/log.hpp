#pragma once
// Render log: warnings and progress for the person at the terminal, and a record a batch report
// can read back. Thread-safe. Messages are one line each, written to stderr.

#include <fmt/format.h>

#include <functional>
#include <string>
#include <vector>

namespace sheetmill::log {

enum class Level { debug = 0, info = 1, warning = 2, error = 3, quiet = 4 };

void set_level(Level level);
Level level();

void write(Level level, const std::string& message);

template <class... Args>
void info(fmt::format_string<Args...> f, Args&&... args) {
  write(Level::info, fmt::format(f, std::forward<Args>(args)...));
}
template <class... Args>
void warn(fmt::format_string<Args...> f, Args&&... args) {
  write(Level::warning, fmt::format(f, std::forward<Args>(args)...));
}
template <class... Args>
void debug(fmt::format_string<Args...> f, Args&&... args) {
  write(Level::debug, fmt::format(f, std::forward<Args>(args)...));
}

// Collects the warnings written on this thread while alive (for per-sheet batch reports).
class WarningCollector {
 public:
  WarningCollector();
  ~WarningCollector();
  WarningCollector(const WarningCollector&) = delete;
  WarningCollector& operator=(const WarningCollector&) = delete;
  const std::vector<std::string>& warnings() const { return warnings_; }

 private:
  friend void write(Level, const std::string&);
  std::vector<std::string> warnings_;
  WarningCollector* previous_;
};

}  // namespace sheetmill::log
