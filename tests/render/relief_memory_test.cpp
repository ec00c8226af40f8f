// The sheet's peak memory is bounded by relief strips, not by the relief raster (issue 16): the
// demo sheet rendered with its relief at 150 and at 300 dpi (4x the cells) in child processes,
// their peak resident sizes taken from wait4(2). Held whole, the relief costs at least 9 bytes
// a cell (4 of premultiplied ARGB, 4 of elevation, 1 of hillshade), so the 300 dpi sheet would
// need 9 bytes more for every added cell; in strips the difference is a strip's worth at most.
#include <fcntl.h>
#include <gdal_priv.h>
#include <ogrsf_frmts.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include <catch2/catch.hpp>
#include <regex>

#include "render/render_support.hpp"
#include "sheetmill/core/gdal_env.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

// Runs sheetmill with `args` in a child; returns its peak resident set in bytes (0 on failure).
long peak_rss_bytes(const std::vector<std::string>& args) {
  std::vector<std::string> argv{test::sheetmill_exe().string()};
  argv.insert(argv.end(), args.begin(), args.end());
  std::vector<char*> cargv;
  for (auto& a : argv) cargv.push_back(a.data());
  cargv.push_back(nullptr);
  const pid_t pid = fork();
  if (pid == 0) {
    const int null = open("/dev/null", O_WRONLY);
    dup2(null, 1);
    dup2(null, 2);
    execv(cargv[0], cargv.data());
    _exit(127);
  }
  int status = 0;
  rusage usage{};
  if (pid < 0 || wait4(pid, &status, 0, &usage) != pid) return 0;
  if (!WIFEXITED(status) || WEXITSTATUS(status) != 0) return 0;
  return usage.ru_maxrss * 1024L;  // Linux reports kilobytes
}

// Relief cells of the sheet's map frame at `dpi`, from the frame GDAL reads back (NEATLINE, in
// metres of the sheet CRS) at the demo scale 1:25 000.
double relief_cells(const fs::path& pdf, double dpi) {
  gdal_init();
  DatasetPtr ds(GDALDataset::Open(pdf.c_str(), GDAL_OF_RASTER));
  REQUIRE(ds);
  const char* neatline = ds->GetMetadataItem("NEATLINE");
  REQUIRE(neatline);
  OGRGeometry* frame = nullptr;
  REQUIRE(OGRGeometryFactory::createFromWkt(neatline, nullptr, &frame) == OGRERR_NONE);
  OGREnvelope env;
  frame->getEnvelope(&env);
  OGRGeometryFactory::destroyGeometry(frame);
  const double cells_per_m = 1000.0 / 25000 / 25.4 * dpi;
  return (env.MaxX - env.MinX) * cells_per_m * (env.MaxY - env.MinY) * cells_per_m;
}

}  // namespace

TEST_CASE("a sheet's peak memory does not grow with its relief raster", "[render]") {
  test::TempDir dir("relief-memory");
  long peak[2] = {0, 0};
  const int dpis[2] = {150, 300};
  for (int i = 0; i < 2; ++i) {
    auto project = test::write_demo_project(dir);
    std::string text = test::read_text(project);
    text = std::regex_replace(text, std::regex("relief_dpi: 300"),
                              "relief_dpi: " + std::to_string(dpis[i]));
    REQUIRE(text.find("relief_dpi: " + std::to_string(dpis[i])) != std::string::npos);
    test::write_text(project, text);
    const auto out = dir / ("sheet-" + std::to_string(dpis[i]) + ".pdf");
    peak[i] = peak_rss_bytes({"-q", "render", project.string(), "-o", out.string()});
    REQUIRE(peak[i] > 0);
  }
  const double added_cells =
      relief_cells(dir / "sheet-300.pdf", 300) - relief_cells(dir / "sheet-150.pdf", 150);
  INFO("peak at 150 dpi " << peak[0] / 1e6 << " MB, at 300 dpi " << peak[1] / 1e6 << " MB, "
                          << added_cells / 1e6 << " M cells added");
  REQUIRE(added_cells > 1e7);  // the demo A2 frame: about 22 M cells more at 300 dpi
  // At most 2 bytes a cell (whole, it is at least 9).
  CHECK(static_cast<double>(peak[1] - peak[0]) < 2 * added_cells);
}
