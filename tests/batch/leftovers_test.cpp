#include "sheetmill/batch/leftovers.hpp"

#include <sys/wait.h>
#include <unistd.h>

#include <catch2/catch.hpp>

#include "batch/fake_sheets.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

namespace {
// The id of a process that has ended (and been reaped): its temporaries are stale.
pid_t dead_pid() {
  pid_t pid = ::fork();
  if (pid == 0) ::_exit(0);
  ::waitpid(pid, nullptr, 0);
  return pid;
}

// `temp` as written by process `pid` instead of this one.
fs::path written_by(const fs::path& temp, pid_t pid) {
  std::string name = temp.filename().string();
  const std::string mine = "." + std::to_string(::getpid()) + "-";
  for (std::size_t at; (at = name.find(mine)) != std::string::npos;) {
    name.replace(at, mine.size(), "." + std::to_string(pid) + "-");
  }
  return temp.parent_path() / name;
}
}  // namespace

TEST_CASE("leftover temporaries of this batch's sheets are removed, nothing else", "[batch]") {
  test::TempDir dir("leftovers");
  auto jobs = test::fake_jobs(3, dir.path());                         // S0 S1 S2
  std::vector<batch::SheetJob> mine(jobs.begin(), jobs.begin() + 2);  // S2 is another shard's
  // Temporaries named the way core/atomic_file.hpp names them, also nested (a temporary of a
  // temporary, as the PDF writer makes).
  // Left by a process that has ended, except `t1_live`: this test's own, a live writer's.
  const pid_t gone = dead_pid();
  fs::path t0 = written_by(sibling_temp_path(jobs[0].output), gone);
  fs::path t0_nested =
      written_by(sibling_temp_path(sibling_temp_path(jobs[0].output), "groups"), gone);
  fs::path t1_stamp = written_by(sibling_temp_path(dir / "S1.pdf.stamp"), gone);
  fs::path t1_live = sibling_temp_path(jobs[1].output);
  fs::path t2 = written_by(sibling_temp_path(jobs[2].output), gone);
  for (const fs::path& p : {t0, t0_nested, t1_stamp, t1_live, t2, jobs[0].output, dir / ".S0.pdfx",
                            dir / ".hidden-notes"}) {
    test::write_text(p, "x");
  }
  CHECK(batch::remove_leftovers(mine) == 3);
  CHECK_FALSE(fs::exists(t0));
  CHECK_FALSE(fs::exists(t0_nested));
  CHECK_FALSE(fs::exists(t1_stamp));
  CHECK(fs::exists(t1_live));           // its writer is alive (another batch, a render)
  CHECK(fs::exists(t2));                // not this batch's sheet
  CHECK(fs::exists(jobs[0].output));    // the output itself
  CHECK(fs::exists(dir / ".S0.pdfx"));  // another name
  CHECK(fs::exists(dir / ".hidden-notes"));
}
