#include <catch2/catch.hpp>

#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif
#include <cpl_conv.h>
#include <gdal_priv.h>
#include <ogr_spatialref.h>

#include <qpdf/QPDF.hh>
#include <qpdf/QPDFObjectHandle.hh>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

// An A3 landscape page with a 1:25 000 frame of 10 x 8 km in UTM zone 33N (EPSG:32633): the
// frame is 400 x 320 mm with its top-left corner at (10, 10) mm on the page.
constexpr double kScale = 25000;
const Box kGround = Box::of(500000, 5200000, 510000, 5208000);
const Point kOrigin{10, 10};

pdf::GeoRegistration registration() {
  OGRSpatialReference srs;
  srs.importFromEPSG(32633);
  char* wkt = nullptr;
  srs.exportToWkt(&wkt, nullptr);
  pdf::GeoRegistration geo;
  geo.crs_wkt = wkt;
  CPLFree(wkt);
  geo.epsg = 32633;
  double mm_per_m = 1000.0 / kScale;
  geo.frame_page_mm = Box::of(kOrigin.x, kOrigin.y, kOrigin.x + kGround.width() * mm_per_m,
                              kOrigin.y + kGround.height() * mm_per_m);
  const Box& f = geo.frame_page_mm;
  geo.neatline_page_mm = {
      {f.min_x, f.min_y}, {f.max_x, f.min_y}, {f.max_x, f.max_y}, {f.min_x, f.max_y}};
  geo.neatline_ground = {{kGround.min_x, kGround.max_y},
                         {kGround.max_x, kGround.max_y},
                         {kGround.max_x, kGround.min_y},
                         {kGround.min_x, kGround.min_y}};
  return geo;
}

void draw_groups(pdf::LayeredCanvas& canvas) {
  cairo_t* cr = canvas.begin_group("relief");
  cairo_set_source_rgb(cr, 0.8, 0.9, 0.8);
  cairo_rectangle(cr, kOrigin.x, kOrigin.y, 400, 320);
  cairo_fill(cr);
  canvas.end_group();
  cr = canvas.begin_group("water");
  cairo_set_source_rgb(cr, 0.2, 0.4, 0.9);
  cairo_arc(cr, 200, 150, 30, 0, 2 * kPi);
  cairo_fill(cr);
  canvas.end_group();
  cr = canvas.begin_group("names");
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, 5);
  cairo_set_source_rgb(cr, 0, 0, 0);
  cairo_move_to(cr, 150, 100);
  cairo_show_text(cr, "Wrenfold Tarn");
  canvas.end_group();
}

pdf::Metadata metadata() {
  pdf::Metadata m;
  m.title = "Wrenfold Valley";
  m.subject = "Topographic sheet";
  m.keywords = "topographic map; contours";
  m.author = "test suite";
  return m;
}

}  // namespace

// GDAL's PDF driver (an outside reader of ISO 32000-2 geospatial viewports) reads the frame back:
// the same CRS; at GDAL_PDF_DPI = 254 a pixel is 0.1 mm of paper, i.e. N x 0.1 mm = 2.5 m of
// ground at 1:25 000 (within 0.1 %); the frame's corner pixel lands within 0.5 m of its coordinate.
TEST_CASE("GDAL reads the PDF's georeferencing back", "[pdf]") {
  test::TempDir dir("pdf");
  pdf::LayeredCanvas canvas(420, 297);
  draw_groups(canvas);
  auto path = dir / "sheet.pdf";
  canvas.finish_pdf(path, registration(), metadata());

  gdal_init();
  CPLSetThreadLocalConfigOption("GDAL_PDF_DPI", "254");
  GDALDatasetUniquePtr ds(GDALDataset::Open(path.c_str(), GDAL_OF_RASTER));
  CPLSetThreadLocalConfigOption("GDAL_PDF_DPI", nullptr);
  REQUIRE(ds);
  const OGRSpatialReference* srs = ds->GetSpatialRef();
  REQUIRE(srs);
  OGRSpatialReference utm;
  utm.importFromEPSG(32633);
  CHECK(srs->IsSame(&utm));
  double gt[6];
  REQUIRE(ds->GetGeoTransform(gt) == CE_None);
  CHECK(gt[1] == Approx(kScale * 0.1e-3).epsilon(0.001));
  CHECK(-gt[5] == Approx(kScale * 0.1e-3).epsilon(0.001));
  // The page is 4200 x 2970 pixels at 254 dpi; the frame's top-left corner is pixel (100, 100).
  CHECK(ds->GetRasterXSize() == 4200);
  double e = gt[0] + 100 * gt[1] + 100 * gt[2];
  double n = gt[3] + 100 * gt[4] + 100 * gt[5];
  CHECK(e == Approx(kGround.min_x).margin(0.5));
  CHECK(n == Approx(kGround.max_y).margin(0.5));
  // And the opposite corner, pixel (4100, 3300).
  CHECK(gt[0] + 4100 * gt[1] == Approx(kGround.max_x).margin(0.5));
  CHECK(gt[3] + 3300 * gt[5] == Approx(kGround.min_y).margin(0.5));
}

