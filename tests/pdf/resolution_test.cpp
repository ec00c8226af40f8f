// The raster exports carry their resolution, read back by the libraries that read them: libpng
// (png_get_pHYs: pixels per metre, unit metre; PNG specification section 11.3.5.3) and GDAL
// (the GTiff driver's TIFFTAG_XRESOLUTION/YRESOLUTION/RESOLUTIONUNIT, TIFF 6.0 section 8).
#include <gdal_priv.h>
#include <png.h>

#include <catch2/catch.hpp>
#include <cstdio>
#include <string>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {
void draw(pdf::LayeredCanvas& canvas) {
  cairo_t* cr = canvas.begin_group("ink");
  cairo_set_source_rgb(cr, 0.2, 0.3, 0.4);
  cairo_rectangle(cr, 5, 5, 20, 10);
  cairo_fill(cr);
  canvas.end_group();
}
}  // namespace

TEST_CASE("the PNG export has a pHYs chunk with its dpi, read by libpng", "[pdf]") {
  test::TempDir dir("png-dpi");
  auto path = dir / "sheet.png";
  pdf::LayeredCanvas canvas(50, 30);
  draw(canvas);
  canvas.finish_png(path, 200);
  FILE* f = std::fopen(path.c_str(), "rb");
  REQUIRE(f);
  png_structp png = png_create_read_struct(PNG_LIBPNG_VER_STRING, nullptr, nullptr, nullptr);
  png_infop info = png_create_info_struct(png);
  REQUIRE(setjmp(png_jmpbuf(png)) == 0);  // libpng's own CRC check would fail here
  png_init_io(png, f);
  png_read_info(png, info);
  png_uint_32 x = 0, y = 0;
  int unit = -1;
  REQUIRE(png_get_pHYs(png, info, &x, &y, &unit) != 0);
  CHECK(unit == PNG_RESOLUTION_METER);
  CHECK(x == 7874);  // 200 / 0.0254, rounded
  CHECK(y == 7874);
  CHECK(png_get_image_width(png, info) == 394);  // 50 mm at 200 dpi
  png_destroy_read_struct(&png, &info, nullptr);
  std::fclose(f);
}

TEST_CASE("the GeoTIFF export has TIFF resolution tags, read by GDAL", "[pdf]") {
  test::TempDir dir("tif-dpi");
  auto path = dir / "sheet.tif";
  pdf::GeoRegistration geo;
  geo.frame_page_mm = Box::of(0, 0, 50, 30);
  geo.neatline_ground = {{1000, 2000}, {2250, 2000}, {2250, 2750}, {1000, 2750}};
  pdf::LayeredCanvas canvas(50, 30);
  draw(canvas);
  canvas.finish_geotiff(path, 120, geo);
  gdal_init();
  GDALDatasetUniquePtr ds(GDALDataset::Open(path.c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY));
  REQUIRE(ds);
  const char* xr = ds->GetMetadataItem("TIFFTAG_XRESOLUTION");
  const char* yr = ds->GetMetadataItem("TIFFTAG_YRESOLUTION");
  const char* unit = ds->GetMetadataItem("TIFFTAG_RESOLUTIONUNIT");
  REQUIRE(xr);
  REQUIRE(yr);
  REQUIRE(unit);
  CHECK(std::stod(xr) == Approx(120));
  CHECK(std::stod(yr) == Approx(120));
  CHECK(std::string(unit).rfind("2", 0) == 0);  // "2 (pixels/inch)"
}
