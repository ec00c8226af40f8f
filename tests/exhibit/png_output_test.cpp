// PNG output: written row by row (libpng), the same composition as the PDF. GDAL reads the PNG
// as the oracle for its size and resolution; poppler rasterises the PDF to compare against.
#include <gdal.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <cstdlib>

#include "exhibit_fixture.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/render_exhibit.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

TEST_CASE("PNG output has the page's size at the chosen dpi and matches the PDF", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-png");
  fx::write_plane_dem(dir / "dem.tif", 100, 0.05, 50);
  const double dpi = 40;
  sheetmill::test::write_text(
      dir / "x.yaml",
      fx::exhibit_yaml(dir / "dem.tif", "ARCH D", true, 2, "  compression: lossless\n  dpi: 40\n"));
  ExhibitProject p = load_exhibit_project(dir / "x.yaml");
  ExhibitOptions png;
  png.format = ExhibitFormat::png;
  png.png_dpi = dpi;
  png.max_strip_pixels = 50000;  // many bands
  ExhibitReport rep = render_exhibit(p, dir / "x.png", png);
  render_exhibit(p, dir / "x.pdf");

  gdal_init();
  GDALDatasetH ds = GDALOpen((dir / "x.png").c_str(), GA_ReadOnly);
  REQUIRE(ds);
  const int w = GDALGetRasterXSize(ds), h = GDALGetRasterYSize(ds);
  // ARCH D landscape is 36 x 24 in.
  CHECK(w == static_cast<int>(std::lround(36 * dpi)));
  CHECK(h == static_cast<int>(std::lround(24 * dpi)));
  CHECK(GDALGetRasterCount(ds) == 3);
  std::vector<unsigned char> png_rgb(static_cast<std::size_t>(w) * h * 3);
  int bands[3] = {1, 2, 3};
  REQUIRE(GDALDatasetRasterIO(ds, GF_Read, 0, 0, w, h, png_rgb.data(), w, h, GDT_Byte, 3, bands, 3,
                              3L * w, 1) == CE_None);
  GDALClose(ds);

  fx::Raster pdf = fx::rasterise(dir / "x.pdf", dpi, dir.path());
  REQUIRE(pdf.width == w);
  REQUIRE(pdf.height == h);
  // Same composition: the mean difference over the page is small (text and edges are
  // antialiased differently by Cairo and poppler, so pixels are not identical).
  double sum = 0;
  for (std::size_t i = 0; i < png_rgb.size(); ++i) sum += std::abs(png_rgb[i] - pdf.rgb[i]);
  CHECK(sum / static_cast<double>(png_rgb.size()) < 3.0);
  // And inside the map the relief agrees pixel for pixel within a few levels.
  const Box& map = rep.layout.map_box_mm;
  const int x = static_cast<int>((map.min_x + map.width() * 0.4) / kMmPerInch * dpi);
  for (double f : {0.2, 0.5, 0.8}) {
    const int y = static_cast<int>((map.min_y + map.height() * f) / kMmPerInch * dpi);
    const std::size_t i = (static_cast<std::size_t>(y) * w + x) * 3;
    fx::Rgb q = pdf.at(x, y);
    CHECK(std::abs(png_rgb[i] - q.r) <= 3);
    CHECK(std::abs(png_rgb[i + 1] - q.g) <= 3);
    CHECK(std::abs(png_rgb[i + 2] - q.b) <= 3);
  }
}
