// Bad input gives one line naming the file, line:column or key path and what was expected, exit 2,
// and leaves no output file behind.
#include <catch2/catch.hpp>

#include "render/render_support.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

void expect_clean_failure(const test::TempDir& dir, const std::vector<std::string>& args,
                          const std::string& expected_message) {
  auto out = dir / "out";
  fs::create_directories(out);
  std::vector<std::string> argv = args;
  argv.push_back("-o");
  argv.push_back((out / "sheet.pdf").string());
  auto r = test::run_sheetmill(argv);
  INFO(r.err);
  CHECK(r.exit_code == 2);
  CHECK(r.err == "sheetmill: " + expected_message + "\n");
  CHECK(fs::is_empty(out));  // no half-written PDF, no temporary left over
}

const char* kBase =
    "title: T\ncrs: EPSG:32632\nscale: 25000\npaper: {size: A4}\n"
    "extent: {centre: [480000, 5197000]}\n";

}  // namespace

TEST_CASE("a missing project file", "[render]") {
  test::TempDir dir;
  std::string p = (dir / "none.yaml").string();
  expect_clean_failure(dir, {"render", p}, p + ": file not found or not readable");
}

TEST_CASE("a YAML syntax error names line and column", "[render]") {
  test::TempDir dir;
  auto p = dir / "p.yaml";
  test::write_text(p, "title: T\npaper: {size: A4\ncrs: x\n");
  auto r = test::run_sheetmill({"render", p.string(), "-o", (dir / "x.pdf").string()});
  CHECK(r.exit_code == 2);
  CHECK(r.err.rfind("sheetmill: " + p.string() + ":", 0) == 0);
  CHECK(r.err.find("YAML syntax error") != std::string::npos);
  CHECK(std::count(r.err.begin(), r.err.end(), '\n') == 1);
  CHECK_FALSE(fs::exists(dir / "x.pdf"));
}

TEST_CASE("an unknown key and a wrong type", "[render]") {
  test::TempDir dir;
  auto p = dir / "p.yaml";
  test::write_text(p, std::string(kBase) + "styel: s.yaml\n");
  expect_clean_failure(dir, {"render", p.string()},
                       p.string() + ":6:1: styel: unknown key 'styel'; did you mean 'style'?");
  test::write_text(p, std::string(kBase) + "style: s.yaml\noutput: {relief_dpi: high}\n");
  expect_clean_failure(dir, {"render", p.string()},
                       p.string() + ":7:22: output.relief_dpi: expected a number, got \"high\"");
}

TEST_CASE("a missing style file and a missing DEM", "[render]") {
  test::TempDir dir;
  auto p = dir / "p.yaml";
  test::write_text(p, std::string(kBase) + "style: nostyle.yaml\n");
  expect_clean_failure(dir, {"render", p.string()},
                       (dir / "nostyle.yaml").string() + ": file not found or not readable");
  auto project = test::write_demo_project(dir, "");
  std::string text = test::read_text(project);
  auto dem_at = text.find("dem: ");
  auto eol = text.find('\n', dem_at);
  text.replace(dem_at, eol - dem_at, "dem: " + (dir / "missing.tif").string());
  test::write_text(project, text);
  expect_clean_failure(dir, {"render", project.string()},
                       (dir / "missing.tif").string() + ": file not found");
}
