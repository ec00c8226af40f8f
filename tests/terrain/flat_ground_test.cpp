// White flat ground (relief.hpp, flat_ground_white): tone = min(1, I / I_flat), so level
// ground and slopes facing the light print paper-white and only shadows add tone (common
// practice on printed topographic relief). Checked analytically on planes (Lambert's cosine,
// the illumination of shade_kernel.hpp) and end to end on a sheet rendered by the program.
#include <gdal_priv.h>

#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>

#include "dem_fixtures.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/terrain/relief.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::terrain;
namespace fs = std::filesystem;

namespace {

// The ink's alpha byte of the centre pixel of a plane z = p E + q N relief image.
int centre_alpha(double p, double q, const ReliefParams& params) {
  RasterGrid g = fixture::make_grid(9, 9, 0, 90, 10, fixture::wkt_of(32633));
  Dem dem = fixture::sample_dem(g, [&](double e, double n) { return 500 + p * e + q * n; });
  ReliefImage img = render_relief(dem, params);
  return static_cast<int>(img.argb[4 * 9 + 4] >> 24);
}

// Lambert's cosine for gradient (p, q) and a light from azimuth/altitude (degrees), as the
// byte the hillshade encodes and decodes: (round(1 + 254 max(I, 0)) - 1) / 254.
double decoded_illumination(double p, double q, double az_deg, double alt_deg) {
  const double az = az_deg * kDegToRad, alt = alt_deg * kDegToRad;
  const double i = (std::sin(alt) - (p * std::sin(az) + q * std::cos(az)) * std::cos(alt)) /
                   std::sqrt(1 + p * p + q * q);
  return (std::floor(1 + 254 * std::max(i, 0.0) + 0.5) - 1) / 254;
}

int expected_alpha(double tone, double strength) {
  return static_cast<int>(std::floor(255 * strength * (1 - std::min(1.0, tone)) + 0.5));
}

}  // namespace

TEST_CASE("white flat ground: level ground and lit slopes carry no ink, shadows keep theirs",
          "[terrain][flat-ground]") {
  ReliefParams white;
  white.shade_strength = 0.5;
  white.flat_ground_white = true;
  ReliefParams grey = white;
  grey.flat_ground_white = false;
  const double flat = decoded_illumination(0, 0, 315, 45);
  // Level ground: no ink at all when white; the neutral form darkens it by s (1 - I_flat).
  CHECK(centre_alpha(0, 0, white) == 0);
  CHECK(centre_alpha(0, 0, grey) == expected_alpha(flat, 0.5));
  CHECK(centre_alpha(0, 0, grey) > 30);  // about 0.5 x 0.29 x 255 = 37: the grey of the issue
  // A slope facing the light (down to the south-east, 10 %): brighter than level, so paper.
  CHECK(centre_alpha(0.1, -0.1, white) == 0);
  // A slope facing away (rising to the south-east, 20 %): tone I / I_flat.
  const double away = decoded_illumination(-0.2, 0.2, 315, 45);
  CHECK(centre_alpha(-0.2, 0.2, white) == expected_alpha(away / flat, 0.5));
  CHECK(centre_alpha(-0.2, 0.2, white) > 20);
  // The multidirectional kernel (Mark 1992) also gives level ground sin(altitude).
  white.shading.method = ShadeMethod::multidirectional;
  CHECK(centre_alpha(0, 0, white) == 0);
  white.shading.altitude_deg = 30;
  CHECK(centre_alpha(0, 0, white) == 0);
}

