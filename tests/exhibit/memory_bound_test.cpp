// An ARCH E exhibit with relief at 300 dpi renders within the memory bound stated in
// bench/exhibit/README.md: the CLI runs as a child process and its peak resident set is read
// with wait4()'s rusage. A memory bound, not a wall-time assertion.
#include <spawn.h>
#include <sys/resource.h>
#include <sys/wait.h>

#include <catch2/catch.hpp>
#include <cstdio>

#include "exhibit_fixture.hpp"
#include "support/test_env.hpp"

extern char** environ;

namespace fx = sheetmill::exhibit_fixture;

namespace {
// Peak RSS in MiB of `argv` run to completion, or -1 when it fails.
long peak_rss_mib(const std::vector<std::string>& argv, int& exit_code) {
  std::vector<char*> args;
  for (const auto& a : argv) args.push_back(const_cast<char*>(a.c_str()));
  args.push_back(nullptr);
  pid_t pid = 0;
  if (posix_spawn(&pid, args[0], nullptr, nullptr, args.data(), environ) != 0) return -1;
  int status = 0;
  struct rusage ru {};
  if (wait4(pid, &status, 0, &ru) != pid) return -1;
  exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  return ru.ru_maxrss / 1024;  // Linux reports kilobytes
}
}  // namespace

TEST_CASE("an ARCH E exhibit at 300 dpi stays within the memory bound", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-mem");
  fx::write_plane_dem(dir / "dem.tif", 100, 0.05, 20);
  sheetmill::test::write_text(
      dir / "x.yaml",
      fx::exhibit_yaml(dir / "dem.tif", "ARCH E", false, 2, "  dpi: 300\n  compression: jpeg\n"));
  int code = -1;
  const long mib = peak_rss_mib({sheetmill::test::sheetmill_exe().string(), "-q", "exhibit",
                                 (dir / "x.yaml").string(), "-o", (dir / "x.pdf").string()},
                                code);
  REQUIRE(code == 0);
  // A full-page ARGB raster of ARCH E at 300 dpi alone is 10800 x 14400 x 4 bytes = 593 MiB;
  // the bound (bench/exhibit/README.md) is a third of that.
  constexpr long kBoundMib = 200;
  INFO("peak RSS " << mib << " MiB");
  CHECK(mib > 0);
  CHECK(mib < kBoundMib);
  WARN("ARCH E at 300 dpi: peak RSS "
       << mib << " MiB, PDF " << std::filesystem::file_size(dir / "x.pdf") / 1024 << " KiB");
}
