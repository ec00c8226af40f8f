// Resampling a coarse DEM into a fine print grid before the gradient (resampling.hpp).
//
// Data: the Olinda DEM (Debian's r-cran-stars, ~90 m cells, UTM 25S), and a geographic copy of
// it that GDAL makes here (GDALWarp to EPSG:4326). Print grid: 2.117 m cells, a 1:25 000 sheet
// at 300 dpi (25.4 mm / 300 x 25 000), so one DEM cell spans about 42 print cells.
// Reference: GDAL's hillshade (GDALDEMProcessing, Horn) of GDAL's cubic warp (GDALWarp -r cubic)
// of the same DEM to the same grid, both dependencies run in-process as outside oracles.
// Statistic: the share of the sum of absolute first differences of the shade (along rows and
// along columns) carried by the largest 2 % of them. A bilinear surface's gradient jumps at
// every DEM cell edge, so its shade concentrates its changes on those edge lines (about 1 in 42
// differences) and the share is high; a C1 surface spreads them. Criterion from the relief
// issue: within 30 % of GDAL's figure, and the bilinear path must fail the same test.
#include "sheetmill/terrain/resampling.hpp"

#include <cpl_string.h>
#include <gdal_utils.h>

#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <functional>
#include <numeric>

#include "dem_fixtures.hpp"
#include "gdal_oracle.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/terrain/dem_source.hpp"
#include "sheetmill/terrain/shade.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;
namespace fs = std::filesystem;

namespace {

fs::path olinda() {
  return test::open_data("r-cran-stars", "usr/lib/R/site-library/stars/tif/olinda_dem_utm25s.tif");
}

// GDALWarp (the library form of the warp tool) of `src` with `args` into a GeoTIFF at `dst`.
void gdal_warp(const fs::path& src, const fs::path& dst, const std::vector<std::string>& args) {
  gdal_init();
  CPLStringList argv;
  for (const auto& a : args) argv.AddString(a.c_str());
  GDALWarpAppOptions* opts = GDALWarpAppOptionsNew(argv.List(), nullptr);
  REQUIRE(opts != nullptr);
  DatasetPtr in(GDALDataset::Open(src.c_str(), GDAL_OF_RASTER));
  REQUIRE(in);
  GDALDatasetH handles[] = {in.get()};
  int usage_error = 0;
  DatasetPtr out(
      GDALDataset::FromHandle(GDALWarp(dst.c_str(), nullptr, 1, handles, opts, &usage_error)));
  GDALWarpAppOptionsFree(opts);
  REQUIRE(out);
}

// The print grid: `cells` x `cells` of `cell_m` centred on the Olinda DEM, in its own CRS.
RasterGrid print_grid(int cells, double cell_m) {
  RasterGrid dem = DemSource(olinda().string()).grid();
  Point c = dem.bounds().centre();
  return fixture::make_grid(cells, cells, c.x - cells * cell_m / 2, c.y + cells * cell_m / 2,
                            cell_m, dem.crs_wkt);
}

// GDAL's cubic warp of `dem_path` to `grid`, then GDAL's Horn hillshade of it (edges computed).
std::vector<std::uint8_t> gdal_reference_shade(const fs::path& dem_path, const RasterGrid& grid,
                                               const test::TempDir& tmp) {
  const Box b = grid.bounds();
  const fs::path warped = tmp / "gdal-cubic.tif";
  gdal_warp(dem_path, warped,
            {"-r", "cubic", "-t_srs", grid.crs_wkt, "-te", std::to_string(b.min_x),
             std::to_string(b.min_y), std::to_string(b.max_x), std::to_string(b.max_y), "-ts",
             std::to_string(grid.width), std::to_string(grid.height), "-ot", "Float32", "-of",
             "GTiff", "-overwrite"});
  return fixture::gdal_hillshade(warped.string(),
                                 {"-az", "315", "-alt", "45", "-z", "1", "-compute_edges"});
}

std::vector<std::uint8_t> our_shade(const fs::path& dem_path, const RasterGrid& grid,
                                    const std::string& resampling) {
  DemReadOptions options;
  options.resampling = resampling;
  Dem dem = read_dem_window(dem_path.string(), grid, options);
  REQUIRE(dem.valid_count() == dem.z.size());
  return hillshade(dem, {ShadeMethod::horn, 315, 45, 1});
}

// Share of the sum of |first differences| (rows and columns, `border` cells left out) carried
// by the largest 2 % of them.
double top_share(const std::vector<std::uint8_t>& b, int w, int h, int border) {
  std::vector<int> d;
  for (int r = border; r < h - border; ++r) {
    for (int c = border; c < w - border; ++c) {
      const int v = b[static_cast<std::size_t>(r) * w + c];
      d.push_back(std::abs(b[static_cast<std::size_t>(r) * w + c + 1] - v));
      d.push_back(std::abs(b[static_cast<std::size_t>(r + 1) * w + c] - v));
    }
  }
  const std::size_t top = d.size() / 50;
  std::nth_element(d.begin(), d.begin() + static_cast<std::ptrdiff_t>(top), d.end(),
                   std::greater<int>());
  const double all = std::accumulate(d.begin(), d.end(), 0.0);
  const double largest =
      std::accumulate(d.begin(), d.begin() + static_cast<std::ptrdiff_t>(top), 0.0);
  return all > 0 ? largest / all : 0.0;
}

void check_smooth_like_gdal(const fs::path& dem_path, const test::TempDir& tmp) {
  const RasterGrid grid = print_grid(1200, 25.4 / 300 * 25);
  const int w = grid.width, h = grid.height, border = 3;
  const double gdal = top_share(gdal_reference_shade(dem_path, grid, tmp), w, h, border);
  const double automatic = top_share(our_shade(dem_path, grid, "auto"), w, h, border);
  const double bilinear = top_share(our_shade(dem_path, grid, "bilinear"), w, h, border);
  INFO("top-2 % share of |first differences|: GDAL cubic " << gdal << ", auto " << automatic
                                                           << ", bilinear " << bilinear);
  REQUIRE(gdal > 0);
  CHECK(std::abs(automatic - gdal) <= 0.3 * gdal);
  // The statistic discriminates: the bilinear surface fails the same criterion.
  CHECK(std::abs(bilinear - gdal) > 0.3 * gdal);
}

}  // namespace