namespace {

// A plain at 103 m (no 10 m contour on it) with one Gaussian hill, 150 m high, sigma 400 m,
// at (480500, 5197500) in UTM 32N, on 30 m cells (a coarse DEM: the print grid is finer).
constexpr double kHillE = 480500, kHillN = 5197500;
fs::path plain_with_hill(const test::TempDir& tmp) {
  RasterGrid g = fixture::make_grid(240, 240, 476900, 5201100, 30, fixture::wkt_of(32632));
  Dem d = fixture::sample_dem(g, [](double e, double n) {
    const double r2 = (e - kHillE) * (e - kHillE) + (n - kHillN) * (n - kHillN);
    return 103 + 150 * std::exp(-r2 / (2 * 400.0 * 400.0));
  });
  fs::path path = tmp / "plain.tif";
  fixture::write_geotiff(path, g, d.z);
  return path;
}

struct Sheet {
  int width = 0, height = 0;
  double gt[6];
  std::vector<std::uint8_t> rgb[3];
  int darkest(std::size_t i) const { return std::min({rgb[0][i], rgb[1][i], rgb[2][i]}); }
  // The ground point at the centre of pixel i.
  Point ground(std::size_t i) const {
    const double c = static_cast<double>(i % width) + 0.5, r = static_cast<double>(i / width) + 0.5;
    return {gt[0] + c * gt[1], gt[3] + r * gt[5]};
  }
};

// Renders the plain as a GeoTIFF sheet (the program itself) with `shading` and reads it.
Sheet render_plain(const test::TempDir& tmp, const std::string& name, const std::string& shading) {
  fs::path dem = tmp / "plain.tif";
  if (!fs::exists(dem)) plain_with_hill(tmp);
  test::write_text(tmp / "style.yaml", "relief:\n  shading: " + shading + "\n");
  test::write_text(tmp / "project.yaml",
                   "title: Plain and hill\n"
                   "crs: EPSG:32632\n"
                   "scale: 25000\n"
                   "paper: { size: A2, orientation: landscape }\n"
                   "extent: { box: [477500, 5194000, 483500, 5201000] }\n"
                   "style: style.yaml\n"
                   "elevation: { dem: " +
                       dem.string() +
                       " }\n"
                       "contours: { interval: 10m }\n"
                       "magnetic: { declination: 2.0, annual_change: 0.1, date: 2026-12-01 }\n");
  const fs::path out = tmp / ("sheet-" + name + ".tif");
  auto r = test::run_sheetmill(
      {"render", (tmp / "project.yaml").string(), "-o", out.string(), "--dpi", "150"});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  gdal_init();
  DatasetPtr ds(GDALDataset::Open(out.c_str(), GDAL_OF_RASTER));
  REQUIRE(ds);
  REQUIRE(ds->GetRasterCount() >= 3);
  Sheet s;
  s.width = ds->GetRasterXSize();
  s.height = ds->GetRasterYSize();
  REQUIRE(ds->GetGeoTransform(s.gt) == CE_None);
  for (int b = 0; b < 3; ++b) {
    s.rgb[b].resize(static_cast<std::size_t>(s.width) * s.height);
    REQUIRE(ds->GetRasterBand(b + 1)->RasterIO(GF_Read, 0, 0, s.width, s.height, s.rgb[b].data(),
                                               s.width, s.height, GDT_Byte, 0, 0,
                                               nullptr) == CE_None);
  }
  return s;
}

// The plain: pixels 6 sigma or more from the hill (it is under 150 e^-18 m high there), inside
// the frame, where the same sheet without relief is paper-white on every band (so grid lines,
// graticule crosses and figures, drawn over the relief, are left out).
std::vector<std::size_t> plain_pixels(const Sheet& without_relief) {
  std::vector<std::size_t> plain;
  for (std::size_t i = 0; i < without_relief.rgb[0].size(); ++i) {
    const Point g = without_relief.ground(i);
    const bool in_frame = g.x > 477600 && g.x < 483400 && g.y > 5194100 && g.y < 5200900;
    if (in_frame && std::hypot(g.x - kHillE, g.y - kHillN) > 2400 &&
        without_relief.darkest(i) == 255) {
      plain.push_back(i);
    }
  }
  return plain;
}

}  // namespace

TEST_CASE("a sheet prints flat ground paper-white and only shadows add tone",
          "[terrain][flat-ground]") {
  test::TempDir tmp("white-plain");
  const std::string light = "method: horn, light_azimuth: 315, light_altitude: 45, strength: 50%";
  const Sheet white = render_plain(tmp, "white", "{ " + light + " }");
  const Sheet grey = render_plain(tmp, "grey", "{ " + light + ", flat_ground: grey }");
  const Sheet bare = render_plain(tmp, "bare", "off");
  REQUIRE(white.rgb[0].size() == bare.rgb[0].size());
  const std::vector<std::size_t> plain = plain_pixels(bare);
  // The frame is 6 x 7 km; at 150 dpi a pixel is 4.2 m on the ground, so the plain outside
  // 2.4 km of the hill is well over a million pixels.
  REQUIRE(plain.size() > 1000000);
  int white_darkest = 255;
  std::size_t grey_dark = 0;
  for (std::size_t i : plain) {
    white_darkest = std::min(white_darkest, white.darkest(i));
    grey_dark += grey.darkest(i) < 230;
  }
  // Criterion from the relief issue: the plain prints at least 250/255 on every band.
  CHECK(white_darkest >= 250);
  // The neutral form darkens it to 1 - 0.5 (1 - sin 45 deg) = 0.854 of paper, about 218/255.
  // Not every pixel: the paper-coloured halos of the graticule figures inside the neatline
  // cover the relief on both sheets, and the bare sheet cannot tell them from paper.
  CHECK(static_cast<double>(grey_dark) >= 0.99 * static_cast<double>(plain.size()));
  // The flank facing away from the light (south-east of the summit, about 11 deg) keeps its
  // shadow: I = sin(45 - 11 deg) = 0.56, tone 0.79, 50 % strength, about 228/255.
  int flank = 255;
  for (std::size_t i = 0; i < white.rgb[0].size(); ++i) {
    const Point g = white.ground(i);
    if (std::hypot(g.x - (kHillE + 400), g.y - (kHillN - 400)) < 20 && bare.darkest(i) == 255) {
      flank = std::min(flank, white.darkest(i));
    }
  }
  CHECK(flank < 240);
}
