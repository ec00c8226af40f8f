// A sheet with a sea: the demo project with elevation.sea_level at 550 m, so the valley floors are
// sea. The collar note names heights and depths and both references (docs/contours.md).
#include <catch2/catch.hpp>
#include <regex>

#include "render/render_support.hpp"

using namespace sheetmill;

TEST_CASE("a sheet with a sea level says heights and depths", "[render]") {
  test::TempDir dir("sea-sheet");
  std::string text = test::read_text(test::source_dir() / "demo_area" / "project.yaml");
  text = std::regex_replace(text, std::regex("generated/"), test::demo_area().string() + "/");
  text = std::regex_replace(text, std::regex("\\.\\./styles/"),
                            (test::source_dir() / "styles").string() + "/");
  text = std::regex_replace(text, std::regex("size: A2"), "size: A3");
  text =
      std::regex_replace(text, std::regex("(  vertical_datum: [^\n]*\n)"), "$1  sea_level: 550m\n");
  REQUIRE(text.find("sea_level: 550m") != std::string::npos);
  test::write_text(dir / "project.yaml", text);
  auto r = test::run_sheetmill(
      {"render", (dir / "project.yaml").string(), "-o", (dir / "sheet.pdf").string()});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  auto txt = test::run_command({"pdftotext", "-raw", (dir / "sheet.pdf").string(), "-"});
  REQUIRE(txt.exit_code == 0);
  std::string notes = std::regex_replace(txt.out, std::regex("\\s+"), " ");
  INFO(notes);
  // The note's words, as pdftotext gives them across the wrapped lines.
  CHECK(notes.find("Heights and depths in metres") != std::string::npos);
  CHECK(notes.find("heights above the demo datum") != std::string::npos);
  CHECK(notes.find("depths below the sea level") != std::string::npos);
  CHECK(notes.find("550 m on the demo datum") != std::string::npos);
}
