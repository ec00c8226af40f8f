// Same seed, same area: the DEM byte for byte, the features value for value (a canonical dump
// with coordinates to 1 mm). Run on a coarse grid (--size-scale) to keep the suite fast.
#include <ogr_geometry.h>

#include <catch2/catch.hpp>
#include <fstream>
#include <sstream>

#include "demo/demo_test_support.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/demo/demo_area.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

namespace {

std::string bytes_of(const fs::path& p) {
  return test::read_text(p);
}

// Layer by layer in name order, features in FID order: every field as text, then the geometry
// as WKT with three decimals (1 mm).
std::string canonical_dump(const fs::path& gpkg) {
  DatasetPtr ds = open_vector(gpkg.string());
  std::vector<std::string> names;
  for (int i = 0; i < ds->GetLayerCount(); ++i) names.push_back(ds->GetLayer(i)->GetName());
  std::sort(names.begin(), names.end());
  OGRWktOptions wkt;
  wkt.format = OGRWktFormat::F;
  wkt.precision = 3;
  std::ostringstream out;
  for (const std::string& name : names) {
    out << "layer " << name << "\n";
    for (auto& f : test::read_layer(*ds, name.c_str())) {
      for (int i = 0; i < f->GetFieldCount(); ++i) out << f->GetFieldAsString(i) << "|";
      const OGRGeometry* g = f->GetGeometryRef();
      out << (g ? g->exportToWkt(wkt) : std::string("NULL")) << "\n";
    }
  }
  return out.str();
}

}  // namespace

TEST_CASE("the same seed gives the same demo area; another seed another", "[demo]") {
  test::TempDir tmp("demo-det");
  demo::DemoAreaOptions options;
  options.size_scale = 0.25;  // 1000 x 750 cells at 20 m over the same ground
  demo::generate_demo_area(tmp / "a", options);
  demo::generate_demo_area(tmp / "b", options);
  options.seed = 4711;
  demo::generate_demo_area(tmp / "c", options);

  std::string dem_a = bytes_of(tmp / "a" / "dem.tif");
  REQUIRE(dem_a.size() > 100000);
  CHECK(dem_a == bytes_of(tmp / "b" / "dem.tif"));
  CHECK(dem_a != bytes_of(tmp / "c" / "dem.tif"));

  std::string features_a = canonical_dump(tmp / "a" / "features.gpkg");
  CHECK(features_a.size() > 10000);
  CHECK(features_a == canonical_dump(tmp / "b" / "features.gpkg"));
  CHECK(features_a != canonical_dump(tmp / "c" / "features.gpkg"));
  CHECK(canonical_dump(tmp / "a" / "tiles.gpkg") == canonical_dump(tmp / "b" / "tiles.gpkg"));

  // The scratch folder is gone once the area is published.
  CHECK(fs::exists(tmp / "a" / ".complete"));
  CHECK_FALSE(fs::exists(tmp / "a.part"));
}

TEST_CASE("demo-area refuses to replace a folder that is not a demo area", "[demo]") {
  test::TempDir tmp("demo-refuse");
  fs::path out = tmp / "mine";
  fs::create_directories(out);
  test::write_text(out / "notes.txt", "keep me");
  demo::DemoAreaOptions options;
  options.size_scale = 0.1;
  CHECK_THROWS_AS(demo::generate_demo_area(out, options), Error);
  CHECK(test::read_text(out / "notes.txt") == "keep me");
  CHECK_FALSE(fs::exists(tmp / "mine.part"));
}

TEST_CASE("sheetmill demo-area writes an area and replaces a finished one", "[demo]") {
  test::TempDir tmp("demo-cli");
  fs::path out = tmp / "area";
  auto r = test::run_sheetmill({"demo-area", out.string(), "--seed", "99", "--size-scale", "0.1"});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  CHECK(fs::exists(out / ".complete"));
  CHECK(fs::exists(out / "dem.tif"));
  std::string first = test::read_text(out / "dem.tif");
  // A finished area may be regenerated in place.
  r = test::run_sheetmill({"demo-area", out.string(), "--seed", "99", "--size-scale", "0.1"});
  REQUIRE(r.exit_code == 0);
  CHECK(test::read_text(out / "dem.tif") == first);
  // Bad input exits 2 with one line.
  r = test::run_sheetmill({"demo-area", (tmp / "x").string(), "--size-scale", "7"});
  CHECK(r.exit_code == 2);
  CHECK(std::count(r.err.begin(), r.err.end(), '\n') == 1);
}
