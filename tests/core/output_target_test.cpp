// What an output may replace, and what is checked before any data is read (issue 14): only
// regular files; a symbolic link only when asked to write through it; a missing or read-only
// folder is the user's error (exit 2), named at once.
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include <catch2/catch.hpp>

#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/temp_registry.hpp"
#include "support/test_env.hpp"
#include "support/tiny_fs.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

namespace {
bool fifo_at(const fs::path& p) {
  struct stat st {};
  return ::lstat(p.c_str(), &st) == 0 && S_ISFIFO(st.st_mode);
}

std::string input_error_of(const std::function<void()>& f) {
  try {
    f();
  } catch (const Error& e) {
    return e.kind() == Error::Kind::input ? e.what() : std::string("internal: ") + e.what();
  }
  return "no error";
}
}  // namespace

TEST_CASE("a FIFO, a folder or a symbolic link at the target is refused, and stays",
          "[core][output]") {
  test::TempDir dir("target");
  fs::path fifo = dir / "pipe.pdf";
  REQUIRE(::mkfifo(fifo.c_str(), 0644) == 0);
  CHECK(input_error_of([&] { AtomicOutput out(fifo); }).find("is a FIFO, not a regular file") !=
        std::string::npos);
  CHECK(fifo_at(fifo));
  fs::create_directories(dir / "folder.pdf");
  CHECK(input_error_of([&] { AtomicOutput out(dir / "folder.pdf"); }).find("is a folder") !=
        std::string::npos);
  test::write_text(dir / "real.pdf", "old");
  fs::create_symlink(dir / "real.pdf", dir / "link.pdf");
  CHECK(input_error_of([&] {
          AtomicOutput out(dir / "link.pdf");
        }).find("is a symbolic link; sheetmill replaces only regular files") != std::string::npos);
  CHECK(fs::is_symlink(dir / "link.pdf"));
  CHECK(test::read_text(dir / "real.pdf") == "old");
  // Nothing was left beside them.
  for (const auto& e : fs::directory_iterator(dir.path())) {
    CHECK(e.path().filename().string()[0] != '.');
  }
}

TEST_CASE("writing through a symbolic link replaces the file it points to; the link stays",
          "[core][output]") {
  test::TempDir dir("through");
  fs::create_directories(dir / "store");
  test::write_text(dir / "store" / "real.pdf", "old");
  fs::create_symlink(dir / "store" / "real.pdf", dir / "link.pdf");
  {
    AtomicOutput out(dir / "link.pdf", LinkPolicy::write_through);
    test::write_text(out.temp_path(), "new");
    CHECK(out.temp_path().parent_path() == fs::canonical(dir / "store"));
    out.commit();
  }
  CHECK(fs::is_symlink(dir / "link.pdf"));
  CHECK(test::read_text(dir / "store" / "real.pdf") == "new");
}

TEST_CASE("a device appearing at the target while writing is not renamed over", "[core][output]") {
  test::TempDir dir("late-fifo");
  fs::path target = dir / "sheet.pdf";
  {
    AtomicOutput out(target);
    test::write_text(out.temp_path(), "content");
    REQUIRE(::mkfifo(target.c_str(), 0644) == 0);
    CHECK(input_error_of([&] { out.commit(); }).find("is a FIFO") != std::string::npos);
  }
  CHECK(fifo_at(target));
  CHECK(std::distance(fs::directory_iterator(dir.path()), fs::directory_iterator()) == 1);
  CHECK(registered_temp_count() == 0);  // the temporary is gone from the signal registry too
}

