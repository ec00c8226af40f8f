#include "sheetmill/core/log.hpp"

#include <atomic>
#include <cstdio>
#include <mutex>

namespace sheetmill::log {

namespace {
std::atomic<Level> g_level{Level::info};
std::mutex g_mutex;
thread_local WarningCollector* t_collector = nullptr;
}  // namespace

void set_level(Level level) {
  g_level = level;
}
Level level() {
  return g_level;
}

void write(Level lvl, const std::string& message) {
  if (lvl == Level::warning && t_collector) t_collector->warnings_.push_back(message);
  if (static_cast<int>(lvl) < static_cast<int>(g_level.load())) return;
  const char* prefix = lvl == Level::warning ? "warning: " : lvl == Level::error ? "error: " : "";
  std::lock_guard lock(g_mutex);
  std::fprintf(stderr, "sheetmill: %s%s\n", prefix, message.c_str());
}

WarningCollector::WarningCollector() : previous_(t_collector) {
  t_collector = this;
}
WarningCollector::~WarningCollector() {
  t_collector = previous_;
}

}  // namespace sheetmill::log