// Optional content groups named after the drawing groups, read with qpdf's API; text stays
// extractable (pdftotext, poppler); the document information is set (pdfinfo).
TEST_CASE("layers, text and metadata of the PDF", "[pdf]") {
  test::TempDir dir("pdf");
  pdf::LayeredCanvas canvas(420, 297);
  draw_groups(canvas);
  auto path = dir / "sheet.pdf";
  canvas.finish_pdf(path, registration(), metadata());

  QPDF q;
  q.processFile(path.c_str());
  auto ocgs = q.getRoot().getKey("/OCProperties").getKey("/OCGs");
  REQUIRE(ocgs.isArray());
  std::vector<std::string> names;
  for (int i = 0; i < ocgs.getArrayNItems(); ++i) {
    names.push_back(ocgs.getArrayItem(i).getKey("/Name").getUTF8Value());
  }
  CHECK(names == std::vector<std::string>{"relief", "water", "names"});
  REQUIRE(q.getAllPages().size() == 1);
  auto page = q.getAllPages().front();
  auto vp = page.getKey("/VP");
  REQUIRE(vp.isArray());
  CHECK(vp.getArrayItem(0).getKey("/Measure").getKey("/Subtype").getName() == "/GEO");
  CHECK(vp.getArrayItem(0).getKey("/Measure").getKey("/GCS").getKey("/EPSG").getIntValue() ==
        32633);

  auto txt = dir / "sheet.txt";
  REQUIRE(test::run_command({"pdftotext", path.string(), txt.string()}).exit_code == 0);
  CHECK(test::read_text(txt).find("Wrenfold Tarn") != std::string::npos);

  auto info = test::run_command({"pdfinfo", path.string()});
  REQUIRE(info.exit_code == 0);
  CHECK(info.out.find("Wrenfold Valley") != std::string::npos);
  CHECK(info.out.find("Topographic sheet") != std::string::npos);
  CHECK(info.out.find("topographic map; contours") != std::string::npos);
  CHECK(info.out.find("sheetmill") != std::string::npos);
}

// The GeoTIFF export carries the frame's ground transform: GDAL reads it back; at 254 dpi a pixel
// is 0.1 mm of paper = 2.5 m at 1:25 000, and pixel (100, 100) is the frame's top-left corner.
TEST_CASE("GeoTIFF export is georeferenced", "[pdf]") {
  test::TempDir dir("tif");
  pdf::LayeredCanvas canvas(420, 297);
  draw_groups(canvas);
  auto path = dir / "sheet.tif";
  canvas.finish_geotiff(path, 254, registration());
  gdal_init();
  GDALDatasetUniquePtr ds(GDALDataset::Open(path.c_str(), GDAL_OF_RASTER));
  REQUIRE(ds);
  CHECK(ds->GetRasterCount() == 3);
  CHECK(ds->GetRasterXSize() == 4200);
  CHECK(ds->GetRasterYSize() == 2970);
  double gt[6];
  REQUIRE(ds->GetGeoTransform(gt) == CE_None);
  CHECK(gt[1] == Approx(2.5).epsilon(1e-9));
  CHECK(gt[0] + 100 * gt[1] == Approx(kGround.min_x).margin(1e-6));
  CHECK(gt[3] + 100 * gt[5] == Approx(kGround.max_y).margin(1e-6));
  OGRSpatialReference utm;
  utm.importFromEPSG(32633);
  REQUIRE(ds->GetSpatialRef());
  CHECK(ds->GetSpatialRef()->IsSame(&utm));
  // The water disc (blue) at page (200, 150) mm = pixel (2000, 1500).
  unsigned char rgb[3];
  REQUIRE(ds->RasterIO(GF_Read, 2000, 1500, 1, 1, rgb, 1, 1, GDT_Byte, 3, nullptr, 3, 3, 1,
                       nullptr) == CE_None);
  CHECK(rgb[2] > 200);
  CHECK(rgb[0] < 80);
}
