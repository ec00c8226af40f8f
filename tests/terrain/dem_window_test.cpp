// Reading a sheet's window of a DEM (read_dem_window): warping, windows beyond the data,
// nodata, units, and the errors a user can cause.
#include <catch2/catch.hpp>
#include <cmath>

#include "dem_fixtures.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/terrain/dem_source.hpp"
#include "sheetmill/terrain/relief.hpp"
#include "sheetmill/terrain/shade.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;

namespace {
// A tilted plane (analytic): bilinear resampling reproduces a plane exactly, so warped values
// can be checked against the formula at the new cell centres.
double tilted(double e, double n) {
  return 100 + 0.02 * (e - 440000) - 0.035 * (n - 6640000);
}

std::filesystem::path plane_tif(const sheetmill::test::TempDir& tmp, double nodata_from_e = 1e99) {
  auto g = fixture::make_grid(200, 150, 440000, 6650000, 20.0, fixture::wkt_of(32633));
  Dem d = fixture::sample_dem(g, tilted);
  for (int r = 0; r < g.height; ++r)
    for (int c = 0; c < g.width; ++c)
      if (g.geotransform[0] + (c + 0.5) * 20.0 > nodata_from_e) d.z[r * g.width + c] = NAN;
  auto p = tmp / "plane.tif";
  fixture::write_geotiff(p, g, d.z);
  return p;
}

bool any_warning_contains(const log::WarningCollector& w, const std::string& text) {
  for (const auto& m : w.warnings())
    if (m.find(text) != std::string::npos) return true;
  return false;
}
}  // namespace

TEST_CASE("a window warped to a shifted grid keeps a plane exact", "[terrain]") {
  sheetmill::test::TempDir tmp("dem-window");
  auto path = plane_tif(tmp);
  // Cells offset by 7 m: every target centre falls between source centres. (Same cell size:
  // when the target is coarser GDAL widens the bilinear kernel to filter, no longer exact.)
  auto target = fixture::make_grid(80, 60, 440507, 6649493, 20.0, fixture::wkt_of(32633));
  Dem dem = read_dem_window(path.string(), target);
  REQUIRE(dem.width() == 80);
  REQUIRE(dem.height() == 60);
  CHECK(dem.cell_x_m == Approx(20.0));
  CHECK(dem.cell_y_m == Approx(20.0));
  double worst = 0;
  for (int r = 0; r < 60; ++r) {
    for (int c = 0; c < 80; ++c) {
      double e = 440507 + (c + 0.5) * 20, n = 6649493 - (r + 0.5) * 20;
      worst = std::max(worst, std::abs(dem.at(c, r) - tilted(e, n)));
    }
  }
  // Float32 elevations near 100-400 m: a few ulp (1e-5 m) of rounding; 1 mm is generous.
  CHECK(worst < 1e-3);
}

TEST_CASE("a window larger than the data: NaN outside, data inside, a warning", "[terrain]") {
  sheetmill::test::TempDir tmp("dem-window");
  auto path = plane_tif(tmp);
  // The DEM spans E 440000..444000; this window spans 439000..445000.
  auto target = fixture::make_grid(300, 100, 439000, 6649000, 20.0, fixture::wkt_of(32633));
  log::WarningCollector warnings;
  Dem dem = read_dem_window(path.string(), target);
  CHECK(std::isnan(dem.at(10, 50)));   // E 439210: west of the data
  CHECK(std::isnan(dem.at(290, 50)));  // E 444810: east of the data
  CHECK(dem.at(150, 50) == Approx(tilted(439000 + 150.5 * 20, 6649000 - 50.5 * 20)).margin(1e-3));
  CHECK(any_warning_contains(warnings, "covers"));
  // Shading still works; holes stay 0, data is shaded up to the edge of the data.
  auto bytes = hillshade(dem, {});
  CHECK(bytes[50 * 300 + 10] == 0);
  CHECK(bytes[50 * 300 + 51] >= 1);  // first column with data (E 440030)
  CHECK(bytes[50 * 300 + 150] >= 1);
}

