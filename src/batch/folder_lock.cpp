#include "sheetmill/batch/folder_lock.hpp"

#include <fcntl.h>
#include <fmt/format.h>
#include <sys/file.h>
#include <unistd.h>

#include <cerrno>
#include <climits>

#include "sheetmill/batch/stamp.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/core/log.hpp"

namespace sheetmill::batch {

namespace fs = std::filesystem;

namespace {

constexpr const char* kFolderLock = ".sheetmill-batch.lock";

std::string shard_lock_name(const Shard& s) {
  return fmt::format(".sheetmill-batch-{}-of-{}.lock", s.index, s.count);
}

int open_lock(const fs::path& p) {
  int fd = ::open(p.c_str(), O_RDWR | O_CREAT | O_CLOEXEC, 0666);
  if (fd < 0) throw_input_error(p.string(), "cannot create the batch lock: " + errno_text(errno));
  return fd;
}

std::string read_all(int fd) {
  std::string text;
  char buf[512];
  ssize_t n;
  off_t at = 0;
  while ((n = ::pread(fd, buf, sizeof buf, at)) > 0 && text.size() < 4096) {
    text.append(buf, static_cast<std::size_t>(n));
    at += n;
  }
  return text;
}

void write_holder(int fd, const std::string& what) {
  char host[HOST_NAME_MAX + 1] = "?";
  ::gethostname(host, sizeof host);
  host[HOST_NAME_MAX] = '\0';
  std::string text =
      fmt::format("pid={}\nhost={}\nstarted={}\nbatch={}\n", ::getpid(), host, utc_now_iso(), what);
  // Best effort: the lock itself is the flock, the text only says who holds it.
  if (::ftruncate(fd, 0) == 0) {
    ssize_t ignored = ::pwrite(fd, text.data(), text.size(), 0);
    (void)ignored;
  }
}

// Takes `op` (LOCK_EX or LOCK_SH) on `fd`; when it is taken, names the holder and throws, or
// waits. `holder()` says who holds it, read when needed.
template <class Holder>
void take(int fd, int op, const fs::path& dir, bool wait, Holder&& holder) {
  while (::flock(fd, op | LOCK_NB) != 0) {
    if (errno == EINTR) continue;
    if (errno != EWOULDBLOCK) {
      throw_input_error(dir.string(), "cannot lock the output folder: " + errno_text(errno));
    }
    std::string who = holder();
    if (!wait) {
      throw_input_error(dir.string(), "another batch is writing to this folder (" + who +
                                          "); wait for it to end, or pass --wait to queue "
                                          "behind it");
    }
    log::info("batch: waiting for the batch in {} to end ({})", dir.string(), who);
    while (::flock(fd, op) != 0) {
      if (errno != EINTR) {
        throw_input_error(dir.string(), "cannot lock the output folder: " + errno_text(errno));
      }
    }
    return;
  }
}

// Who holds the folder lock: its own text for a whole batch, else the shards whose lock files
// are held now.
std::string folder_holder(int folder_fd, const fs::path& dir) {
  std::string text = read_all(folder_fd);
  if (!text.empty()) return describe_lock_holder(text);
  std::string shards;
  std::error_code ec;
  for (fs::directory_iterator it(dir, ec), end; !ec && it != end; it.increment(ec)) {
    std::string name = it->path().filename().string();
    if (name.rfind(".sheetmill-batch-", 0) != 0 || name == kFolderLock) continue;
    int fd = ::open(it->path().c_str(), O_RDONLY | O_CLOEXEC);
    if (fd < 0) continue;
    if (::flock(fd, LOCK_EX | LOCK_NB) != 0) {
      shards += (shards.empty() ? "" : "; ") + describe_lock_holder(read_all(fd));
    } else {
      ::flock(fd, LOCK_UN);
    }
    ::close(fd);
  }
  return shards.empty() ? std::string("a batch that has not yet said who it is") : shards;
}

}  // namespace

std::string describe_lock_holder(const std::string& text) {
  auto field = [&](const std::string& key) {
    std::size_t at = text.find(key + "=");
    if (at == std::string::npos) return std::string("?");
    at += key.size() + 1;
    std::size_t end = text.find('\n', at);
    return text.substr(at, end == std::string::npos ? std::string::npos : end - at);
  };
  return fmt::format("pid {} on host {} since {}, {}", field("pid"), field("host"),
                     field("started"), field("batch"));
}

FolderLock::FolderLock(const fs::path& dir, const std::optional<Shard>& shard, bool wait) {
  folder_fd_ = open_lock(dir / kFolderLock);
  try {
    if (!shard) {
      take(folder_fd_, LOCK_EX, dir, wait, [&] { return folder_holder(folder_fd_, dir); });
      write_holder(folder_fd_, "whole batch");
      return;
    }
    take(folder_fd_, LOCK_SH, dir, wait, [&] { return folder_holder(folder_fd_, dir); });
    // Shared, so no whole batch holds it: any text is a killed one's, and would misname the
    // holder for the next whole batch.
    if (::ftruncate(folder_fd_, 0) != 0) log::debug("batch: could not clear the folder lock");
    shard_fd_ = open_lock(dir / shard_lock_name(*shard));
    take(shard_fd_, LOCK_EX, dir, wait, [&] { return describe_lock_holder(read_all(shard_fd_)); });
    write_holder(shard_fd_, fmt::format("shard {} of {}", shard->index, shard->count));
  } catch (...) {
    if (shard_fd_ >= 0) ::close(shard_fd_);
    ::close(folder_fd_);
    throw;
  }
}

FolderLock::~FolderLock() {
  // The holder's text goes before the lock does, so the next batch to find the folder locked
  // does not name one that has ended. Closing releases the locks.
  if (shard_fd_ >= 0) {
    if (::ftruncate(shard_fd_, 0) != 0) log::debug("batch: could not clear the shard lock");
    ::close(shard_fd_);
  } else if (folder_fd_ >= 0) {
    if (::ftruncate(folder_fd_, 0) != 0) log::debug("batch: could not clear the folder lock");
  }
  if (folder_fd_ >= 0) ::close(folder_fd_);
}

}  // namespace sheetmill::batch
