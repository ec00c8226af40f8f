// The relief raster commands end to end: `sheetmill shade`, `slope`, `tint`. Outputs are
// checked against GDAL's DEM processing run in-process (gdal_oracle.hpp) and for the GeoTIFF
// properties the issue asks for (tiled, compressed, the DEM's georeferencing, nodata).
#include <catch2/catch.hpp>
#include <cmath>

#include "dem_fixtures.hpp"
#include "gdal_oracle.hpp"
#include "sheetmill/terrain/raster_products.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;
namespace st = sheetmill::test;

namespace {
std::filesystem::path olinda() {
  return st::open_data("r-cran-stars", "usr/lib/R/site-library/stars/tif/olinda_dem_utm25s.tif");
}

DatasetPtr open_out(const std::filesystem::path& p) {
  gdal_init();
  DatasetPtr ds(GDALDataset::Open(p.c_str(), GDAL_OF_RASTER));
  REQUIRE(ds);
  return ds;
}

void check_georeferencing_matches(GDALDataset& out, const std::filesystem::path& dem) {
  DatasetPtr src = open_out(dem);
  double a[6], b[6];
  REQUIRE(out.GetGeoTransform(a) == CE_None);
  REQUIRE(src->GetGeoTransform(b) == CE_None);
  for (int i = 0; i < 6; ++i) CHECK(a[i] == Approx(b[i]));
  REQUIRE(out.GetSpatialRef());
  CHECK(out.GetSpatialRef()->IsSame(src->GetSpatialRef()));
  int bx = 0, by = 0;
  out.GetRasterBand(1)->GetBlockSize(&bx, &by);
  CHECK(bx == 256);
  CHECK(by == 256);
  const char* comp = out.GetMetadataItem("COMPRESSION", "IMAGE_STRUCTURE");
  CHECK(comp != nullptr);
}
}  // namespace

TEST_CASE("sheetmill shade writes a tiled, compressed Byte GeoTIFF equal to GDAL's", "[terrain]") {
  if (!std::filesystem::exists(olinda())) {
    WARN("skipped: " << olinda() << " absent (run scripts/fetch-test-data)");
    return;
  }
  st::TempDir tmp("cli-shade");
  auto out = tmp / "shade.tif";
  auto r = st::run_sheetmill({"shade", olinda().string(), out.string(), "--azimuth", "290",
                              "--altitude", "40", "--exaggeration", "2"});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  CHECK(r.err.empty());  // quiet when stderr is not a terminal
  DatasetPtr ds = open_out(out);
  CHECK(ds->GetRasterBand(1)->GetRasterDataType() == GDT_Byte);
  int has = 0;
  CHECK(ds->GetRasterBand(1)->GetNoDataValue(&has) == 0);
  CHECK(has);
  check_georeferencing_matches(*ds, olinda());
  const int w = ds->GetRasterXSize(), h = ds->GetRasterYSize();
  std::vector<std::uint8_t> ours(static_cast<std::size_t>(w) * h);
  REQUIRE(ds->GetRasterBand(1)->RasterIO(GF_Read, 0, 0, w, h, ours.data(), w, h, GDT_Byte, 0, 0,
                                         nullptr) == CE_None);
  auto ref = fixture::gdal_hillshade(olinda().string(), {"-az", "290", "-alt", "40", "-z", "2"});
  int worst = 0;
  for (int rr = 1; rr + 1 < h; ++rr)
    for (int c = 1; c + 1 < w; ++c)
      worst = std::max(worst, std::abs(ours[rr * w + c] - ref[rr * w + c]));
  CHECK(worst <= 1);
  for (int c = 0; c < w; ++c) CHECK(ours[c] >= 1);  // our edges are computed, not nodata
}

