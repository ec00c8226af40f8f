// Degenerate numbers in a project file are input errors at their key, read in milliseconds:
// before these bounds a scale of 1e300 or a margin of 1e300mm ran out of memory or looped.
// The bounds are config/bounds.hpp's (the PDF page limit, ISO 32000-1 annex C.2: 200 in).
#include <catch2/catch.hpp>
#include <functional>

#include "sheetmill/core/error.hpp"
#include "sheetmill/project/project.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {
std::string load_error(const std::string& text) {
  test::TempDir dir("project-bounds");
  test::write_text(dir / "p.yaml", text);
  try {
    project::load_project(dir / "p.yaml");
  } catch (const Error& e) {
    CHECK(e.exit_code() == 2);
    std::string m = e.what();
    return m.substr(m.find("p.yaml"));
  }
  return "(no error)";
}
std::string project_with(const std::string& scale, const std::string& extra) {
  return "title: T\ncrs: EPSG:32632\nscale: " + scale +
         "\npaper: {size: A3, orientation: landscape}\n"
         "extent: {centre: [480000, 5197000]}\nstyle: s.yaml\n" +
         extra;
}
}  // namespace

TEST_CASE("a project's scale, margin and extent are bounded where they are read",
          "[project][bounds]") {
  CHECK(load_error(project_with("1e300", "")) ==
        "p.yaml:3:8: scale: expected a scale from 1:1 to 1:100 000 000 such as 1:25000, "
        "1:25 000 or 25000, got \"1e300\"");
  CHECK(load_error(project_with("0.5", "")).find("p.yaml:3:8: scale: expected") == 0);
  // A3 landscape: 420 x 297 mm; a margin takes at most 45% of 297 mm = 133.65 mm.
  CHECK(load_error(project_with("25000", "margin: -3000mm\n")) ==
        "p.yaml:7:9: margin: expected a margin from 0mm to 133.65mm (45% of the paper's shorter "
        "side), got \"-3000mm\"");
  CHECK(load_error(project_with("25000", "margin: 1e300mm\n")) ==
        "p.yaml:7:9: margin: expected a length of at most 5080mm (200 in, the largest PDF page), "
        "got \"1e300mm\"");
  CHECK(load_error(project_with("25000", "margin: 12mm\n")) == "(no error)");
  std::string box =
      "title: T\ncrs: EPSG:32632\nscale: 25000\npaper: {size: A3}\n"
      "extent: {box: [-1e300, 0, 1e300, 1]}\nstyle: s.yaml\n";
  CHECK(load_error(box) ==
        "p.yaml:5:16: extent.box[0]: expected a coordinate of at most 1e9 in the CRS's units, got "
        "\"-1e300\"");
}
