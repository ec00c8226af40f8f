#include "sheetmill/core/atomic_file.hpp"

#include <fcntl.h>
#include <unistd.h>

#include <atomic>
#include <cerrno>
#include <cstring>

#include "sheetmill/core/error.hpp"

namespace sheetmill {

namespace fs = std::filesystem;

fs::path sibling_temp_path(const fs::path& target, const std::string& tag) {
  static std::atomic<unsigned> counter{0};
  fs::path dir = target.parent_path();
  std::string name = "." + target.filename().string() + "." + std::to_string(::getpid()) + "-" +
                     std::to_string(counter++) + "." + tag;
  return dir.empty() ? fs::path(name) : dir / name;
}

AtomicOutput::AtomicOutput(fs::path target) : target_(std::move(target)) {
  fs::path dir = target_.parent_path();
  if (!dir.empty() && !fs::is_directory(dir)) {
    throw_input_error(target_.string(), "output folder " + dir.string() + " does not exist");
  }
  temp_ = sibling_temp_path(target_);
}

AtomicOutput::~AtomicOutput() {
  if (!committed_) {
    std::error_code ec;
    fs::remove(temp_, ec);
  }
}

namespace {
void fsync_path(const fs::path& p, int flags) {
  int fd = ::open(p.c_str(), flags);
  if (fd >= 0) {
    ::fsync(fd);
    ::close(fd);
  }
}
}  // namespace

void AtomicOutput::commit() {
  if (committed_) return;
  if (!fs::exists(temp_)) throw_internal_error("nothing was written to " + temp_.string());
  fsync_path(temp_, O_RDONLY);
  if (::rename(temp_.c_str(), target_.c_str()) != 0) {
    throw_input_error(target_.string(), std::string("cannot write: ") + std::strerror(errno));
  }
  committed_ = true;
  fs::path dir = target_.parent_path();
  fsync_path(dir.empty() ? fs::path(".") : dir, O_RDONLY | O_DIRECTORY);
}

}  // namespace sheetmill
