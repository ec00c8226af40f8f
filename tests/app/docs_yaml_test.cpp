// Every YAML example in the documentation loads with the reader its kind names, so a key the
// program renames fails the build until the docs follow. docs/style.md's examples are loaded by
// tests/style/docs_examples_test.cpp; this test takes every other page: project files (title and
// crs), exhibit files (title and areas or context), and tint ramps (stops).
#include <catch2/catch.hpp>
#include <regex>

#include "app/docs_text.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/terrain/tint.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {
bool has_key(const std::string& text, const std::string& key) {
  return std::regex_search(text, std::regex("(^|\n)" + key + ":"));
}
}  // namespace

TEST_CASE("every YAML example in docs/ (besides style.md) loads", "[app][docs]") {
  test::TempDir tmp("docs-yaml");
  int loaded = 0;
  for (const auto& page : test::documentation_pages()) {
    if (page == "docs/style.md") continue;
    for (const auto& block : test::code_blocks(page)) {
      if (block.language != "yaml") continue;
      INFO(block.page.string() << ":" << block.first_line << "\n" << block.text);
      const auto file = tmp / "example.yaml";
      test::write_text(file, block.text);
      const std::string& t = block.text;
      if (has_key(t, "stops")) {
        CHECK_NOTHROW(terrain::load_ramp_file(file));
      } else if (has_key(t, "title") && (has_key(t, "areas") || has_key(t, "context"))) {
        CHECK_NOTHROW(exhibit::load_exhibit_project(file));
      } else if (has_key(t, "title") && has_key(t, "crs")) {
        CHECK_NOTHROW(project::load_project(file));
      } else if (std::regex_search(t, std::regex("^(accuracy|elevation|contours|magnetic|output|"
                                                 "tile_index|sources|paper|extent):"))) {
        // A section of a project file: inside a minimal project (with a DEM when the section
        // is not the elevation itself, since accuracy needs one).
        std::string project =
            "title: T\ncrs: EPSG:32632\nscale: 25000\nstyle: s.yaml\n" +
            std::string(has_key(t, "paper") ? "" : "paper: {size: A4}\n") +
            std::string(has_key(t, "extent") ? "" : "extent: {centre: [480500, 5197600]}\n") +
            std::string(has_key(t, "elevation") ? "" : "elevation: {dem: dem.tif}\n") + t;
        test::write_text(file, project);
        CHECK_NOTHROW(project::load_project(file));
      } else {
        FAIL("a YAML example of a kind this test does not know: teach it the reader");
      }
      ++loaded;
    }
  }
  CHECK(loaded >= 3);
}