TEST_CASE("a window partly in nodata and an all-nodata window", "[terrain]") {
  sheetmill::test::TempDir tmp("dem-window");
  auto path = plane_tif(tmp, 442000);  // east half is nodata
  auto target = fixture::make_grid(100, 50, 441000, 6649000, 20.0, fixture::wkt_of(32633));
  {
    log::WarningCollector warnings;
    Dem dem = read_dem_window(path.string(), target);
    CHECK(!std::isnan(dem.at(10, 10)));
    CHECK(std::isnan(dem.at(90, 10)));
    CHECK(any_warning_contains(warnings, "covers"));
    ReliefImage img = render_relief(dem, {});
    CHECK(img.argb[10 * 100 + 90] == 0);  // transparent hole
    CHECK((img.argb[10 * 100 + 10] >> 24) > 0);
  }
  {
    auto far = fixture::make_grid(50, 50, 600000, 6649000, 20.0, fixture::wkt_of(32633));
    log::WarningCollector warnings;
    Dem dem = read_dem_window(path.string(), far);
    CHECK(dem.valid_count() == 0);
    CHECK(any_warning_contains(warnings, "no data"));
    auto bytes = hillshade(dem, {});
    CHECK(std::all_of(bytes.begin(), bytes.end(), [](auto b) { return b == 0; }));
    ReliefImage img = render_relief(dem, {});
    CHECK(std::all_of(img.argb.begin(), img.argb.end(), [](auto p) { return p == 0; }));
  }
}

TEST_CASE("elevations in feet are converted to metres", "[terrain]") {
  sheetmill::test::TempDir tmp("dem-feet");
  auto g = fixture::make_grid(10, 10, 440000, 6650000, 20.0, fixture::wkt_of(32633));
  std::vector<float> z(100, 1000.0f);
  auto path = tmp / "feet.tif";
  fixture::write_geotiff(path, g, z);
  {
    DatasetPtr ds(GDALDataset::Open(path.c_str(), GDAL_OF_RASTER | GDAL_OF_UPDATE));
    ds->GetRasterBand(1)->SetUnitType("ft");
  }
  // 1000 international feet = 304.8 m (definition of the foot, 0.3048 m).
  CHECK(DemSource(path.string()).read_all().at(5, 5) == Approx(304.8));
  CHECK(read_dem_window(path.string(), g).at(5, 5) == Approx(304.8));
  // A stated unit overrides: US survey feet, 1200/3937 m.
  DemReadOptions us;
  us.vertical_unit = "us-ft";
  CHECK(DemSource(path.string(), us).read_all().at(5, 5) == Approx(1000.0 * 1200 / 3937));
}

TEST_CASE("bad DEM input gives one-line input errors", "[terrain]") {
  sheetmill::test::TempDir tmp("dem-errors");
  auto target = fixture::make_grid(10, 10, 440000, 6650000, 20.0, fixture::wkt_of(32633));
  auto expect_input_error = [&](const std::string& path, const std::string& fragment) {
    try {
      read_dem_window(path, target);
      FAIL("no error for " << path);
    } catch (const Error& e) {
      CHECK(e.kind() == Error::Kind::input);
      CHECK(std::string(e.what()).find(fragment) != std::string::npos);
      CHECK(std::string(e.what()).find('\n') == std::string::npos);
      CHECK(std::string(e.what()).rfind(path, 0) == 0);  // starts with the file
    }
  };
  // No CRS and none stated.
  auto g = target;
  g.crs_wkt.clear();
  auto nocrs = tmp / "nocrs.tif";
  fixture::write_geotiff(nocrs, g, std::vector<float>(100, 5.0f));
  expect_input_error(nocrs.string(), "no coordinate reference system");
  DemReadOptions stated;
  stated.assumed_crs = "EPSG:32633";
  CHECK(read_dem_window(nocrs.string(), target, stated).at(3, 3) == Approx(5.0));
  // A stated CRS that is not one.
  stated.assumed_crs = "EPSG:not-a-code";
  CHECK_THROWS_AS(read_dem_window(nocrs.string(), target, stated), Error);
  // Unreadable (garbage in a .tif), not a raster (a text file), missing.
  sheetmill::test::write_text(tmp / "garbage.tif", std::string("II*\0garbage", 11));
  expect_input_error((tmp / "garbage.tif").string(), "not a raster");
  sheetmill::test::write_text(tmp / "notes.txt", "these are field notes, not elevations\n");
  expect_input_error((tmp / "notes.txt").string(), "not a raster");
  expect_input_error((tmp / "missing.tif").string(), "file not found");
}

