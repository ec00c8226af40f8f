#include "sheetmill/batch/leftovers.hpp"

#include <catch2/catch.hpp>

#include "batch/fake_sheets.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

TEST_CASE("leftover temporaries of this batch's sheets are removed, nothing else", "[batch]") {
  test::TempDir dir("leftovers");
  auto jobs = test::fake_jobs(3, dir.path());                         // S0 S1 S2
  std::vector<batch::SheetJob> mine(jobs.begin(), jobs.begin() + 2);  // S2 is another shard's
  // Temporaries named the way core/atomic_file.hpp names them, also nested (a temporary of a
  // temporary, as the PDF writer makes).
  fs::path t0 = sibling_temp_path(jobs[0].output);
  fs::path t0_nested = sibling_temp_path(t0, "groups");
  fs::path t1_stamp = sibling_temp_path(dir / "S1.pdf.stamp");
  fs::path t2 = sibling_temp_path(jobs[2].output);
  for (const fs::path& p :
       {t0, t0_nested, t1_stamp, t2, jobs[0].output, dir / ".S0.pdfx", dir / ".hidden-notes"}) {
    test::write_text(p, "x");
  }
  CHECK(batch::remove_leftovers(mine) == 3);
  CHECK_FALSE(fs::exists(t0));
  CHECK_FALSE(fs::exists(t0_nested));
  CHECK_FALSE(fs::exists(t1_stamp));
  CHECK(fs::exists(t2));                // not this batch's sheet
  CHECK(fs::exists(jobs[0].output));    // the output itself
  CHECK(fs::exists(dir / ".S0.pdfx"));  // another name
  CHECK(fs::exists(dir / ".hidden-notes"));
}