TEST_CASE("auto resampling picks cubic convolution when upsampling, average when coarse",
          "[terrain][resampling]") {
  // The rule of resampling.hpp (design choice, no outside figure): average from 2 DEM cells per
  // print cell.
  CHECK(choose_resampling(Resampling::automatic, 2.1, 90) == Resampling::cubic);
  CHECK(choose_resampling(Resampling::automatic, 150, 90) == Resampling::cubic);
  CHECK(choose_resampling(Resampling::automatic, 180, 90) == Resampling::average);
  CHECK(choose_resampling(Resampling::bilinear, 2.1, 90) == Resampling::bilinear);
  CHECK(choose_resampling(Resampling::cubic, 900, 90) == Resampling::cubic);
  CHECK(parse_resampling("average") == Resampling::average);
  CHECK_THROWS_AS(parse_resampling("sinc"), Error);
}

TEST_CASE("a coarse UTM DEM prints as smooth as GDAL's hillshade of a cubic warp",
          "[terrain][resampling]") {
  test::TempDir tmp("smooth-utm");
  check_smooth_like_gdal(olinda(), tmp);
}

TEST_CASE("a coarse geographic DEM prints as smooth as GDAL's hillshade of a cubic warp",
          "[terrain][resampling]") {
  test::TempDir tmp("smooth-geo");
  // The geographic copy, made by GDAL: EPSG:4326 at GDAL's own choice of cell (about 90 m).
  const fs::path geographic = tmp / "olinda-4326.tif";
  gdal_warp(olinda(), geographic,
            {"-t_srs", "EPSG:4326", "-r", "bilinear", "-ot", "Float32", "-of", "GTiff"});
  check_smooth_like_gdal(geographic, tmp);
}

TEST_CASE("a print grid much coarser than the DEM is the DEM's average over each print cell",
          "[terrain][resampling]") {
  // Print cells of 4 DEM cells (360 m): auto must average. Reference: GDALWarp -r average of
  // the same DEM to the same grid (GDAL as oracle); both are float, so 1 mm is ample.
  test::TempDir tmp("average");
  const RasterGrid grid = print_grid(20, 360);
  DemReadOptions options;
  options.resampling = "auto";
  Dem ours = read_dem_window(olinda().string(), grid, options);
  const Box b = grid.bounds();
  const fs::path ref_path = tmp / "gdal-average.tif";
  gdal_warp(
      olinda(), ref_path,
      {"-r", "average", "-t_srs", grid.crs_wkt, "-te", std::to_string(b.min_x),
       std::to_string(b.min_y), std::to_string(b.max_x), std::to_string(b.max_y), "-ts",
       std::to_string(grid.width), std::to_string(grid.height), "-ot", "Float32", "-of", "GTiff"});
  Dem ref = DemSource(ref_path.string()).read_all();
  REQUIRE(ref.z.size() == ours.z.size());
  double worst = 0;
  for (std::size_t i = 0; i < ref.z.size(); ++i) {
    worst = std::max(worst, std::abs(double(ours.z[i]) - double(ref.z[i])));
  }
  CHECK(worst <= 1e-3);
}
