// Interrupted renders (issue 14): SIGTERM or SIGINT while the sheet's temporaries are being
// written removes them (core/temp_registry.hpp) and the process still dies of the signal.
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <chrono>
#include <thread>

#include "batch/demo_project.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

namespace {

pid_t spawn_sheetmill(const std::vector<std::string>& args) {
  pid_t pid = ::fork();
  if (pid == 0) {
    std::vector<std::string> argv{test::sheetmill_exe().string(), "-q"};
    argv.insert(argv.end(), args.begin(), args.end());
    std::vector<char*> c;
    for (auto& a : argv) c.push_back(a.data());
    c.push_back(nullptr);
    ::execv(c[0], c.data());
    ::_exit(127);
  }
  return pid;
}

// The temporaries (".NAME.PID-N.TAG") in `dir`, the folder lock aside.
std::vector<std::string> temporaries(const fs::path& dir) {
  std::vector<std::string> names;
  std::error_code ec;
  for (fs::directory_iterator it(dir, ec), end; !ec && it != end; it.increment(ec)) {
    std::string n = it->path().filename().string();
    if (n[0] == '.' && n != ".sheetmill-batch.lock") names.push_back(n);
  }
  return names;
}

// Waits until a temporary appears (the sheet is being finished), then sends `sig`. Returns the
// exit status, and whether a temporary was seen before the signal.
std::pair<int, bool> interrupt_when_writing(pid_t pid, const fs::path& dir, int sig) {
  bool seen = false;
  auto deadline = std::chrono::steady_clock::now() + std::chrono::seconds(120);
  while (!seen && std::chrono::steady_clock::now() < deadline) {
    seen = !temporaries(dir).empty();
    if (!seen) std::this_thread::sleep_for(std::chrono::milliseconds(2));
  }
  ::kill(pid, sig);
  int status = 0;
  ::waitpid(pid, &status, 0);
  return {status, seen};
}

}  // namespace

TEST_CASE("SIGTERM or SIGINT during a render removes its temporaries", "[batch][signals]") {
  test::TempDir dir("interrupt");
  test::DemoProject p = test::make_demo_project(dir.path());
  REQUIRE_FALSE(p.project.empty());
  for (int sig : {SIGTERM, SIGINT}) {
    fs::path out = dir / ("out-" + std::to_string(sig));
    fs::create_directories(out);
    pid_t pid = spawn_sheetmill({"render", p.project.string(), "-o", (out / "s.pdf").string()});
    auto [status, seen] = interrupt_when_writing(pid, out, sig);
    auto left = temporaries(out);
    INFO("signal " << sig << (left.empty() ? std::string() : ", left " + left.front()));
    REQUIRE(seen);
    CHECK(WIFSIGNALED(status));  // re-raised: the caller sees the signal, not an exit code
    if (WIFSIGNALED(status)) CHECK(WTERMSIG(status) == sig);
    CHECK(left.empty());
    CHECK_FALSE(fs::exists(out / "s.pdf"));
  }
}

TEST_CASE("SIGTERM to a batch removes its workers' temporaries", "[batch][signals]") {
  test::TempDir dir("interrupt-batch");
  test::DemoProject p = test::make_demo_project(dir.path());
  REQUIRE_FALSE(p.project.empty());
  fs::path out = dir / "out";
  fs::create_directories(out);
  pid_t pid = spawn_sheetmill(
      {"batch", p.project.string(), "-o", out.string(), "-j", "2", "--progress", "none"});
  auto [status, seen] = interrupt_when_writing(pid, out, SIGTERM);
  REQUIRE(seen);
  CHECK(WIFSIGNALED(status));
  // The workers had their own handler and were waited for: nothing of theirs is left.
  std::this_thread::sleep_for(std::chrono::milliseconds(200));
  auto left = temporaries(out);
  INFO((left.empty() ? std::string() : left.front()));
  CHECK(left.empty());
}

// The index command's GeoPackage temporary (and SQLite's journal beside it) is registered like a
// render's: 90 000 sheets of 100 m take long enough to write that the signal comes mid-write.
TEST_CASE("SIGTERM while the index command writes its GeoPackage removes the temporary",
          "[batch][signals]") {
  test::TempDir dir("interrupt-index");
  fs::path out = dir / "out";
  fs::create_directories(out);
  pid_t pid = spawn_sheetmill({"index", (out / "tiles.gpkg").string(), "--crs", "EPSG:32632",
                               "--scale", "1000", "--frame", "100x100mm", "--snap", "100m",
                               "--extent", "400000,5000000,430000,5030000"});
  auto [status, seen] = interrupt_when_writing(pid, out, SIGTERM);
  auto left = temporaries(out);
  INFO((left.empty() ? std::string() : "left " + left.front()));
  REQUIRE(seen);
  CHECK(WIFSIGNALED(status));
  if (WIFSIGNALED(status)) CHECK(WTERMSIG(status) == SIGTERM);
  CHECK(left.empty());
  CHECK_FALSE(fs::exists(out / "tiles.gpkg"));
}
