#pragma once
// Hermetic helpers for every test suite: a fresh temporary folder per test, the paths of the
// project's data and of the open test data, and running a command while capturing its output.

#include <filesystem>
#include <string>
#include <vector>

namespace sheetmill::test {

// A new, empty folder under the build tree, removed when the object goes (kept if
// SHEETMILL_KEEP_TEST_TMP is set, for debugging).
class TempDir {
 public:
  explicit TempDir(const std::string& tag = "t");
  ~TempDir();
  TempDir(const TempDir&) = delete;
  TempDir& operator=(const TempDir&) = delete;
  const std::filesystem::path& path() const { return path_; }
  std::filesystem::path operator/(const std::string& name) const { return path_ / name; }

 private:
  std::filesystem::path path_;
};

std::filesystem::path source_dir();  // the repository root
std::filesystem::path binary_dir();  // the build folder
std::filesystem::path sheetmill_exe();
// ../shared beside the repository (WMM coefficients etc.); tests that need it skip without it.
std::filesystem::path shared_dir();
// tests/data/cache/PACKAGE/PATH, fetched by scripts/fetch-test-data.
std::filesystem::path open_data(const std::string& package, const std::string& path_inside);
// The demo area generated once for all tests (built on demand with `sheetmill demo-area`).
std::filesystem::path demo_area();

struct CommandResult {
  int exit_code = -1;
  std::string out;  // stdout
  std::string err;  // stderr
};
// Runs argv[0] with the arguments (no shell), capturing stdout and stderr.
CommandResult run_command(const std::vector<std::string>& argv);
// Runs `sheetmill` with the arguments.
CommandResult run_sheetmill(const std::vector<std::string>& args);

std::string read_text(const std::filesystem::path& p);
void write_text(const std::filesystem::path& p, const std::string& text);

}  // namespace sheetmill::test
