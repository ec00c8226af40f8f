// Two batches on one output folder (issue 14): the second is refused, naming the first, or
// waits with --wait; shards of one job array share the folder.
#include "sheetmill/batch/folder_lock.hpp"

#include <sys/wait.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <chrono>
#include <thread>

#include "batch/demo_project.hpp"
#include "sheetmill/core/error.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;
using batch::FolderLock;
using batch::Shard;

namespace {
// Whether a lock can be taken now, from another process (flock conflicts between processes;
// within one process a second open file description conflicts too, but a child is the real case).
std::string try_in_child(const fs::path& dir, std::optional<Shard> shard) {
  int p[2];
  REQUIRE(::pipe(p) == 0);
  pid_t pid = ::fork();
  if (pid == 0) {
    ::close(p[0]);
    std::string out = "taken";
    try {
      FolderLock lock(dir, shard, false);
    } catch (const Error& e) {
      out = e.what();
    }
    (void)!::write(p[1], out.data(), out.size());
    ::_exit(0);
  }
  ::close(p[1]);
  std::string text;
  char buf[1024];
  for (ssize_t n; (n = ::read(p[0], buf, sizeof buf)) > 0;) text.append(buf, n);
  ::close(p[0]);
  ::waitpid(pid, nullptr, 0);
  return text;
}
}  // namespace

TEST_CASE("a second batch on a locked output folder is refused and told who holds it",
          "[batch][lock]") {
  test::TempDir dir("lock");
  {
    FolderLock whole(dir.path(), std::nullopt, false);
    std::string second = try_in_child(dir.path(), std::nullopt);
    CHECK(second.find("another batch is writing to this folder") != std::string::npos);
    CHECK(second.find("pid " + std::to_string(::getpid())) != std::string::npos);
    CHECK(second.find("whole batch") != std::string::npos);
    CHECK(second.find("--wait") != std::string::npos);
    // A shard is refused by a whole batch too.
    CHECK(try_in_child(dir.path(), Shard{0, 2}).find("another batch") != std::string::npos);
  }
  // Released with the holder: the next batch takes it.
  CHECK(try_in_child(dir.path(), std::nullopt) == "taken");
}

TEST_CASE("shards of one array share the folder; the same shard twice does not", "[batch][lock]") {
  test::TempDir dir("lock-shards");
  FolderLock first(dir.path(), Shard{0, 2}, false);
  CHECK(try_in_child(dir.path(), Shard{1, 2}) == "taken");
  std::string again = try_in_child(dir.path(), Shard{0, 2});
  CHECK(again.find("another batch") != std::string::npos);
  CHECK(again.find("shard 0 of 2") != std::string::npos);
  std::string whole = try_in_child(dir.path(), std::nullopt);
  CHECK(whole.find("another batch") != std::string::npos);
  CHECK(whole.find("pid " + std::to_string(::getpid())) != std::string::npos);
}

TEST_CASE("with wait, a second batch waits for the first to end", "[batch][lock]") {
  test::TempDir dir("lock-wait");
  pid_t holder = ::fork();
  if (holder == 0) {
    FolderLock lock(dir.path(), std::nullopt, false);
    std::this_thread::sleep_for(std::chrono::milliseconds(700));
    ::_exit(0);
  }
  // Until the holder has the lock.
  while (try_in_child(dir.path(), std::nullopt) == "taken") {
    std::this_thread::sleep_for(std::chrono::milliseconds(10));
  }
  {
    FolderLock waited(dir.path(), std::nullopt, true);
    int status = 0;
    // The holder has ended by the time the lock is ours.
    CHECK(::waitpid(holder, &status, WNOHANG) == holder);
  }
}

TEST_CASE("sheetmill batch on a folder another batch holds exits 2 at once, writing nothing",
          "[batch][lock]") {
  test::TempDir dir("lock-cli");
  test::DemoProject p = test::make_demo_project(dir.path());
  REQUIRE_FALSE(p.project.empty());
  fs::path out = dir / "out";
  fs::create_directories(out);
  FolderLock held(out, std::nullopt, false);
  auto r =
      test::run_sheetmill({"batch", p.project.string(), "-o", out.string(), "--progress", "none"});
  INFO(r.err);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("another batch is writing to this folder (pid " + std::to_string(::getpid())) !=
        std::string::npos);
  // No sheet rendered, no report overwritten, nothing deleted.
  for (const auto& e : fs::directory_iterator(out)) {
    CHECK(e.path().filename() == ".sheetmill-batch.lock");
  }
}
