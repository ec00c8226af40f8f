// Relief by strips (issue 16) against the reference path: the whole window rendered at once
// (render_relief_window, whose hillshade is checked against gdaldem in shade_oracle_test). A
// sheet's relief is now only ever rendered in bands; each cell must stay within 1 DN of the
// whole-window render, with no seam where bands join.
#include "sheetmill/terrain/relief_strips.hpp"

#include <gdal_utils.h>

#include <catch2/catch.hpp>
#include <cmath>

#include "support/test_env.hpp"
#include "terrain/dem_fixtures.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;

namespace {

int channel_gap(std::uint32_t a, std::uint32_t b) {
  int worst = 0;
  for (int shift = 0; shift < 32; shift += 8) {
    worst = std::max(worst, std::abs(static_cast<int>((a >> shift) & 255) -
                                     static_cast<int>((b >> shift) & 255)));
  }
  return worst;
}

}  // namespace

TEST_CASE("plan_row_strips covers every row once, no strip over the pixel bound", "[terrain]") {
  for (auto [w, h, max] : {std::tuple{1000, 999, 100000L}, {7, 3, 1L}, {50, 10, 1000000L}}) {
    auto strips = plan_row_strips(w, h, max);
    int next = 0;
    for (const RowStrip& s : strips) {
      CHECK(s.row0 == next);
      CHECK(s.rows >= 1);
      CHECK((static_cast<long>(s.rows) * w <= max || s.rows == 1));
      next += s.rows;
    }
    CHECK(next == h);
  }
}

TEST_CASE("relief rendered in bands equals the whole window within 1 DN, seams included",
          "[terrain]") {
  test::TempDir dir("relief-strips");
  // A 30 m DEM of a smooth hill with a ridge, upsampled 6x with the cubic kernel (Keys 1981),
  // as a sheet's relief is, and a tint so every channel carries the result.
  const std::string wkt = fixture::wkt_of(32633);
  RasterGrid src = fixture::make_grid(80, 70, 500000, 5200000, 30, wkt);
  Dem dem = fixture::sample_dem(src, [](double e, double n) {
    const double x = (e - 501200) / 600, y = (n - 5199000) / 500;
    return 300 + 180 * std::exp(-(x * x + y * y)) + 40 * std::sin((e + 2 * n) / 400);
  });
  const auto path = dir / "dem.tif";
  fixture::write_geotiff(path, src, dem.z);

  ReliefSource source;
  source.dem_path = path.string();
  source.grid = fixture::make_grid(300, 260, 500150, 5199850, 5, wkt);
  source.read_options.resampling = "cubic";
  source.params.shading.method = ShadeMethod::horn;
  source.params.shade_strength = 0.6;
  source.params.tint = true;
  source.params.ramp.stops = {
      {250, {0.2, 0.5, 0.2, 1}}, {400, {0.8, 0.7, 0.4, 1}}, {550, {1, 1, 1, 1}}};

  const ReliefImage whole =
      render_relief_window(source.dem_path, source.grid, source.read_options, source.params);
  REQUIRE(whole.argb.size() == 300u * 260u);
  int worst = 0;
  for (const RowStrip& s : plan_row_strips(300, 260, 300 * 37)) {  // 37 rows: joins mid-grid
    const ReliefImage band = render_relief_rows(source, s.row0, s.rows);
    REQUIRE(band.width == 300);
    REQUIRE(band.height == s.rows);
    for (std::size_t i = 0; i < band.argb.size(); ++i) {
      worst = std::max(worst, channel_gap(band.argb[i], whole.argb[s.row0 * 300 + i]));
    }
  }
  CHECK(worst <= 1);

  // The DEM kept open between bands reads the same cells.
  const ReliefImage fresh = render_relief_rows(source, 37, 37);
  source.reader = std::make_shared<const DemReader>(source.dem_path);
  CHECK(render_relief_rows(source, 37, 37).argb == fresh.argb);
  CHECK(render_relief_rows(source, 74, 37).argb == render_relief_rows(source, 74, 37).argb);

  // The adjustment sees each band's own DEM, aligned with the image through the margin.
  int mismatched = 0;
  source.adjust = [&](ReliefImage& image, const Dem& d, int margin) {
    CHECK(d.width() == image.width + 2 * margin);
    CHECK(d.height() == image.height + 2 * margin);
    for (int r = 0; r < image.height; ++r) {
      for (int c = 0; c < image.width; ++c) {
        if (std::isnan(d.at(c + margin, r + margin))) ++mismatched;
      }
    }
  };
  render_relief_rows(source, 100, 20);
  CHECK(mismatched == 0);
}

