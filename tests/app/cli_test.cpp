// The command line as a user meets it: outputs chosen by extension, scales written as
// representative fractions, help and errors in our own words, and `check` against `render`.
#include <catch2/catch.hpp>
#include <fstream>
#include <regex>

#include "sheetmill/app/app.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

std::string demo_project() {
  return (test::source_dir() / "demo_area/project.yaml").string();
}

// The demo project with its data paths pointing at the generated demo area, and `extra` lines
// appended or substituted; written into `dir`.
fs::path demo_project_copy(const test::TempDir& dir, const std::string& edit_from = "",
                           const std::string& edit_to = "") {
  std::string text = test::read_text(test::source_dir() / "demo_area/project.yaml");
  text = std::regex_replace(text, std::regex("generated/"), test::demo_area().string() + "/");
  text = std::regex_replace(text, std::regex(R"(\.\./styles/)"),
                            (test::source_dir() / "styles").string() + "/");
  if (!edit_from.empty()) text = std::regex_replace(text, std::regex(edit_from), edit_to);
  fs::path p = dir / "project.yaml";
  test::write_text(p, text);
  return p;
}

std::string magic(const fs::path& p, std::size_t n) {
  std::ifstream in(p, std::ios::binary);
  std::string s(n, '\0');
  in.read(s.data(), static_cast<std::streamsize>(n));
  return s;
}

}  // namespace

TEST_CASE("the output's extension chooses the format, in any case", "[app]") {
  test::TempDir tmp("cli-ext");
  // Refused before any data is read: exit 2, one line listing what is written.
  for (const char* name : {"sheet.jpg", "sheet.svg", "sheet"}) {
    INFO(name);
    auto r = test::run_sheetmill({"render", demo_project(), "-o", (tmp / name).string()});
    CHECK(r.exit_code == 2);
    CHECK(r.err.find(".pdf, .png, .tif or .tiff") != std::string::npos);
    CHECK(std::count(r.err.begin(), r.err.end(), '\n') == 1);
    CHECK_FALSE(fs::exists(tmp / name));
  }
  // Upper case is the same format: PNG signature (ISO/IEC 15948) and TIFF byte order mark.
  fs::path project = demo_project_copy(tmp, "size: A2", "size: A4");
  auto png = test::run_sheetmill(
      {"render", project.string(), "-o", (tmp / "s.PNG").string(), "--dpi", "40"});
  REQUIRE(png.exit_code == 0);
  CHECK(magic(tmp / "s.PNG", 8) == "\x89PNG\r\n\x1a\n");
  auto tif = test::run_sheetmill(
      {"render", project.string(), "-o", (tmp / "s.TIFF").string(), "--dpi", "40"});
  REQUIRE(tif.exit_code == 0);
  CHECK((magic(tmp / "s.TIFF", 4) == std::string("II*\0", 4) ||
         magic(tmp / "s.TIFF", 4) == std::string("MM\0*", 4)));
  // Commands that write one kind of file refuse the others.
  auto shade = test::run_sheetmill(
      {"shade", (test::demo_area() / "dem.tif").string(), (tmp / "shade.png").string()});
  CHECK(shade.exit_code == 2);
  CHECK(shade.err.find("this command writes .tif or .tiff") != std::string::npos);
  auto exhibit =
      test::run_sheetmill({"exhibit", (test::source_dir() / "demo_area/exhibit.yaml").string(),
                           "-o", (tmp / "e.tif").string()});
  CHECK(exhibit.exit_code == 2);
  CHECK(exhibit.err.find(".pdf or .png") != std::string::npos);
}

TEST_CASE("a project's scale may be a representative fraction", "[app]") {
  test::TempDir tmp("cli-rf");
  for (const char* form : {"\"1:25000\"", "\"1:25 000\"", "25000", "1:25000"}) {
    INFO(form);
    fs::path project = demo_project_copy(tmp, "scale: 25000", std::string("scale: ") + form);
    auto r = test::run_sheetmill({"check", project.string()});
    CHECK(r.exit_code == 0);
    CHECK(r.out.find("scale: 1:25 000\n") != std::string::npos);
  }
  fs::path bad = demo_project_copy(tmp, "scale: 25000", "scale: \"1:0\"");
  auto r = test::run_sheetmill({"check", bad.string()});
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("scale: expected a scale from 1:1 to 1:100 000 000 such as 1:25000") !=
        std::string::npos);
  // The index and contours commands read the same forms.
  auto index = test::run_sheetmill({"index", (tmp / "t.gpkg").string(), "--crs", "EPSG:32632",
                                    "--scale", "1:25 000", "--frame", "400x300mm", "--extent",
                                    "470000,5190000,480000,5197500"});
  CHECK(index.exit_code == 0);
  auto index_bad = test::run_sheetmill({"index", (tmp / "t2.gpkg").string(), "--crs", "EPSG:32632",
                                        "--scale", "1:abc", "--frame", "400x300mm", "--extent",
                                        "470000,5190000,480000,5197500"});
  CHECK(index_bad.exit_code == 2);
  auto contours_bad = test::run_sheetmill({"contours", (test::demo_area() / "dem.tif").string(),
                                           (tmp / "c.gpkg").string(), "--scale", "1:-5"});
  CHECK(contours_bad.exit_code == 2);
  CHECK(contours_bad.err.find("--scale: expected a scale") != std::string::npos);
}

