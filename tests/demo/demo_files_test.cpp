// The full-size demo area (shared by all suites through test::demo_area()): the files, grids,
// CRS, layers and fields other stages rely on. Reference values are the brief's contract
// (docs/demo-area.md); GDAL reads the files back as the oracle.
#include <cpl_string.h>
#include <ogr_spatialref.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <map>
#include <set>

#include "demo/demo_test_support.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

TEST_CASE("the demo DEM is a tiled, compressed Float32 GeoTIFF of 4000 x 3000 cells at 5 m",
          "[demo]") {
  fs::path area = test::demo_area();
  CHECK(fs::exists(area / ".complete"));
  DatasetPtr ds = open_raster((area / "dem.tif").string());
  REQUIRE(ds->GetRasterXSize() == 4000);
  REQUIRE(ds->GetRasterYSize() == 3000);
  double gt[6];
  REQUIRE(ds->GetGeoTransform(gt) == CE_None);
  // Lower-left at E 470000, N 5190000 (the project file relies on it): top-left 470000/5205000.
  CHECK(gt[0] == Approx(470000.0).margin(1e-6));
  CHECK(gt[3] == Approx(5205000.0).margin(1e-6));
  CHECK(gt[1] == Approx(5.0).margin(1e-9));
  CHECK(gt[5] == Approx(-5.0).margin(1e-9));
  CHECK(gt[2] == 0.0);
  CHECK(gt[4] == 0.0);
  const OGRSpatialReference* srs = ds->GetSpatialRef();
  REQUIRE(srs != nullptr);
  CHECK(std::string(srs->GetAuthorityName(nullptr)) == "EPSG");
  CHECK(std::string(srs->GetAuthorityCode(nullptr)) == "32632");
  GDALRasterBand* band = ds->GetRasterBand(1);
  CHECK(band->GetRasterDataType() == GDT_Float32);
  int bx = 0, by = 0;
  band->GetBlockSize(&bx, &by);
  CHECK(bx == 256);
  CHECK(by == 256);
  const char* compression = ds->GetMetadataItem("COMPRESSION", "IMAGE_STRUCTURE");
  REQUIRE(compression != nullptr);
  CHECK(std::string(compression) == "DEFLATE");
  int has_nodata = 0;
  double nodata = band->GetNoDataValue(&has_nodata);
  CHECK(has_nodata);
  CHECK(nodata == -9999.0);
}

TEST_CASE("the demo DEM has no holes and several hundred metres of relief", "[demo]") {
  test::DemArray dem = test::read_dem(test::demo_area() / "dem.tif");
  REQUIRE(!dem.z.empty());
  auto [lo, hi] = std::minmax_element(dem.z.begin(), dem.z.end());
  CHECK(*lo > 100.0f);  // no nodata (-9999) anywhere: the brief asks for no holes
  CHECK(*hi < 1500.0f);
  CHECK(*hi - *lo > 300.0f);  // brief: relief range > 300 m
}

