// `sheetmill contours` end to end: the label layer (--labels) read back through OGR and checked
// against the analytic surface, and a DEM in feet contoured in feet, with GDAL's own contour
// generator as the oracle for the levels.
#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <set>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/units.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

// A hill on a plane tilted east, in UTM 33 N, 10 m cells, and its analytic gradient (E, N).
struct Hill {
  double z(double x, double y) const {
    double dx = x - 503000, dy = y - 5002000;
    return 400 + 0.03 * (x - 500000) + 300 * std::exp(-(dx * dx + dy * dy) / (2 * 1200.0 * 1200));
  }
  Point gradient(double x, double y) const {
    double dx = x - 503000, dy = y - 5002000;
    double e = 300 * std::exp(-(dx * dx + dy * dy) / (2 * 1200.0 * 1200)) / (1200.0 * 1200);
    return {0.03 - e * dx, -e * dy};
  }
};

// Writes the hill as a Float32 GeoTIFF of 600 x 400 cells from (500000, 5004000), values
// divided by `unit_m` and the band's unit type set to `unit_name` when not empty.
void write_hill(const fs::path& path, double unit_m, const char* unit_name) {
  gdal_init();
  Hill hill;
  const int w = 600, h = 400;
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GTiff");
  DatasetPtr ds(drv->Create(path.c_str(), w, h, 1, GDT_Float32, nullptr));
  REQUIRE(ds);
  double gt[6] = {500000, 10, 0, 5004000, 0, -10};
  ds->SetGeoTransform(gt);
  OGRSpatialReference srs;
  srs.importFromEPSG(32633);
  ds->SetSpatialRef(&srs);
  std::vector<float> z(static_cast<std::size_t>(w) * h);
  for (int r = 0; r < h; ++r)
    for (int c = 0; c < w; ++c)
      z[r * w + c] =
          static_cast<float>(hill.z(500000 + (c + 0.5) * 10, 5004000 - (r + 0.5) * 10) / unit_m);
  GDALRasterBand* band = ds->GetRasterBand(1);
  if (unit_name) band->SetUnitType(unit_name);
  REQUIRE(band->RasterIO(GF_Write, 0, 0, w, h, z.data(), w, h, GDT_Float32, 0, 0, nullptr) ==
          CE_None);
}

std::set<double> levels_in(const fs::path& gpkg, const char* layer, const char* field) {
  DatasetPtr ds = open_vector(gpkg.string());
  OGRLayer* l = ds->GetLayerByName(layer);
  REQUIRE(l);
  std::set<double> out;
  for (auto& f : *l) out.insert(f->GetFieldAsDouble(field));
  return out;
}

}  // namespace

TEST_CASE("contours --labels: on index lines, tops of the figures uphill", "[contours]") {
  test::TempDir dir("contours-labels");
  write_hill(dir / "hill.tif", 1.0, nullptr);
  auto r = test::run_sheetmill({"contours", (dir / "hill.tif").string(),
                                (dir / "out.gpkg").string(), "--interval", "10", "--labels"});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  Hill hill;
  DatasetPtr ds = open_vector((dir / "out.gpkg").string());
  OGRLayer* labels = ds->GetLayerByName("contour_labels");
  REQUIRE(labels);
  int n = 0;
  for (auto& f : *labels) {
    ++n;
    const OGRPoint* p = f->GetGeometryRef()->toPoint();
    double elevation = f->GetFieldAsDouble("elevation");
    INFO("label " << f->GetFieldAsString("text") << " at " << p->getX() << ", " << p->getY());
    // Index contours only: every fifth 10 m level (common practice).
    CHECK(std::fmod(elevation, 50.0) == 0.0);
    CHECK(std::string(f->GetFieldAsString("text")) == std::to_string(static_cast<int>(elevation)));
    // On its line: the surface there is at the label's level (smoothing moves lines a little:
    // 0.25 mm at 1:25 000 is 6 m of ground, times the slope).
    Point g = hill.gradient(p->getX(), p->getY());
    double slope = std::hypot(g.x, g.y);
    CHECK(std::abs(hill.z(p->getX(), p->getY()) - elevation) < 1.0 + 10 * slope);
    // The tops of the figures face uphill: within 90 degrees of the analytic gradient.
    double up = f->GetFieldAsDouble("up_deg") * kDegToRad;
    CHECK(std::cos(up) * g.x + std::sin(up) * g.y > 0);
    // The baseline runs along the line: perpendicular to the gradient within 20 degrees.
    double along = f->GetFieldAsDouble("angle_deg") * kDegToRad;
    CHECK(std::abs(std::cos(along) * g.x + std::sin(along) * g.y) <
          std::sin(20 * kDegToRad) * slope);
  }
  CHECK(n >= 10);
  // Both layers carry the caution in their GeoPackage description (gpkg_contents), read back
  // with OGR.
  for (const char* name : {"contours", "contour_labels"}) {
    const char* d = ds->GetLayerByName(name)->GetMetadataItem("DESCRIPTION");
    REQUIRE(d);
    CHECK(std::string(d).find("not a survey") != std::string::npos);
    CHECK(std::string(d).find("licensed surveyor") != std::string::npos);
  }
}

TEST_CASE("a DEM in feet is contoured and labelled in feet", "[contours]") {
  test::TempDir dir("contours-feet");
  write_hill(dir / "feet.tif", kMetresPerFoot, "ft");
  auto r = test::run_sheetmill({"contours", (dir / "feet.tif").string(),
                                (dir / "ours.gpkg").string(), "--interval", "20", "--labels"});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  CHECK(r.err.find("at 20 ft") != std::string::npos);
  // GDAL's generator on the same file, in the file's own unit, is the oracle for the levels.
  auto g = test::run_command({"gdal_contour", "-q", "-i", "20", "-a", "elev", "-f", "GPKG",
                              (dir / "feet.tif").string(), (dir / "gdal.gpkg").string()});
  REQUIRE(g.exit_code == 0);
  DatasetPtr ref = open_vector((dir / "gdal.gpkg").string());
  std::set<double> gdal_levels;
  for (auto& f : *ref->GetLayer(0)) gdal_levels.insert(f->GetFieldAsDouble("elev"));
  std::set<double> ours = levels_in(dir / "ours.gpkg", "contours", "elevation");
  // Our preparation drops loops shorter than 1.5 mm: the levels may lose one at the very top.
  for (double z : ours) {
    CHECK(std::fmod(z, 20.0) == 0.0);
    CHECK(gdal_levels.count(z) == 1);
  }
  CHECK(ours.size() + 1 >= gdal_levels.size());
  for (double z : levels_in(dir / "ours.gpkg", "contour_labels", "elevation"))
    CHECK(std::fmod(z, 100.0) == 0.0);
  // --units m overrides: the same surface in metres has its 10 m levels.
  r = test::run_sheetmill({"contours", (dir / "feet.tif").string(), (dir / "m.gpkg").string(),
                           "--interval", "10", "--units", "m"});
  REQUIRE(r.exit_code == 0);
  for (double z : levels_in(dir / "m.gpkg", "contours", "elevation"))
    CHECK(std::fmod(z, 10.0) == 0);
}