TEST_CASE("relief strips join into the whole window without seams", "[terrain]") {
  sheetmill::test::TempDir tmp("dem-strips");
  auto g = fixture::make_grid(120, 90, 440000, 6650000, 25.0, fixture::wkt_of(32633));
  Dem d = fixture::sample_dem(g, [](double e, double n) {
    return 500 + 150 * std::sin((e - 440000) / 300.0) * std::cos((n - 6650000) / 250.0);
  });
  auto path = tmp / "hills.tif";
  fixture::write_geotiff(path, g, d.z);
  auto target = fixture::make_grid(70, 50, 440500, 6649500, 25.0, fixture::wkt_of(32633));
  ReliefParams params;
  params.shade_strength = 0.8;
  ReliefImage whole = render_relief_window(path.string(), target, {}, params);
  std::vector<std::uint32_t> joined(whole.argb.size());
  render_relief_strips(path.string(), target, {}, params, 16, [&](int row0, const ReliefImage& s) {
    REQUIRE(s.width == 70);
    std::copy(s.argb.begin(), s.argb.end(), joined.begin() + row0 * 70);
  });
  CHECK(joined == whole.argb);
  // And the window's first row equals the same row shaded inside a larger window (true
  // neighbours at the frame edge, no extrapolation seam).
  auto bigger = fixture::make_grid(70, 52, 440500, 6649525, 25.0, fixture::wkt_of(32633));
  ReliefImage big = render_relief_window(path.string(), bigger, {}, params);
  CHECK(std::equal(whole.argb.begin(), whole.argb.begin() + 70, big.argb.begin() + 70));
}

TEST_CASE("a DEM a million cells on a side is read at the sheet's resolution, not in full",
          "[terrain][bounds]") {
  // A VRT of 10^6 x 10^6 cells (4 mm x 3 mm) over the 4 x 3 km plane: read in full it is 10^12
  // cells (4 TB of Float32). The sheet's 200 x 150 window at 20 m needs a 5000th of each axis.
  sheetmill::test::TempDir tmp("dem-huge");
  auto plane = plane_tif(tmp);
  auto vrt = tmp / "huge.vrt";
  sheetmill::test::write_text(
      vrt,
      "<VRTDataset rasterXSize=\"1000000\" rasterYSize=\"1000000\">\n"
      "  <SRS>EPSG:32633</SRS>\n"
      "  <GeoTransform>440000, 0.004, 0, 6650000, 0, -0.003</GeoTransform>\n"
      "  <VRTRasterBand dataType=\"Float32\" band=\"1\">\n"
      "    <SimpleSource>\n"
      "      <SourceFilename relativeToVRT=\"1\">plane.tif</SourceFilename>\n"
      "      <SourceBand>1</SourceBand>\n"
      "      <SrcRect xOff=\"0\" yOff=\"0\" xSize=\"200\" ySize=\"150\"/>\n"
      "      <DstRect xOff=\"0\" yOff=\"0\" xSize=\"1000000\" ySize=\"1000000\"/>\n"
      "    </SimpleSource>\n"
      "  </VRTRasterBand>\n"
      "</VRTDataset>\n");
  auto target = fixture::make_grid(200, 150, 440000, 6650000, 20.0, fixture::wkt_of(32633));
  Dem dem = read_dem_window(vrt.string(), target);
  REQUIRE(dem.valid_count() == 200u * 150u);
  // Nearest-neighbour decimation: each value is the plane within one 20 m source cell of the
  // target centre, so within 20 m x (0.02 + 0.035) m/m of the analytic plane.
  double worst = 0;
  for (int r = 0; r < 150; ++r) {
    for (int c = 0; c < 200; ++c) {
      double e = 440000 + (c + 0.5) * 20, n = 6650000 - (r + 0.5) * 20;
      worst = std::max(worst, std::abs(dem.at(c, r) - tilted(e, n)));
    }
  }
  CHECK(worst < 20 * (0.02 + 0.035));
}

TEST_CASE("the relief raster commands refuse a DEM beyond their bound before writing",
          "[terrain][bounds]") {
  // shade writes the DEM's own grid: 10^12 cells would be a terabyte; refused at once.
  sheetmill::test::TempDir tmp("dem-huge-shade");
  auto plane = plane_tif(tmp);
  auto vrt = tmp / "huge.vrt";
  sheetmill::test::write_text(
      vrt,
      "<VRTDataset rasterXSize=\"1000000\" rasterYSize=\"1000000\">\n"
      "  <SRS>EPSG:32633</SRS>\n"
      "  <GeoTransform>440000, 0.004, 0, 6650000, 0, -0.003</GeoTransform>\n"
      "  <VRTRasterBand dataType=\"Float32\" band=\"1\"/>\n"
      "</VRTDataset>\n");
  try {
    DemSource source(vrt.string());
    FAIL("expected the DEM to be refused");
  } catch (const Error& e) {
    CHECK(e.exit_code() == 2);
    CHECK(std::string(e.what()).find("huge.vrt: the DEM is 1000000 x 1000000 cells; a relief "
                                     "raster is written in the DEM's own grid, at most 1e+10 "
                                     "cells") != std::string::npos);
  }
}