TEST_CASE("features.gpkg has every layer with its geometry type and fields in EPSG:32632",
          "[demo]") {
  DatasetPtr ds = open_vector((test::demo_area() / "features.gpkg").string());
  struct Expect {
    const char* layer;
    OGRwkbGeometryType type;
    std::map<std::string, OGRFieldType> fields;
  };
  const Expect expected[] = {
      {"water_lines",
       wkbLineString,
       {{"kind", OFTString}, {"name", OFTString}, {"strahler", OFTInteger}}},
      {"water_areas", wkbPolygon, {{"kind", OFTString}, {"name", OFTString}, {"level_m", OFTReal}}},
      {"roads", wkbLineString, {{"class", OFTString}, {"ref", OFTString}, {"name", OFTString}}},
      {"tracks", wkbLineString, {{"kind", OFTString}}},
      {"railways", wkbLineString, {{"kind", OFTString}, {"name", OFTString}}},
      {"buildings", wkbPolygon, {{"kind", OFTString}}},
      {"landcover", wkbPolygon, {{"kind", OFTString}}},
      {"power_lines", wkbLineString, {{"voltage_kv", OFTInteger}}},
      {"places", wkbPoint, {{"name", OFTString}, {"kind", OFTString}, {"population", OFTInteger}}},
      {"summits", wkbPoint, {{"name", OFTString}, {"elevation_m", OFTReal}}},
      {"control_points",
       wkbPoint,
       {{"id", OFTString}, {"kind", OFTString}, {"elevation_m", OFTReal}}},
  };
  const std::map<std::string, std::pair<std::string, std::set<std::string>>> kinds = {
      {"water_lines", {"kind", {"river", "stream"}}},
      {"water_areas", {"kind", {"lake", "pond"}}},
      {"roads", {"class", {"main", "secondary", "minor"}}},
      {"tracks", {"kind", {"track", "path"}}},
      {"railways", {"kind", {"rail"}}},
      {"buildings", {"kind", {"house", "farm", "church", "barn", "works"}}},
      {"landcover", {"kind", {"wood", "orchard", "marsh", "scrub"}}},
      {"places", {"kind", {"village", "hamlet", "farm", "locality"}}},
      {"control_points", {"kind", {"benchmark", "trig"}}}};
  CHECK(ds->GetLayerCount() == 11);
  for (const Expect& e : expected) {
    INFO("layer " << e.layer);
    OGRLayer* layer = ds->GetLayerByName(e.layer);
    REQUIRE(layer != nullptr);
    CHECK(wkbFlatten(layer->GetGeomType()) == e.type);
    const OGRSpatialReference* srs = layer->GetSpatialRef();
    REQUIRE(srs != nullptr);
    CHECK(std::string(srs->GetAuthorityCode(nullptr)) == "32632");
    OGRFeatureDefn* defn = layer->GetLayerDefn();
    CHECK(defn->GetFieldCount() == static_cast<int>(e.fields.size()));
    for (const auto& [name, type] : e.fields) {
      int i = defn->GetFieldIndex(name.c_str());
      REQUIRE(i >= 0);
      CHECK(defn->GetFieldDefn(i)->GetType() == type);
    }
    CHECK(layer->GetFeatureCount() > 0);
    auto k = kinds.find(e.layer);
    if (k == kinds.end()) continue;
    std::set<std::string> seen;
    for (auto& f : test::read_layer(*ds, e.layer))
      seen.insert(f->GetFieldAsString(k->second.first.c_str()));
    for (const std::string& v : seen) {
      INFO("value " << v);
      CHECK(k->second.second.count(v) == 1);
    }
  }
}

TEST_CASE("the sheet index tiles the area with 12 sheets of 5 km and consistent neighbours",
          "[demo]") {
  DatasetPtr ds = open_vector((test::demo_area() / "tiles.gpkg").string());
  auto sheets = test::read_layer(*ds, "sheets");
  REQUIRE(sheets.size() == 12);
  std::map<std::string, const OGRFeature*> by_id;
  std::set<std::string> names;
  double area = 0;
  for (const auto& f : sheets) {
    by_id[f->GetFieldAsString("sheet_id")] = f.get();
    names.insert(f->GetFieldAsString("name"));
    OGREnvelope env;
    f->GetGeometryRef()->getEnvelope(&env);
    // 5 km at 1:25 000 on whole kilometres.
    CHECK(env.MaxX - env.MinX == Approx(5000).margin(1e-6));
    CHECK(env.MaxY - env.MinY == Approx(5000).margin(1e-6));
    CHECK(std::fmod(env.MinX, 1000.0) == Approx(0).margin(1e-6));
    CHECK(std::fmod(env.MinY, 1000.0) == Approx(0).margin(1e-6));
    area += f->GetGeometryRef()->toPolygon()->get_Area();
    int row = f->GetFieldAsInteger("row"), col = f->GetFieldAsInteger("col");
    CHECK(std::string(f->GetFieldAsString("sheet_id")) ==
          "HV-" + std::to_string(row) + "-" + std::to_string(col));
    // Row 1 is the northernmost.
    CHECK(env.MaxY == Approx(5205000 - (row - 1) * 5000.0));
    CHECK(env.MinX == Approx(470000 + (col - 1) * 5000.0));
  }
  CHECK(names.size() == 12);  // each sheet has its own name
  CHECK(area == Approx(20000.0 * 15000.0));
  // Neighbour links are symmetric: A's east is B exactly when B's west is A, and so on.
  const std::pair<const char*, const char*> opposite[] = {
      {"n", "s"}, {"e", "w"}, {"ne", "sw"}, {"nw", "se"}};
  int links = 0;
  for (const auto& [id, f] : by_id) {
    for (const auto& [a, b] : opposite) {
      std::string other = f->GetFieldAsString(a);
      if (other.empty()) continue;
      ++links;
      REQUIRE(by_id.count(other) == 1);
      CHECK(std::string(by_id[other]->GetFieldAsString(b)) == id);
    }
  }
  // A 4 x 3 grid has 3*3 + 4*2 = 17 edge pairs and 2 * 3 * 2 = 12 diagonal pairs; each
  // direction counted once per pair here (from the n/e/ne/nw side).
  CHECK(links == 17 + 12);
}