TEST_CASE("sheetmill slope in degrees and percent agrees with GDAL's slope", "[terrain]") {
  if (!std::filesystem::exists(olinda())) {
    WARN("skipped: " << olinda() << " absent (run scripts/fetch-test-data)");
    return;
  }
  st::TempDir tmp("cli-slope");
  for (bool percent : {false, true}) {
    auto out = tmp / (percent ? "pct.tif" : "deg.tif");
    std::vector<std::string> args = {"slope", olinda().string(), out.string()};
    if (percent) args.insert(args.end(), {"--units", "percent"});
    auto r = st::run_sheetmill(args);
    INFO(r.err);
    REQUIRE(r.exit_code == 0);
    DatasetPtr ds = open_out(out);
    CHECK(ds->GetRasterBand(1)->GetRasterDataType() == GDT_Float32);
    check_georeferencing_matches(*ds, olinda());
    const int w = ds->GetRasterXSize(), h = ds->GetRasterYSize();
    std::vector<float> ours(static_cast<std::size_t>(w) * h);
    REQUIRE(ds->GetRasterBand(1)->RasterIO(GF_Read, 0, 0, w, h, ours.data(), w, h, GDT_Float32, 0,
                                           0, nullptr) == CE_None);
    std::vector<std::string> gargs;
    if (percent) gargs.push_back("-p");
    auto ref = fixture::gdal_dem<float>(olinda().string(), "slope", gargs);
    double worst = 0;
    for (int rr = 1; rr + 1 < h; ++rr)
      for (int c = 1; c + 1 < w; ++c)
        worst = std::max(worst, double(std::abs(ours[rr * w + c] - ref[rr * w + c])));
    // Float32 gradients against GDAL's float sums in double: 0.01 (deg or %) is far below
    // what anyone reads off a slope map.
    CHECK(worst < 0.01);
  }
}

TEST_CASE("sheetmill slope: holes are 0 and masked, flat ground is 0 and data", "[terrain]") {
  // A plane rising 1 m per 25 m cell eastwards (atan(1/25) = 2.2906 deg, analytic) on the left
  // half, a flat floor on the right half, and a 10 x 10 hole in the left half.
  st::TempDir tmp("cli-slope-holes");
  auto g = fixture::make_grid(120, 100, 440000, 6650000, 25.0, fixture::wkt_of(32633));
  std::vector<float> z(120 * 100);
  for (int r = 0; r < 100; ++r)
    for (int c = 0; c < 120; ++c) z[r * 120 + c] = c < 60 ? 100.0f + c : 160.0f;
  for (int r = 40; r < 50; ++r)
    for (int c = 20; c < 30; ++c) z[r * 120 + c] = -9999.0f;
  auto dem = tmp / "dem.tif";
  fixture::write_geotiff(dem, g, z, -9999);
  auto out = tmp / "slope.tif";
  auto r = st::run_sheetmill({"slope", dem.string(), out.string()});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  DatasetPtr ds = open_out(out);
  // The caution travels with the raster (TIFF ImageDescription, read back by GDAL).
  const char* caution = ds->GetMetadataItem("TIFFTAG_IMAGEDESCRIPTION");
  REQUIRE(caution);
  CHECK(std::string(caution).find("not a survey") != std::string::npos);
  int has_nodata = 0;
  ds->GetRasterBand(1)->GetNoDataValue(&has_nodata);
  CHECK(has_nodata == 0);
  CHECK(ds->GetRasterBand(1)->GetMaskFlags() == GMF_PER_DATASET);
  std::vector<float> v(120 * 100);
  std::vector<std::uint8_t> m(120 * 100);
  REQUIRE(ds->GetRasterBand(1)->RasterIO(GF_Read, 0, 0, 120, 100, v.data(), 120, 100, GDT_Float32,
                                         0, 0, nullptr) == CE_None);
  REQUIRE(ds->GetRasterBand(1)->GetMaskBand()->RasterIO(GF_Read, 0, 0, 120, 100, m.data(), 120, 100,
                                                        GDT_Byte, 0, 0, nullptr) == CE_None);
  for (int rr = 40; rr < 50; ++rr)
    for (int c = 20; c < 30; ++c) {
      CHECK(v[rr * 120 + c] == 0.0f);
      CHECK(m[rr * 120 + c] == 0);
    }
  CHECK(v[70 * 120 + 90] == 0.0f);  // flat floor: slope 0, and still data
  CHECK(m[70 * 120 + 90] == 255);
  CHECK(v[70 * 120 + 10] == Approx(2.2906).margin(0.001));
  CHECK(m[70 * 120 + 10] == 255);
  CHECK(m[45 * 120 + 19] == 255);  // next to the hole: computed from what exists
  CHECK(!std::filesystem::exists(tmp / "slope.tif.aux.xml"));
}