TEST_CASE("help and errors speak our words with units, not the parser's", "[app]") {
  // The parser's own phrases (CLI11's defaults) must not reach a user.
  const std::regex raw(R"(FLOAT|TEXT:\{|INT:|in \[|not in range|NONNEGATIVE|POSITIVE)");
  for (const auto& [cmd, options] : app::command_options()) {
    INFO("sheetmill " << cmd << " --help");
    auto r = test::run_sheetmill({cmd, "--help"});
    CHECK(r.exit_code == 0);
    CHECK_FALSE(std::regex_search(r.out, raw));
  }
  auto dpi = test::run_sheetmill({"render", demo_project(), "-o", "x.pdf", "--dpi", "5"});
  CHECK(dpi.exit_code == 2);
  CHECK(dpi.err ==
        "sheetmill: --dpi: expected a resolution from 20 to 1200 dots per inch, got \"5\" "
        "(see sheetmill render --help)\n");
  auto method = test::run_sheetmill({"shade", "a.tif", "b.tif", "--method", "fast"});
  CHECK(method.err.find("expected horn, zevenbergen-thorne or multidirectional, got \"fast\"") !=
        std::string::npos);
  auto none = test::run_sheetmill({});
  CHECK(none.exit_code == 2);
  CHECK(none.err.find("name a command") != std::string::npos);
}

TEST_CASE("counts in the log take the right number", "[app]") {
  test::TempDir tmp("cli-plural");
  fs::path project = demo_project_copy(tmp);
  auto r = test::run_sheetmill({"render", project.string(), "-o", (tmp / "s.pdf").string()});
  REQUIRE(r.exit_code == 0);
  // The demo has one railway and one summit: "1 feature", never "1 features".
  CHECK(r.err.find("layer railways: 1 feature,") != std::string::npos);
  CHECK_FALSE(std::regex_search(r.err, std::regex(R"(\b1 (features|labels|sheets|lines)\b)")));
}

TEST_CASE("check lists what render would draw and fails where render fails", "[app]") {
  test::TempDir demo("cli-check-demo");
  auto ok = test::run_sheetmill({"check", demo_project_copy(demo).string()});
  INFO(ok.err);
  REQUIRE(ok.exit_code == 0);
  // The eleven layers of styles/field.yaml, each with its feature count.
  for (const char* layer :
       {"landcover", "water_areas", "water_lines", "tracks", "roads", "railways", "power_lines",
        "buildings", "control_points", "summits", "places"}) {
    INFO(layer);
    CHECK(std::regex_search(
        ok.out, std::regex(std::string("\n  ") + layer + R"( +\d+ features? from source)")));
  }
  CHECK(ok.out.find("layers: 11 in the style") != std::string::npos);
  CHECK(ok.out.find("crs: WGS 84 / UTM zone 32N (EPSG:32632)") != std::string::npos);
  CHECK(ok.out.find("contour interval: 10 m (the project)") != std::string::npos);

  // Each broken style of the corpus, through a project that uses it: check and render stop with
  // the same one-line message.
  test::TempDir tmp("cli-check");
  int cases = 0;
  for (const auto& e : fs::directory_iterator(test::source_dir() / "tests/style/broken")) {
    if (e.path().extension() != ".yaml") continue;
    fs::path project = demo_project_copy(tmp, R"(style: \S+)", "style: " + e.path().string());
    INFO(e.path().filename().string());
    auto c = test::run_sheetmill({"check", project.string()});
    auto r = test::run_sheetmill({"render", project.string(), "-o", (tmp / "x.pdf").string()});
    CHECK(c.exit_code == 2);
    CHECK(r.exit_code == 2);
    CHECK(c.err == r.err);
    ++cases;
  }
  CHECK(cases >= 40);
  // A missing required source: listed, and the same message as render's.
  fs::path missing = demo_project_copy(
      tmp, "vector_data:", "sources:\n  roads: {path: nowhere.gpkg}\nvector_data:");
  auto c = test::run_sheetmill({"check", missing.string()});
  auto r = test::run_sheetmill({"render", missing.string(), "-o", (tmp / "x.pdf").string()});
  CHECK(c.exit_code == 2);
  CHECK(r.exit_code == 2);
  CHECK(c.out.find("roads            MISSING") != std::string::npos);
  CHECK(c.err == r.err);
}

TEST_CASE("render --style and the symbols command", "[app]") {
  test::TempDir tmp("cli-style");
  fs::path project = demo_project_copy(tmp, "size: A2", "size: A4");
  // A broken style given with --style is the one read (its error), not the project's.
  fs::path broken = test::source_dir() / "tests/style/broken/bad_hex_colour.yaml";
  auto r = test::run_sheetmill(
      {"render", project.string(), "-o", (tmp / "s.pdf").string(), "--style", broken.string()});
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("bad_hex_colour.yaml") != std::string::npos);
  auto s = test::run_sheetmill({"symbols", (test::source_dir() / "styles/field.yaml").string(),
                                "-o", (tmp / "symbols.pdf").string()});
  REQUIRE(s.exit_code == 0);
  CHECK(magic(tmp / "symbols.pdf", 5) == "%PDF-");
  // poppler reads the captions back: "layer / rule" for the style's rules.
  auto words = test::run_command({"pdftotext", (tmp / "symbols.pdf").string(), "-"});
  CHECK(words.out.find("landcover / wood") != std::string::npos);
}
