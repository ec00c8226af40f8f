#include "sheetmill/core/temp_registry.hpp"

#include <limits.h>
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <atomic>
#include <cstring>

namespace sheetmill {

namespace {

// A slot is claimed with a compare-exchange on `state` (free -> writing), filled, then
// published (writing -> live). The handler only touches live slots.
enum SlotState : int { kFree = 0, kWriting = 1, kLive = 2 };

struct TempSlot {
  std::atomic<int> state{kFree};
  char path[PATH_MAX];
};

constexpr int kTempSlots = 256;   // a batch worker holds two or three at a time
constexpr int kChildSlots = 512;  // batch workers
TempSlot g_temps[kTempSlots];
std::atomic<pid_t> g_children[kChildSlots];

static_assert(std::atomic<int>::is_always_lock_free && std::atomic<pid_t>::is_always_lock_free,
              "the signal handler needs lock-free atomics");

void on_signal(int sig) {
  int saved_errno = errno;
  for (TempSlot& s : g_temps) {
    if (s.state.load(std::memory_order_acquire) == kLive) ::unlink(s.path);
  }
  // Children clean up their own temporaries in their own handler; wait so that they finish
  // before this process's death sends them SIGKILL (PR_SET_PDEATHSIG in batch workers).
  for (auto& c : g_children) {
    pid_t pid = c.load(std::memory_order_acquire);
    if (pid > 0) ::kill(pid, SIGTERM);
  }
  for (auto& c : g_children) {
    pid_t pid = c.load(std::memory_order_acquire);
    if (pid > 0) ::waitpid(pid, nullptr, 0);
  }
  struct sigaction dfl {};
  dfl.sa_handler = SIG_DFL;
  sigemptyset(&dfl.sa_mask);
  ::sigaction(sig, &dfl, nullptr);
  errno = saved_errno;
  ::raise(sig);
}

}  // namespace

void install_temp_cleanup_on_signals() {
  struct sigaction sa {};
  sa.sa_handler = on_signal;
  sigemptyset(&sa.sa_mask);
  // While cleaning up for one signal, the others wait.
  for (int sig : {SIGINT, SIGTERM, SIGHUP}) sigaddset(&sa.sa_mask, sig);
  for (int sig : {SIGINT, SIGTERM, SIGHUP}) ::sigaction(sig, &sa, nullptr);
}

int register_temp(const std::filesystem::path& path) {
  std::error_code ec;
  std::filesystem::path abs = std::filesystem::absolute(path, ec);
  const std::string& text = (ec ? path : abs).native();
  if (text.size() >= PATH_MAX) return -1;
  for (int i = 0; i < kTempSlots; ++i) {
    int expected = kFree;
    if (g_temps[i].state.compare_exchange_strong(expected, kWriting, std::memory_order_acq_rel)) {
      std::memcpy(g_temps[i].path, text.c_str(), text.size() + 1);
      g_temps[i].state.store(kLive, std::memory_order_release);
      return i;
    }
  }
  return -1;
}

void unregister_temp(int slot) {
  if (slot >= 0 && slot < kTempSlots) g_temps[slot].state.store(kFree, std::memory_order_release);
}

void register_child(pid_t pid) {
  for (auto& c : g_children) {
    pid_t expected = 0;
    if (c.compare_exchange_strong(expected, pid, std::memory_order_acq_rel)) return;
  }
}

void unregister_child(pid_t pid) {
  for (auto& c : g_children) {
    pid_t expected = pid;
    if (c.compare_exchange_strong(expected, 0, std::memory_order_acq_rel)) return;
  }
}

void forget_inherited_temps_and_children() {
  for (TempSlot& s : g_temps) s.state.store(kFree, std::memory_order_release);
  for (auto& c : g_children) c.store(0, std::memory_order_release);
}

int registered_temp_count() {
  int n = 0;
  for (TempSlot& s : g_temps) n += s.state.load(std::memory_order_acquire) == kLive;
  return n;
}

}  // namespace sheetmill
