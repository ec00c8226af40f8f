#include "sheetmill/core/atomic_file.hpp"

#include <catch2/catch.hpp>

#include "support/test_env.hpp"

namespace fs = std::filesystem;

TEST_CASE("an uncommitted output leaves nothing behind", "[core]") {
  sheetmill::test::TempDir dir;
  fs::path target = dir / "sheet.pdf";
  {
    sheetmill::AtomicOutput out(target);
    sheetmill::test::write_text(out.temp_path(), "partial");
    CHECK(fs::exists(out.temp_path()));
  }
  CHECK_FALSE(fs::exists(target));
  CHECK(fs::is_empty(dir.path()));
}

TEST_CASE("a committed output replaces the target whole", "[core]") {
  sheetmill::test::TempDir dir;
  fs::path target = dir / "sheet.pdf";
  sheetmill::test::write_text(target, "old");
  {
    sheetmill::AtomicOutput out(target);
    sheetmill::test::write_text(out.temp_path(), "new content");
    out.commit();
  }
  CHECK(sheetmill::test::read_text(target) == "new content");
  CHECK(std::distance(fs::directory_iterator(dir.path()), fs::directory_iterator()) == 1);
}
