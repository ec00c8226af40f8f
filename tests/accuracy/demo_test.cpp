// The demo area's benchmarks and trig points: the command's report, and the sheet's notes with
// the NSSDA statement and, when the contour interval is finer than the points support, the
// warning (pdftotext, poppler, as the outside reader of the PDF).
#include <catch2/catch.hpp>
#include <random>
#include <regex>

#include "fixtures.hpp"
#include "sheetmill/accuracy/assess.hpp"
#include "sheetmill/accuracy/summary.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::accuracy;
namespace st = sheetmill::test;
using Catch::Detail::Approx;

namespace {

// demo_area/project.yaml pointing at the test build's demo area, on A3 (a quicker render),
// with `points` (when given) as its check points.
std::filesystem::path demo_project(const st::TempDir& dir, const std::string& points = "") {
  std::string text = st::read_text(st::source_dir() / "demo_area" / "project.yaml");
  text = std::regex_replace(text, std::regex("generated/"), st::demo_area().string() + "/");
  text = std::regex_replace(text, std::regex("\\.\\./styles/"),
                            (st::source_dir() / "styles").string() + "/");
  text = std::regex_replace(text, std::regex("size: A2"), "size: A3");
  if (!points.empty()) {
    text = std::regex_replace(text, std::regex("points: .*features.gpkg\\n  layer: control_points"),
                              "points: " + points + "\n  layer: points");
  }
  st::write_text(dir / "project.yaml", text);
  return dir / "project.yaml";
}

std::string pdf_text(const std::filesystem::path& pdf) {
  auto t = st::run_command({"pdftotext", pdf.string(), "-"});
  REQUIRE(t.exit_code == 0);
  // Lines joined: a statement wraps in the notes column.
  return std::regex_replace(t.out, std::regex("\\s+"), " ");
}

CheckPointSource demo_points() {
  CheckPointSource s;
  s.path = (st::demo_area() / "features.gpkg").string();
  s.layer = "control_points";
  s.height_field = "elevation_m";
  return s;
}

}  // namespace

TEST_CASE("demo benchmarks: the report exists and states the accuracy", "[accuracy][demo]") {
  st::TempDir dir("acc");
  auto r = st::run_sheetmill({"accuracy", (st::demo_area() / "dem.tif").string(),
                              (st::demo_area() / "features.gpkg").string(), "--layer",
                              "control_points", "--report", (dir / "report.pdf").string(),
                              "--residuals", (dir / "res.csv").string(), "--date", "2026-12-01"});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  REQUIRE(std::filesystem::exists(dir / "report.pdf"));
  std::string text = pdf_text(dir / "report.pdf");
  CHECK(text.find("vertical accuracy at 95 % confidence level") != std::string::npos);
  CHECK(text.find("not a survey") != std::string::npos);
  // Every control point of the layer (OGR's count as the oracle) is in the residuals.
  gdal_init();
  DatasetPtr ds(GDALDataset::Open((st::demo_area() / "features.gpkg").c_str(), GDAL_OF_VECTOR));
  REQUIRE(ds);
  GIntBig n = ds->GetLayerByName("control_points")->GetFeatureCount();
  std::string csv = st::read_text(dir / "res.csv");
  CHECK(std::count(csv.begin(), csv.end(), '\n') == n + 1);
  // The demo's points sit on cell centres, where bilinear sampling is the cell's own value:
  // GDAL's reading of that cell is the oracle for z_dem_m.
  DatasetPtr dem(GDALDataset::Open((st::demo_area() / "dem.tif").c_str(), GDAL_OF_RASTER));
  double gt[6];
  dem->GetGeoTransform(gt);
  Assessment a = assess_vertical((st::demo_area() / "dem.tif").string(), demo_points());
  for (const Residual& res : a.residuals) {
    int c = static_cast<int>((res.xy.x - gt[0]) / gt[1]);
    int row = static_cast<int>((res.xy.y - gt[3]) / gt[5]);
    float z = 0;
    REQUIRE(dem->GetRasterBand(1)->RasterIO(GF_Read, c, row, 1, 1, &z, 1, 1, GDT_Float32, 0, 0,
                                            nullptr) == CE_None);
    INFO(res.id);
    CHECK(res.z_dem_m == Approx(z).margin(1e-4));
  }
}

TEST_CASE("demo sheet: the notes carry the NSSDA statement", "[accuracy][demo]") {
  st::TempDir dir("acc");
  auto r =
      st::run_sheetmill({"render", demo_project(dir).string(), "-o", (dir / "sheet.pdf").string()});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  // The expected statement from the library on the same data, with the project's date.
  AssessOptions o;
  o.date = "2026-12-01";
  Assessment a = assess_vertical((st::demo_area() / "dem.tif").string(), demo_points(), o);
  std::string text = pdf_text(dir / "sheet.pdf");
  CHECK(text.find(vertical_statement(a, a.date)) != std::string::npos);
  CHECK(text.find("finer than") == std::string::npos);  // 10 m is well supported
}

TEST_CASE("demo sheet: an interval finer than the points support is warned of",
          "[accuracy][demo]") {
  // The demo's control points with Gaussian errors of sigma 8 m (seed 11) added: NMAS then
  // supports about 3.29 x 8 = 26 m, coarser than the project's 10 m.
  st::TempDir dir("acc");
  Assessment demo = assess_vertical((st::demo_area() / "dem.tif").string(), demo_points());
  std::mt19937_64 rng(11);
  std::normal_distribution<double> noise(0, 8);
  std::vector<fixture::PointRecord> pts;
  for (const Residual& res : demo.residuals) {
    pts.push_back({res.id, res.xy, res.z_check_m + noise(rng), ""});
  }
  fixture::write_points(dir / "noisy.gpkg", pts, 32632);
  CheckPointSource noisy;
  noisy.path = (dir / "noisy.gpkg").string();
  Assessment a = assess_vertical((st::demo_area() / "dem.tif").string(), noisy);
  REQUIRE(a.all.nmas_interval_m > 10);
  auto r = st::run_sheetmill({"render", demo_project(dir, (dir / "noisy.gpkg").string()).string(),
                              "-o", (dir / "sheet.pdf").string()});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  auto warning = interval_warning(a, 10);
  REQUIRE(warning);
  CHECK(r.err.find(*warning) != std::string::npos);                        // in the log
  CHECK(pdf_text(dir / "sheet.pdf").find(*warning) != std::string::npos);  // and on the sheet
}
