// A full disk on every write path (issue 14): a real tmpfs of a few hundred KiB in a mount
// namespace of the test's own (support/tiny_fs.hpp), so the failure is the kernel's ENOSPC,
// not a simulation. Each case must exit non-zero with "no space left on device" in its one
// line, and leave nothing in the folder: no file at the target, no temporary, no stamp.
#include <fcntl.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <map>
#include <tuple>

#include "batch/demo_project.hpp"
#include "batch/fake_sheets.hpp"
#include "sheetmill/batch/report.hpp"
#include "sheetmill/batch/runner.hpp"
#include "sheetmill/batch/stamp.hpp"
#include "sheetmill/core/error.hpp"
#include "support/test_env.hpp"
#include "support/tiny_fs.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

namespace {

constexpr const char* kNoSpace = "no space left on device";

bool skip_without_tiny_fs(const test::TinyFsRun& r) {
  if (r.available) return false;
  if (test::tiny_fs_required()) FAIL("no tiny filesystem here: " << r.unavailable_reason);
  WARN("SKIPPED: no tiny filesystem on this machine (" << r.unavailable_reason
                                                       << "); the full-disk cases did not run");
  return true;
}

// Runs sheetmill on a tmpfs of `size_kib` mounted at `dir`; reports exit code, stderr and
// what is left in the folder.
struct CliOnTinyFs {
  test::TinyFsRun run;
  int exit_code = -1;
  std::string err;
  std::string left;
};

CliOnTinyFs sheetmill_on_tiny_fs(const fs::path& dir, long size_kib,
                                 const std::vector<std::string>& args) {
  CliOnTinyFs c;
  c.run = test::run_on_tiny_fs(dir, size_kib, [&](std::string& report) {
    test::CommandResult r = test::run_sheetmill(args);
    report = std::to_string(r.exit_code) + "\n" + r.err + "\x1f" + test::list_folder(dir);
    return 0;
  });
  if (c.run.available) {
    auto nl = c.run.report.find('\n'), us = c.run.report.find('\x1f');
    c.exit_code = std::stoi(c.run.report.substr(0, nl));
    c.err = c.run.report.substr(nl + 1, us - nl - 1);
    c.left = c.run.report.substr(us + 1);
  }
  return c;
}

long kib(std::uintmax_t bytes) {
  return static_cast<long>(bytes / 1024);
}

}  // namespace

TEST_CASE("a full disk while rendering a sheet fails with its reason and leaves no file",
          "[batch][disk-full]") {
  test::TempDir dir("disk-full");
  test::DemoProject p = test::make_demo_project(dir.path());
  REQUIRE_FALSE(p.project.empty());
  // Each output's full size, written where there is room: the tiny disks are fractions of it.
  std::map<std::string, std::uintmax_t> full_size;
  for (std::string ext : {"pdf", "png", "tif"}) {
    fs::path out = dir / ("whole." + ext);
    auto r = test::run_sheetmill(
        {"-q", "render", p.project.string(), "-o", out.string(), "--dpi", "50"});
    INFO(r.err);
    REQUIRE(r.exit_code == 0);
    full_size[ext] = fs::file_size(out);
  }
  struct Case {
    std::string what;
    std::string file;
    long size_kib;
  };
  // The PDF is written twice: Cairo's page groups to a scratch file (about the size of the
  // sheet: 637 KB against 627 KB measured on this project), then qpdf's final file beside it.
  // A third of the sheet fills up in Cairo's write; 1.4 sheets holds the groups and fills up
  // in qpdf's (where the old code left a truncated PDF and exited 0).
  std::vector<Case> cases{
      {"PDF, full during Cairo's write", "sheet.pdf", kib(full_size["pdf"] / 3)},
      {"PDF, full during qpdf's write", "sheet.pdf", kib(full_size["pdf"] * 14 / 10)},
      {"PNG", "sheet.png", kib(full_size["png"] / 2)},
      {"GeoTIFF", "sheet.tif", kib(full_size["tif"] / 2)},
  };
  for (const Case& c : cases) {
    fs::path disk = dir / "disk";
    auto r = sheetmill_on_tiny_fs(
        disk, c.size_kib,
        {"-q", "render", p.project.string(), "-o", (disk / c.file).string(), "--dpi", "50"});
    if (skip_without_tiny_fs(r.run)) return;
    INFO(c.what << " on " << c.size_kib << " KiB: exit " << r.exit_code << ": " << r.err);
    CHECK(r.exit_code == 2);
    CHECK(r.err.find(kNoSpace) != std::string::npos);
    CHECK(std::count(r.err.begin(), r.err.end(), '\n') == 1);
    CHECK(r.left == "");  // no target, no .part, no .groups
  }
}

