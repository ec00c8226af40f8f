#include "support/test_env.hpp"

#include <fcntl.h>
#include <sys/file.h>
#include <sys/wait.h>
#include <unistd.h>

#include <atomic>
#include <cstdlib>
#include <fstream>
#include <sstream>
#include <stdexcept>

namespace sheetmill::test {

namespace fs = std::filesystem;

fs::path source_dir() {
  return SHEETMILL_SOURCE_DIR;
}
fs::path binary_dir() {
  return SHEETMILL_BINARY_DIR;
}
fs::path sheetmill_exe() {
  return SHEETMILL_EXE;
}
fs::path shared_dir() {
  return (source_dir() / ".." / "shared").lexically_normal();
}

fs::path open_data(const std::string& package, const std::string& path_inside) {
  return source_dir() / "tests" / "data" / "cache" / package / path_inside;
}

TempDir::TempDir(const std::string& tag) {
  static std::atomic<int> counter{0};
  fs::path root = binary_dir() / "test-tmp";
  fs::create_directories(root);
  path_ = root / (tag + "-" + std::to_string(::getpid()) + "-" + std::to_string(counter++));
  fs::remove_all(path_);
  fs::create_directories(path_);
}

TempDir::~TempDir() {
  if (!std::getenv("SHEETMILL_KEEP_TEST_TMP")) {
    std::error_code ec;
    fs::remove_all(path_, ec);
  }
}

std::string read_text(const fs::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::stringstream ss;
  ss << in.rdbuf();
  return ss.str();
}

void write_text(const fs::path& p, const std::string& text) {
  std::ofstream out(p, std::ios::binary);
  out << text;
}

CommandResult run_command(const std::vector<std::string>& argv) {
  TempDir io("cmd");
  fs::path out_path = io / "stdout";
  fs::path err_path = io / "stderr";
  pid_t pid = ::fork();
  if (pid < 0) throw std::runtime_error("fork failed");
  if (pid == 0) {
    int out = ::open(out_path.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
    int err = ::open(err_path.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0644);
    ::dup2(out, 1);
    ::dup2(err, 2);
    std::vector<char*> args;
    for (const auto& a : argv) args.push_back(const_cast<char*>(a.c_str()));
    args.push_back(nullptr);
    ::execvp(args[0], args.data());
    ::_exit(127);
  }
  int status = 0;
  ::waitpid(pid, &status, 0);
  CommandResult r;
  r.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : 128 + WTERMSIG(status);
  r.out = read_text(out_path);
  r.err = read_text(err_path);
  return r;
}

CommandResult run_sheetmill(const std::vector<std::string>& args) {
  std::vector<std::string> argv{sheetmill_exe().string()};
  argv.insert(argv.end(), args.begin(), args.end());
  return run_command(argv);
}

fs::path demo_area() {
  // Generated once per build tree; a lock keeps parallel test processes from racing.
  fs::path dir = binary_dir() / "demo-area";
  fs::path done = dir / ".complete";
  if (fs::exists(done)) return dir;
  fs::create_directories(binary_dir());
  fs::path lock_path = binary_dir() / "demo-area.lock";
  int fd = ::open(lock_path.c_str(), O_RDWR | O_CREAT, 0644);
  ::flock(fd, LOCK_EX);
  if (!fs::exists(done)) {
    CommandResult r = run_sheetmill({"demo-area", dir.string()});
    if (r.exit_code != 0) {
      ::flock(fd, LOCK_UN);
      ::close(fd);
      throw std::runtime_error("sheetmill demo-area failed: " + r.err);
    }
  }
  ::flock(fd, LOCK_UN);
  ::close(fd);
  return dir;
}

}  // namespace sheetmill::test
