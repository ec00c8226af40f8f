#include "sheetmill/batch/runner.hpp"

#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <chrono>
#include <map>
#include <thread>

#include "batch/fake_sheets.hpp"
#include "sheetmill/batch/stamp.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;
using namespace sheetmill::batch;

namespace {

WorkerSetup setup_with(test::FakeRenderer fake, fs::path inputs = {}) {
  return [fake, inputs] {
    SheetTasks t;
    if (!inputs.empty())
      t.digest = [inputs](const SheetJob& j) { return test::file_digest(inputs, j); };
    t.render = fake;
    return t;
  };
}

RunOptions quiet(int workers) {
  RunOptions o;
  o.workers = workers;
  o.progress = ProgressMode::none;
  o.program_version = "test";
  return o;
}

std::map<std::string, SheetStatus> statuses(const BatchResult& r) {
  std::map<std::string, SheetStatus> m;
  for (const auto& o : r.outcomes) m[o.id] = o.status;
  return m;
}

}  // namespace

TEST_CASE("a failing or crashing sheet is reported and the batch goes on", "[batch]") {
  test::TempDir dir("runner");
  auto jobs = test::fake_jobs(12, dir.path());
  test::FakeRenderer fake;
  fake.log = dir / "renders.log";
  fake.throw_on = {"S3"};
  fake.crash_on = {"S7"};  // the worker process dies (SIGABRT); it is replaced
  BatchResult r = run_batch(jobs, setup_with(fake), quiet(2));
  REQUIRE(r.outcomes.size() == 12);
  auto s = statuses(r);
  CHECK(s["S3"] == SheetStatus::failed);
  CHECK(s["S7"] == SheetStatus::failed);
  CHECK(r.count(SheetStatus::rendered) == 10);
  for (const auto& o : r.outcomes) {
    if (o.id == "S3") CHECK(o.error.find("sheet S3 is broken") != std::string::npos);
    if (o.id == "S7") CHECK(o.error.find("signal") != std::string::npos);
    if (o.id == "S1") CHECK(o.warnings == std::vector<std::string>{"fake warning for S1"});
    if (o.status == SheetStatus::rendered) {
      CHECK(test::pdf_opens(o.output));
      CHECK(o.output_bytes == fs::file_size(o.output));
    }
  }
  CHECK_FALSE(fs::exists(dir / "S3.pdf"));
  CHECK(test::render_log(fake.log).size() == 10);
}

TEST_CASE("two workers share the sheets and each renders its sheets once", "[batch]") {
  test::TempDir dir("runner");
  auto jobs = test::fake_jobs(20, dir.path());
  test::FakeRenderer fake;
  fake.log = dir / "renders.log";
  fake.sleep_ms = 20;
  BatchResult r = run_batch(jobs, setup_with(fake), quiet(2));
  CHECK(r.workers == 2);
  std::map<int, int> per_worker;
  for (const auto& o : r.outcomes) ++per_worker[o.worker];
  CHECK(per_worker.size() == 2);
  auto log = test::render_log(fake.log);
  std::sort(log.begin(), log.end());
  CHECK(std::adjacent_find(log.begin(), log.end()) == log.end());
  CHECK(log.size() == 20);
}

TEST_CASE("unchanged sheets are skipped and changed ones re-rendered", "[batch]") {
  test::TempDir dir("runner");
  fs::create_directories(dir / "inputs");
  auto jobs = test::fake_jobs(8, dir / "out");
  fs::create_directories(dir / "out");
  for (const auto& j : jobs) test::write_text(dir / "inputs" / (j.id + ".txt"), "v1 " + j.id);
  test::FakeRenderer fake;
  fake.log = dir / "renders.log";
  auto setup = setup_with(fake, dir / "inputs");

  BatchResult first = run_batch(jobs, setup, quiet(2));
  CHECK(first.count(SheetStatus::rendered) == 8);
  for (const auto& j : jobs) CHECK(read_stamp(j.output).has_value());

  BatchResult second = run_batch(jobs, setup, quiet(2));
  CHECK(second.count(SheetStatus::up_to_date) == 8);

  // One input changes, one output is deleted, one is truncated, one stamp is damaged.
  test::write_text(dir / "inputs" / "S2.txt", "v2 S2");
  fs::remove(dir / "out" / "S4.pdf");
  fs::resize_file(dir / "out" / "S5.pdf", 10);
  test::write_text(dir / "out" / "S6.pdf.stamp", "{ not json");
  fs::remove(fake.log);
  BatchResult third = run_batch(jobs, setup, quiet(2));
  auto s = statuses(third);
  std::vector<std::string> log = test::render_log(fake.log);
  std::sort(log.begin(), log.end());
  CHECK(log == std::vector<std::string>{"S2", "S4", "S5", "S6"});
  for (const auto& o : third.outcomes) {
    bool redo = o.id == "S2" || o.id == "S4" || o.id == "S5" || o.id == "S6";
    CHECK(o.status == (redo ? SheetStatus::rendered : SheetStatus::up_to_date));
    if (o.id == "S2") CHECK(o.reason == "changed: input");
    CHECK(test::pdf_opens(o.output));
  }
  RunOptions force = quiet(2);
  force.force = true;
  CHECK(run_batch(jobs, setup, force).count(SheetStatus::rendered) == 8);
}

