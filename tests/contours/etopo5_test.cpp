// Real open topo-bathymetric data: etopo5 (ferret-datasets, 5' grid of land heights and sea
// depths; tests/data/README.md). A window of the Ligurian and Tyrrhenian coasts (8-12 E, 42-45 N:
// Corsica, Elba and the Tuscan coast), cut by GDAL in the test. GDAL's own contour program is the
// oracle for the coastline (the 0 m level, same generator); the flags are checked line by line.
#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <filesystem>

#include "sheetmill/core/gdal_env.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

std::filesystem::path etopo5() {
  return test::open_data("ferret-datasets", "usr/share/ferret-vis/data/etopo5.cdf");
}

// Length (degrees) of the lines at `level` in the first layer of a vector file.
double length_at(const std::filesystem::path& file, const char* field, double level) {
  DatasetPtr ds = open_vector(file.string());
  double sum = 0;
  for (auto& f : *ds->GetLayer(0))
    if (f->GetFieldAsDouble(field) == level)
      sum += f->GetGeometryRef()->toLineString()->get_Length();
  return sum;
}

}  // namespace

TEST_CASE("etopo5 coast: depth contours, a 0 m coastline, no ticks below the sea", "[contours]") {
  if (!std::filesystem::exists(etopo5())) {
    WARN("etopo5 absent (run scripts/fetch-test-data): skipped");
    return;
  }
  test::TempDir tmp("etopo5");
  const auto window = tmp / "coast.tif";
  REQUIRE(test::run_command({"gdal_translate", "-q", "-projwin", "8", "45", "12", "42", "-a_srs",
                             "EPSG:4326", etopo5().string(), window.string()})
              .exit_code == 0);
  // Raw lines: the coastline is GDAL's 0 m line, to rounding.
  auto raw = test::run_sheetmill({"contours", window.string(), (tmp / "raw.gpkg").string(),
                                  "--interval", "250", "--sea-level", "0", "--raw"});
  INFO(raw.err);
  REQUIRE(raw.exit_code == 0);
  auto gdal = test::run_command({"gdal_contour", "-q", "-fl", "0", "-a", "elev", window.string(),
                                 (tmp / "gdal.gpkg").string()});
  REQUIRE(gdal.exit_code == 0);
  const double gdal_coast = length_at(tmp / "gdal.gpkg", "elev", 0);
  REQUIRE(gdal_coast > 5);  // degrees of coastline: Corsica, Elba, the mainland
  CHECK(length_at(tmp / "raw.gpkg", "elevation", 0) == Approx(gdal_coast).epsilon(1e-9));

  // Prepared for 1:1 000 000: the flags follow the sea level.
  auto r = test::run_sheetmill({"contours", window.string(), (tmp / "sheet.gpkg").string(),
                                "--interval", "250", "--sea-level", "0", "--scale", "1000000"});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  DatasetPtr ds = open_vector((tmp / "sheet.gpkg").string());
  long depth = 0, coast = 0, land = 0, deepest = 0;
  for (auto& f : *ds->GetLayer(0)) {
    const double z = f->GetFieldAsDouble("elevation");
    INFO("line at " << z);
    CHECK(f->GetFieldAsInteger("depth") == (z < 0 ? 1 : 0));
    CHECK(f->GetFieldAsInteger("coastline") == (z == 0 ? 1 : 0));
    if (z < 0) CHECK(f->GetFieldAsInteger("depression") == 0);
    depth += z < 0;
    coast += z == 0;
    land += z > 0;
    deepest = std::min(deepest, static_cast<long>(z));
  }
  CHECK(coast > 0);
  CHECK(land > 0);
  CHECK(depth > coast);
  CHECK(deepest <= -2000);  // the Tyrrhenian and Ligurian basins pass 2500 m here
}