TEST_CASE("the CLI checks the output before reading anything: exit 2, the path, the reason",
          "[core][output]") {
  test::TempDir dir("cli-target");
  fs::path fifo = dir / "pipe.pdf";
  REQUIRE(::mkfifo(fifo.c_str(), 0644) == 0);
  const std::string missing_input = (dir / "no-such-project.yaml").string();
  const std::string missing_folder = (dir / "no-such-folder").string();
  struct Case {
    std::vector<std::string> args;
    std::string expected;
  };
  // Every input named here is missing too: the output's message proves it was checked first.
  std::vector<Case> cases{
      {{"render", missing_input, "-o", fifo.string()},
       fifo.string() + ": is a FIFO, not a regular file"},
      {{"render", missing_input, "-o", missing_folder + "/s.pdf"},
       "the output folder " + missing_folder + " does not exist"},
      {{"shade", missing_input, missing_folder + "/r.tif"},
       "the output folder " + missing_folder + " does not exist"},
      {{"contours", missing_input, missing_folder + "/c.gpkg"},
       "the output folder " + missing_folder + " does not exist"},
  };
  for (const Case& c : cases) {
    auto r = test::run_sheetmill(c.args);
    INFO(c.args[0] << ": " << r.err);
    CHECK(r.exit_code == 2);
    CHECK(r.err.find(c.expected) != std::string::npos);
    CHECK(std::count(r.err.begin(), r.err.end(), '\n') == 1);
  }
  CHECK(fifo_at(fifo));
}

TEST_CASE("a read-only output folder is exit 2 with the folder and the reason", "[core][output]") {
  test::TempDir dir("read-only");
  fs::path disk = dir / "disk";
  auto run = test::run_on_tiny_fs(
      disk, 64,
      [&](std::string& report) {
        auto r = test::run_sheetmill(
            {"render", (dir / "no-such-project.yaml").string(), "-o", (disk / "s.pdf").string()});
        report = std::to_string(r.exit_code) + " " + r.err;
        return 0;
      },
      /*read_only=*/true);
  if (!run.available) {
    if (test::tiny_fs_required()) FAIL("no read-only tmpfs here: " << run.unavailable_reason);
    WARN("SKIPPED: no read-only tmpfs on this machine (" << run.unavailable_reason << ")");
    return;
  }
  INFO(run.report);
  CHECK(run.report.rfind("2 ", 0) == 0);
  CHECK(run.report.find("cannot write in " + disk.string() + ": read-only file system") !=
        std::string::npos);
}

TEST_CASE("stale temporaries of dead writers go with the next write; live ones stay",
          "[core][output]") {
  // The names core/atomic_file.hpp gives, nested and with a dotted tag.
  CHECK(temp_owner_pid(".sheet.pdf.4711-3.part") == 4711);
  CHECK(temp_owner_pid("..sheet.pdf.4711-3.part.4711-4.groups") == 4711);
  CHECK(temp_owner_pid(".t.gpkg.815-0.part.gpkg") == 815);
  CHECK(temp_owner_pid(".hidden-notes") == std::nullopt);
  CHECK(temp_owner_pid("sheet.pdf") == std::nullopt);

  test::TempDir dir("stale");
  pid_t gone = ::fork();
  if (gone == 0) ::_exit(0);
  ::waitpid(gone, nullptr, 0);
  const std::string g = std::to_string(gone), me = std::to_string(::getpid());
  for (const std::string& name :
       {"." + std::string("sheet.pdf.") + g + "-0.part",
        ".." + std::string("sheet.pdf.") + g + "-0.part." + g + "-1.groups",
        ".sheet.pdf." + me + "-99.part", ".other.pdf." + g + "-0.part"}) {
    test::write_text(dir / name, "x");
  }
  {
    AtomicOutput out(dir / "sheet.pdf");
    test::write_text(out.temp_path(), "whole");
    out.commit();
  }
  CHECK_FALSE(fs::exists(dir / (".sheet.pdf." + g + "-0.part")));
  CHECK_FALSE(fs::exists(dir / ("..sheet.pdf." + g + "-0.part." + g + "-1.groups")));
  CHECK(fs::exists(dir / (".sheet.pdf." + me + "-99.part")));  // a live writer's
  CHECK(fs::exists(dir / (".other.pdf." + g + "-0.part")));    // another file's
}