TEST_CASE("sheetmill tint writes RGB with a mask, or RGBA", "[terrain]") {
  st::TempDir tmp("cli-tint");
  auto g = fixture::make_grid(300, 260, 440000, 6650000, 25.0, fixture::wkt_of(32633));
  Dem d = fixture::sample_dem(g, [](double e, double n) {
    return 400 + 300 * std::sin((e - 440000) / 900.0) * std::cos((n - 6650000) / 800.0);
  });
  for (int r = 0; r < 30; ++r)
    for (int c = 0; c < 30; ++c) d.z[r * 300 + c] = NAN;
  auto dem = tmp / "dem.tif";
  fixture::write_geotiff(dem, g, d.z);
  st::write_text(tmp / "ramp.yaml",
                 "blend: smooth\nstops:\n  - {elevation: 100 m, colour: \"#3a6e3a\"}\n"
                 "  - {elevation: 700 m, colour: \"#f0e0b0\"}\n");
  for (bool rgba : {false, true}) {
    auto out = tmp / (rgba ? "rgba.tif" : "rgb.tif");
    std::vector<std::string> args = {"tint",
                                     dem.string(),
                                     out.string(),
                                     "--ramp",
                                     (tmp / "ramp.yaml").string(),
                                     "--shade-strength",
                                     "0"};
    if (rgba) args.push_back("--rgba");
    auto r = st::run_sheetmill(args);
    INFO(r.err);
    REQUIRE(r.exit_code == 0);
    DatasetPtr ds = open_out(out);
    REQUIRE(ds->GetRasterCount() == (rgba ? 4 : 3));
    check_georeferencing_matches(*ds, dem);
    // Unshaded tint at a cell of known elevation: linear between the two stops.
    const int c = 150, rr = 130;
    double z = d.z[rr * 300 + c];
    double t = std::clamp((z - 100) / 600, 0.0, 1.0);
    std::uint8_t px[4] = {0, 0, 0, 0};
    for (int b = 0; b < (rgba ? 4 : 3); ++b)
      REQUIRE(ds->GetRasterBand(b + 1)->RasterIO(GF_Read, c, rr, 1, 1, &px[b], 1, 1, GDT_Byte, 0, 0,
                                                 nullptr) == CE_None);
    CHECK(std::abs(px[0] - (0x3a + t * (0xf0 - 0x3a))) <= 1.0);
    CHECK(std::abs(px[1] - (0x6e + t * (0xe0 - 0x6e))) <= 1.0);
    // The hole is masked (RGB) or transparent (RGBA).
    std::uint8_t hole = 1, inside = 0;
    GDALRasterBand* m = rgba ? ds->GetRasterBand(4) : ds->GetRasterBand(1)->GetMaskBand();
    REQUIRE(m->RasterIO(GF_Read, 5, 5, 1, 1, &hole, 1, 1, GDT_Byte, 0, 0, nullptr) == CE_None);
    REQUIRE(m->RasterIO(GF_Read, c, rr, 1, 1, &inside, 1, 1, GDT_Byte, 0, 0, nullptr) == CE_None);
    CHECK(hole == 0);
    CHECK(inside == 255);
  }
}

TEST_CASE("relief commands report bad input on one line, exit 2", "[terrain]") {
  st::TempDir tmp("cli-errors");
  st::write_text(tmp / "notes.txt", "not elevations\n");
  auto r = st::run_sheetmill({"shade", (tmp / "notes.txt").string(), (tmp / "o.tif").string()});
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("not a raster") != std::string::npos);
  CHECK(std::count(r.err.begin(), r.err.end(), '\n') == 1);
  CHECK(!std::filesystem::exists(tmp / "o.tif"));

  auto g = fixture::make_grid(20, 20, 440000, 6650000, 25.0, "");
  fixture::write_geotiff(tmp / "nocrs.tif", g, std::vector<float>(400, 10.0f));
  r = st::run_sheetmill({"shade", (tmp / "nocrs.tif").string(), (tmp / "o.tif").string()});
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("no coordinate reference system") != std::string::npos);
  r = st::run_sheetmill(
      {"shade", (tmp / "nocrs.tif").string(), (tmp / "o.tif").string(), "--dem-crs", "EPSG:32633"});
  CHECK(r.exit_code == 0);

  st::write_text(tmp / "bad.yaml", "stops: []\n");
  r = st::run_sheetmill({"tint", (tmp / "nocrs.tif").string(), (tmp / "t.tif").string(),
                         "--dem-crs", "EPSG:32633", "--ramp", (tmp / "bad.yaml").string()});
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("bad.yaml:") != std::string::npos);
}
