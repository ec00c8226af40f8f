#include "support/tiny_fs.hpp"

#include <fcntl.h>
#include <sched.h>
#include <sys/mount.h>
#include <sys/wait.h>
#include <unistd.h>

#include <algorithm>
#include <cerrno>
#include <cstdlib>
#include <cstring>
#include <fstream>
#include <vector>

namespace sheetmill::test {

namespace fs = std::filesystem;

namespace {

constexpr int kUnavailable = 77;

bool write_file(const char* path, const std::string& text) {
  int fd = ::open(path, O_WRONLY | O_CLOEXEC);
  if (fd < 0) return false;
  bool ok = ::write(fd, text.data(), text.size()) == static_cast<ssize_t>(text.size());
  ::close(fd);
  return ok;
}

// In the child: a private mount namespace (as root), else a user namespace mapping us to root.
std::string enter_namespace() {
  uid_t uid = ::getuid();
  gid_t gid = ::getgid();
  if (::unshare(CLONE_NEWNS) == 0) return {};
  int first = errno;
  if (::unshare(CLONE_NEWUSER | CLONE_NEWNS) != 0) {
    return std::string("unshare(CLONE_NEWNS): ") + std::strerror(first) +
           "; unshare(CLONE_NEWUSER): " + std::strerror(errno);
  }
  write_file("/proc/self/setgroups", "deny");
  if (!write_file("/proc/self/uid_map", "0 " + std::to_string(uid) + " 1\n") ||
      !write_file("/proc/self/gid_map", "0 " + std::to_string(gid) + " 1\n")) {
    return "cannot map the user namespace";
  }
  return {};
}

}  // namespace

bool tiny_fs_required() {
  return std::getenv("SHEETMILL_REQUIRE_TINY_FS") != nullptr;
}

TinyFsRun run_on_tiny_fs(const fs::path& dir, long size_kib,
                         const std::function<int(std::string&)>& body, bool read_only) {
  fs::create_directories(dir);
  int pipe_fd[2];
  if (::pipe(pipe_fd) != 0) return {false, "pipe failed", -1, {}};
  pid_t pid = ::fork();
  if (pid < 0) return {false, "fork failed", -1, {}};
  if (pid == 0) {
    ::close(pipe_fd[0]);
    std::string report;
    int code = kUnavailable;
    std::string why = enter_namespace();
    if (why.empty() && ::mount("none", "/", nullptr, MS_REC | MS_PRIVATE, nullptr) != 0) {
      why = std::string("making mounts private: ") + std::strerror(errno);
    }
    std::string options = "size=" + std::to_string(size_kib) + "k";
    if (why.empty() &&
        ::mount("tmpfs", dir.c_str(), "tmpfs", read_only ? MS_RDONLY : 0, options.c_str()) != 0) {
      why = std::string("mount -t tmpfs: ") + std::strerror(errno);
    }
    if (!why.empty()) {
      report = why;
    } else {
      try {
        code = body(report);
      } catch (const std::exception& e) {
        report += std::string("\nthe test body threw: ") + e.what();
        code = 1;
      }
    }
    ssize_t ignored = ::write(pipe_fd[1], report.data(), report.size());
    (void)ignored;
    ::_exit(code);
  }
  ::close(pipe_fd[1]);
  std::string text;
  char buf[4096];
  ssize_t n;
  while ((n = ::read(pipe_fd[0], buf, sizeof buf)) > 0) text.append(buf, static_cast<size_t>(n));
  ::close(pipe_fd[0]);
  int status = 0;
  ::waitpid(pid, &status, 0);
  TinyFsRun r;
  int code = WIFEXITED(status) ? WEXITSTATUS(status) : 128 + WTERMSIG(status);
  if (code == kUnavailable) {
    r.unavailable_reason = text;
    return r;
  }
  r.available = true;
  r.exit_code = code;
  r.report = text;
  return r;
}

std::string list_folder(const fs::path& dir) {
  std::vector<std::string> names;
  std::error_code ec;
  for (fs::directory_iterator it(dir, ec), end; !ec && it != end; it.increment(ec)) {
    names.push_back(it->path().filename().string());
  }
  std::sort(names.begin(), names.end());
  std::string out;
  for (const auto& n : names) out += n + "\n";
  return out;
}

void fill_filesystem(const fs::path& dir) {
  int fd = ::open((dir / "filler").c_str(), O_WRONLY | O_CREAT | O_TRUNC | O_CLOEXEC, 0644);
  if (fd < 0) return;
  std::vector<char> block(4096, 'x');
  while (::write(fd, block.data(), block.size()) > 0) {
  }
  // The last partial page too.
  while (::write(fd, block.data(), 1) > 0) {
  }
  ::close(fd);
}

}  // namespace sheetmill::test
