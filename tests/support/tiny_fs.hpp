#pragma once
// A tiny filesystem for tests of a full disk: `body` runs in a forked child inside a mount
// namespace of its own, with a fresh tmpfs of `size_kib` mounted at `dir` (read-only when
// asked). Nothing outside the child sees the mount, and it vanishes with the child, so the
// body must check what it left in `dir` itself and say so in `report`.
//
// Needs CAP_SYS_ADMIN (root) or unprivileged user namespaces; where neither is allowed the
// result says why and the test must say it skipped. With SHEETMILL_REQUIRE_TINY_FS set (CI),
// unavailable is a failure.

#include <filesystem>
#include <functional>
#include <string>

namespace sheetmill::test {

struct TinyFsRun {
  bool available = false;
  std::string unavailable_reason;
  int exit_code = -1;  // the body's return value (1 when it threw)
  std::string report;  // what the body wrote into its `report` argument
};

TinyFsRun run_on_tiny_fs(const std::filesystem::path& dir, long size_kib,
                         const std::function<int(std::string& report)>& body,
                         bool read_only = false);

// Whether a missing tiny filesystem must fail the test (SHEETMILL_REQUIRE_TINY_FS is set).
bool tiny_fs_required();

// The names in `dir`, "." entries included, sorted, one per line ("" when empty).
std::string list_folder(const std::filesystem::path& dir);

// Writes a file in `dir` until the disk refuses (ENOSPC): the rest of the space is gone.
void fill_filesystem(const std::filesystem::path& dir);

}  // namespace sheetmill::test