TEST_CASE("flattening over white is channel + (255 - alpha)", "[terrain]") {
  // Premultiplied ARGB over white paper (Porter and Duff 1984, "over" with an opaque white
  // backdrop): c + (1 - a) * 255 per channel.
  ReliefImage img;
  img.width = 3;
  img.height = 1;
  img.argb = {0x00000000u, 0x80000000u, 0xFF204060u};
  const auto rgb = flatten_rgb(img);
  CHECK(rgb == std::vector<std::uint8_t>{255, 255, 255, 127, 127, 127, 0x20, 0x40, 0x60});
  const auto grey = flatten_grey(img);
  CHECK(grey == std::vector<std::uint8_t>{255, 127, 0x20});
}

TEST_CASE("cubic upsampling in the DEM's own CRS gives GDALWarp -r cubic's elevations",
          "[terrain]") {
  // Oracle: GDALWarp (the library form of GDAL's warp tool) with -r cubic (Keys 1981,
  // a = -0.5) into the same grid. read_dem_window computes this case itself (no warper);
  // the elevations must agree to float rounding, and a window reaching past the data (the
  // warper's own path) must still agree with the same oracle.
  test::TempDir dir("cubic-oracle");
  const std::string wkt = fixture::wkt_of(32633);
  RasterGrid src = fixture::make_grid(60, 50, 500000, 5200000, 30, wkt);
  Dem dem = fixture::sample_dem(src, [](double e, double n) {
    return 200 + 90 * std::sin(e / 170) * std::cos(n / 230) + (e - 500000) * 0.05;
  });
  const auto path = dir / "dem.tif";
  fixture::write_geotiff(path, src, dem.z);
  for (const RasterGrid& g : {fixture::make_grid(211, 173, 500100.3, 5199890.7, 7.1, wkt),
                              fixture::make_grid(150, 120, 500020, 5199980, 12.5, wkt)}) {
    CPLStringList argv;
    for (const std::string& a : {std::string("-r"), std::string("cubic"), std::string("-ot"),
                                 std::string("Float32"), std::string("-of"), std::string("MEM"),
                                 std::string("-te"), std::to_string(g.geotransform[0]),
                                 std::to_string(g.geotransform[3] + g.height * g.geotransform[5]),
                                 std::to_string(g.geotransform[0] + g.width * g.geotransform[1]),
                                 std::to_string(g.geotransform[3]), std::string("-ts"),
                                 std::to_string(g.width), std::to_string(g.height)}) {
      argv.AddString(a.c_str());
    }
    GDALWarpAppOptions* opts = GDALWarpAppOptionsNew(argv.List(), nullptr);
    DatasetPtr in(GDALDataset::Open(path.c_str(), GDAL_OF_RASTER));
    GDALDatasetH handles[] = {GDALDataset::ToHandle(in.get())};
    DatasetPtr warped(GDALDataset::FromHandle(GDALWarp("", nullptr, 1, handles, opts, nullptr)));
    GDALWarpAppOptionsFree(opts);
    REQUIRE(warped);
    std::vector<float> ref(static_cast<std::size_t>(g.width) * g.height);
    REQUIRE(warped->GetRasterBand(1)->RasterIO(GF_Read, 0, 0, g.width, g.height, ref.data(),
                                               g.width, g.height, GDT_Float32, 0, 0,
                                               nullptr) == CE_None);
    DemReadOptions o;
    o.resampling = "cubic";
    o.warn_coverage = false;
    const Dem ours = read_dem_window(path.string(), g, o);
    double worst = 0;
    int compared = 0;
    for (std::size_t i = 0; i < ref.size(); ++i) {
      if (std::isnan(ours.z[i])) continue;
      worst = std::max(worst, std::abs(static_cast<double>(ours.z[i]) - ref[i]));
      ++compared;
    }
    INFO("grid " << g.width << " x " << g.height << ", " << compared << " cells compared");
    CHECK(compared > static_cast<int>(ref.size() / 2));
    CHECK(worst < 1e-3);  // float rounding of elevations near 300 m is about 3e-5
  }
}