TEST_CASE("a batch killed with SIGKILL resumes without redoing finished sheets", "[batch]") {
  test::TempDir dir("runner");
  fs::create_directories(dir / "inputs");
  fs::create_directories(dir / "out");
  auto jobs = test::fake_jobs(24, dir / "out");
  for (const auto& j : jobs) test::write_text(dir / "inputs" / (j.id + ".txt"), j.id);
  test::FakeRenderer fake;
  fake.log = dir / "renders-1.log";
  fake.sleep_ms = 120;
  // The batch runs in a child process (which forks its own workers), killed mid-way.
  pid_t pid = ::fork();
  REQUIRE(pid >= 0);
  if (pid == 0) {
    run_batch(jobs, setup_with(fake, dir / "inputs"), quiet(2));
    ::_exit(0);
  }
  // Wait until some sheets are finished (stamped), then kill at once.
  auto stamped = [&] {
    int n = 0;
    for (const auto& j : jobs) n += fs::exists(stamp_path(j.output));
    return n;
  };
  auto deadline = std::chrono::steady_clock::now() + std::chrono::seconds(30);
  while (stamped() < 6 && std::chrono::steady_clock::now() < deadline) {
    std::this_thread::sleep_for(std::chrono::milliseconds(5));
  }
  ::kill(pid, SIGKILL);
  int status = 0;
  ::waitpid(pid, &status, 0);
  REQUIRE(WIFSIGNALED(status));
  std::this_thread::sleep_for(std::chrono::milliseconds(300));  // workers die with the batch

  // Every file under an output's name is a complete PDF; note which sheets were finished.
  std::map<std::string, fs::file_time_type> finished;
  for (const auto& j : jobs) {
    if (fs::exists(j.output)) CHECK(test::pdf_opens(j.output));
    if (is_up_to_date(j.output, test::file_digest(dir / "inputs", j).hex)) {
      finished[j.id] = fs::last_write_time(stamp_path(j.output));
    }
  }
  INFO("finished before the kill: " << finished.size());
  REQUIRE(finished.size() >= 6);
  REQUIRE(finished.size() < jobs.size());
  // No worker outlived the batch: nothing renders after the kill.
  auto log_after_kill = test::render_log(fake.log);
  std::this_thread::sleep_for(std::chrono::milliseconds(400));
  CHECK(test::render_log(fake.log) == log_after_kill);

  fake.log = dir / "renders-2.log";
  fake.sleep_ms = 0;
  BatchResult r = run_batch(jobs, setup_with(fake, dir / "inputs"), quiet(2));
  std::vector<std::string> second = test::render_log(fake.log);
  std::set<std::string> rendered_again(second.begin(), second.end());
  CHECK(rendered_again.size() == second.size());  // none twice in the second run
  for (const auto& o : r.outcomes) {
    bool was_finished = finished.count(o.id) > 0;
    CHECK(o.status == (was_finished ? SheetStatus::up_to_date : SheetStatus::rendered));
    CHECK(rendered_again.count(o.id) == (was_finished ? 0u : 1u));
    if (was_finished) CHECK(fs::last_write_time(stamp_path(o.output)) == finished[o.id]);
    CHECK(test::pdf_opens(o.output));
  }
  // The killed run's temporaries are gone: only outputs and stamps remain.
  for (const auto& e : fs::directory_iterator(dir / "out")) {
    std::string name = e.path().filename().string();
    INFO(name);
    CHECK(name.front() != '.');
  }
}