TEST_CASE("a full disk while writing relief and contour products fails with its reason",
          "[batch][disk-full]") {
  test::TempDir dir("disk-full-products");
  fs::path dem = test::demo_area() / "dem.tif";
  fs::path disk = dir / "disk";
  // The demo DEM's hillshade is megabytes and its contours hundreds of KB: 100 and 200 KiB
  // fill up part way.
  for (auto [cmd, file, size_kib] : std::vector<std::tuple<std::string, std::string, long>>{
           {"shade", "relief.tif", 100},
           {"slope", "slope.tif", 100},
           {"contours", "contours.gpkg", 200}}) {
    auto r =
        sheetmill_on_tiny_fs(disk, size_kib, {"-q", cmd, dem.string(), (disk / file).string()});
    if (skip_without_tiny_fs(r.run)) return;
    INFO(cmd << " on " << size_kib << " KiB: exit " << r.exit_code << ": " << r.err);
    CHECK(r.exit_code == 2);
    CHECK(r.err.find(kNoSpace) != std::string::npos);
    CHECK(r.left == "");
  }
}

TEST_CASE("a full disk at the stamp or the report: the sheet is failed, no stamp, no report",
          "[batch][disk-full]") {
  test::TempDir dir("disk-full-stamp");
  fs::path disk = dir / "disk";
  auto run = test::run_on_tiny_fs(disk, 256, [&](std::string& report) {
    auto jobs = test::fake_jobs(1, disk);
    test::FakeRenderer renderer;
    batch::SheetTasks tasks;
    tasks.digest = [](const batch::SheetJob&) {
      batch::SheetDigest d;
      d.hex = "0123";
      return d;
    };
    // The sheet is written whole, then the disk fills before its stamp.
    tasks.render = [&](const batch::SheetJob& j) {
      render::RenderReport r = renderer(j);
      test::fill_filesystem(disk);
      return r;
    };
    batch::RunOptions options;
    batch::SheetOutcome o = batch::process_sheet(jobs[0], tasks, options);
    report += std::string("status=") + batch::status_name(o.status) + "\n";
    report += "error=" + o.error + "\n";
    report += "stamp=" + std::to_string(fs::exists(batch::stamp_path(jobs[0].output))) + "\n";
    batch::BatchResult result;
    result.outcomes.push_back(o);
    try {
      batch::write_report_json(result, {"p.yaml", "0", std::nullopt, 1}, disk / "r.json");
      report += "report=written\n";
    } catch (const Error& e) {
      report += std::string("report_error=") + e.what() + "\n";
    }
    report += "left=" + test::list_folder(disk);
    return 0;
  });
  if (skip_without_tiny_fs(run)) return;
  INFO(run.report);
  REQUIRE(run.exit_code == 0);
  CHECK(run.report.find("status=failed\n") != std::string::npos);
  CHECK(run.report.find("S0.pdf.stamp: cannot write: no space left on device") !=
        std::string::npos);
  CHECK(run.report.find("stamp=0\n") != std::string::npos);  // a rerun renders it again
  CHECK(run.report.find("r.json: cannot write: no space left on device") != std::string::npos);
  // The sheet itself was whole before the disk filled; no stamp, no report, no temporary.
  CHECK(run.report.find("left=S0.pdf\nfiller\n") != std::string::npos);
}
