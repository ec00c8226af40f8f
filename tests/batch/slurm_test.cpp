#include <catch2/catch.hpp>

#include "support/test_env.hpp"

// Hidden from the `batch` label (tag [.]); ctest runs it under its own label `slurm` (see the
// add_test lines in CMakeLists.txt). scripts/slurm-test brings up munge, slurmctld and slurmd
// on loopback in a temporary folder, submits the demo sheets as an array of 4 tasks, checks
// every sheet was rendered exactly once, and stops its daemons.
TEST_CASE("slurm: a job array of 4 tasks renders every sheet exactly once", "[.][slurm]") {
  auto demo = sheetmill::test::demo_area();
  auto r = sheetmill::test::run_command(
      {"bash", (sheetmill::test::source_dir() / "scripts" / "slurm-test").string(),
       sheetmill::test::sheetmill_exe().string(), demo.string()});
  INFO(r.err);
  CHECK(r.exit_code == 0);
  CHECK(r.out.find("rendered once each by 4 array tasks") != std::string::npos);
}
