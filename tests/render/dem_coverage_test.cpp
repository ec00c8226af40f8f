// The DEM's coverage of the map frame is reported once per sheet and with the frame's own
// figure: a Web Mercator copy of the demo DEM (made by GDAL's warper here) that covers the whole
// frame gives no warning, one cut at the frame's centre line gives one warning of about 50 %.
#include <algorithm>
#include <catch2/catch.hpp>
#include <regex>
#include <sstream>

#include "render/render_support.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

// The coverage warnings in a render's log lines.
std::vector<std::string> coverage_lines(const std::string& err) {
  std::vector<std::string> out;
  std::istringstream in(err);
  for (std::string line; std::getline(in, line);)
    if (line.find(" covers ") != std::string::npos ||
        line.find("no elevation data") != std::string::npos)
      out.push_back(line);
  return out;
}

test::CommandResult render_with_dem(const test::TempDir& dir, const fs::path& dem) {
  std::string text = test::read_text(test::source_dir() / "demo_area" / "project.yaml");
  text = std::regex_replace(text, std::regex("generated/dem.tif"), dem.string());
  text = std::regex_replace(text, std::regex("generated/"), test::demo_area().string() + "/");
  text = std::regex_replace(text, std::regex("\\.\\./styles/"),
                            (test::source_dir() / "styles").string() + "/");
  text = std::regex_replace(text, std::regex("size: A2"), "size: A4");
  test::write_text(dir / "project.yaml", text);
  return test::run_sheetmill(
      {"render", (dir / "project.yaml").string(), "-o", (dir / "sheet.pdf").string()});
}

}  // namespace

TEST_CASE("DEM coverage of the frame is reported once, with the frame's figure", "[render]") {
  test::TempDir dir("coverage");
  const fs::path demo = test::demo_area() / "dem.tif";
  const fs::path full = dir / "mercator.tif", half = dir / "west.tif", cut = dir / "cut.tif";
  REQUIRE(test::run_command({"gdalwarp", "-q", "-t_srs", "EPSG:3857", "-r", "bilinear",
                             demo.string(), full.string()})
              .exit_code == 0);
  auto r = render_with_dem(dir, full);
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  CHECK(coverage_lines(r.err).empty());  // the frame is covered: no "92.3 %"

  // West of the frame's centre (E 480 500, the project's extent centre) only.
  REQUIRE(test::run_command({"gdal_translate", "-q", "-projwin", "470000", "5210000", "480500",
                             "5185000", demo.string(), cut.string()})
              .exit_code == 0);
  REQUIRE(test::run_command({"gdalwarp", "-q", "-t_srs", "EPSG:3857", "-r", "bilinear",
                             cut.string(), half.string()})
              .exit_code == 0);
  r = render_with_dem(dir, half);
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  auto lines = coverage_lines(r.err);
  REQUIRE(lines.size() == 1);
  std::smatch m;
  REQUIRE(std::regex_search(lines[0], m, std::regex("covers ([0-9.]+) % of the map frame")));
  const double percent = std::stod(m[1]);
  // Half the frame by construction; the warp's edge cells blur it by a cell or two.
  CHECK(percent > 48);
  CHECK(percent < 52);
}
