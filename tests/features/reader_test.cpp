// Reading vector sources for one sheet: reprojection, pushed-down filters, missing sources, and
// the real GB open topographic tile from Debian's libplplot-data.

#include "sheetmill/features/reader.hpp"

#include <ogr_spatialref.h>
#include <ogrsf_frmts.h>
#include <proj.h>

#include <catch2/catch.hpp>
#include <set>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/map_frame.hpp"
#include "support/crs.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using sheetmill::features::Feature;
using sheetmill::features::read_features;
using sheetmill::features::ReadRequest;

namespace {

// Writes a GeoPackage layer `name` with points (x, y) and a string field `cls`, in EPSG `epsg`.
void write_points(const std::filesystem::path& file, int epsg,
                  const std::vector<std::pair<Point, std::string>>& pts) {
  gdal_init();
  auto* drv = GetGDALDriverManager()->GetDriverByName("GPKG");
  DatasetPtr ds(drv->Create(file.c_str(), 0, 0, 0, GDT_Unknown, nullptr));
  REQUIRE(ds);
  OGRSpatialReference srs;
  srs.importFromEPSG(epsg);
  srs.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  OGRLayer* layer = ds->CreateLayer("pts", &srs, wkbPoint, nullptr);
  OGRFieldDefn cls("cls", OFTString);
  layer->CreateField(&cls);
  OGRFieldDefn other("unused", OFTString);
  layer->CreateField(&other);
  REQUIRE(layer->StartTransaction() == OGRERR_NONE);
  for (const auto& [p, c] : pts) {
    FeaturePtr f(OGRFeature::CreateFeature(layer->GetLayerDefn()));
    f->SetField("cls", c.c_str());
    f->SetField("unused", "x");
    OGRPoint g(p.x, p.y);
    f->SetGeometry(&g);
    REQUIRE(layer->CreateFeature(f.get()) == OGRERR_NONE);
  }
  REQUIRE(layer->CommitTransaction() == OGRERR_NONE);
}

}  // namespace

TEST_CASE("a layer in EPSG:4326 lands where the same layer in the sheet CRS does", "[features]") {
  test::TempDir tmp("reproj");
  // Sheet: British National Grid at 1:25 000 over 5 x 5 km in the south-west.
  MapFrame frame;
  frame.crs_wkt = test::wkt_of_epsg(27700);
  frame.scale_denominator = 25000;
  frame.ground = Box::of(265000, 145000, 270000, 150000);

  // The oracle: PROJ on its own (not through OGR) converts a grid of lon/lat points to the
  // sheet CRS; the test writes the lon/lat points to one layer and PROJ's results to another.
  PJ_CONTEXT* ctx = proj_context_create();
  PJ* raw = proj_create_crs_to_crs(ctx, "EPSG:4326", "EPSG:27700", nullptr);
  REQUIRE(raw);
  PJ* pj = proj_normalize_for_visualization(ctx, raw);  // lon, lat order
  proj_destroy(raw);
  std::vector<std::pair<Point, std::string>> geo, grid;
  for (int i = 0; i < 6; ++i)
    for (int j = 0; j < 6; ++j) {
      Point ll{-3.94 + 0.016 * i, 51.18 + 0.011 * j};
      PJ_COORD c = proj_trans(pj, PJ_FWD, proj_coord(ll.x, ll.y, 0, 0));
      std::string id = std::to_string(i * 10 + j);
      geo.push_back({ll, id});
      grid.push_back({{c.xy.x, c.xy.y}, id});
    }
  proj_destroy(pj);
  proj_context_destroy(ctx);
  write_points(tmp / "geo.gpkg", 4326, geo);
  write_points(tmp / "grid.gpkg", 27700, grid);

  ReadRequest req{frame.crs_wkt, frame.ground.expanded(100), {"cls"}};
  auto collect = [&](const std::string& file) {
    std::map<std::string, Point> out;
    project::Source src{"pts", (tmp / file).string(), "", "", true};
    read_features(src, req, [&](const Feature& f) {
      REQUIRE(f.points.size() == 1);
      out[*f.value(0)] = frame.to_page(f.points[0]);
    });
    return out;
  };
  auto a = collect("geo.gpkg");
  auto b = collect("grid.gpkg");
  // The grid (about 3.93-3.86 W, 51.19-51.23 N holds the frame) straddles the frame edges.
  REQUIRE(a.size() > 10);
  REQUIRE(a.size() < 36);
  REQUIRE(a.size() == b.size());
  for (const auto& [id, p] : a) {
    REQUIRE(b.count(id));
    // Brief's requirement: within 0.1 mm on paper.
    CHECK(distance(p, b[id]) < 0.1);
  }
}

TEST_CASE("spatial and attribute filters reach GDAL: only the sheet's features arrive",
          "[features]") {
  test::TempDir tmp("filters");
  std::vector<std::pair<Point, std::string>> pts;
  for (int i = 0; i < 20; ++i)
    for (int j = 0; j < 20; ++j)
      pts.push_back(
          {{500000.0 + i * 1000 + 500, 4000000.0 + j * 1000 + 500}, (i + j) % 2 ? "a" : "b"});
  write_points(tmp / "p.gpkg", 32633, pts);
  // Frame over 5 x 4 cells of the 20 x 20 grid: 20 points inside.
  Box frame = Box::of(505000, 4003000, 510000, 4007000);
  ReadRequest req{test::wkt_of_epsg(32633), frame, {"cls"}};

  project::Source src{"p", (tmp / "p.gpkg").string(), "pts", "", true};
  long seen = 0;
  auto s = read_features(src, req, [&](const Feature& f) {
    ++seen;
    CHECK(frame.contains(f.points[0]));
    CHECK(f.values.size() == 1);
  });
  // With the spatial filter pushed down GDAL hands over exactly the 20 points inside, not 400.
  CHECK(s.read == 20);
  CHECK(seen == 20);

  src.where = "cls = 'a'";
  seen = 0;
  s = read_features(src, req, [&](const Feature& f) {
    ++seen;
    CHECK(*f.value(0) == "a");
  });
  // In a 5 x 4 block of a checkerboard exactly half the cells are 'a'.
  CHECK(s.read == 10);
  CHECK(seen == 10);

  src.where = "cls = = 'a'";
  CHECK_THROWS_AS(read_features(src, req, [](const Feature&) {}), Error);
}

TEST_CASE("missing sources: required is an input error, optional a warning", "[features]") {
  test::TempDir tmp("missing");
  ReadRequest req{test::wkt_of_epsg(32633), Box::of(0, 0, 1, 1), {}};
  project::Source src{"roads", (tmp / "absent.gpkg").string(), "", "", true};
  try {
    read_features(src, req, [](const Feature&) {});
    FAIL("no error for a missing required source");
  } catch (const Error& e) {
    CHECK(e.kind() == Error::Kind::input);
  }
  src.required = false;
  auto s = read_features(src, req, [](const Feature&) { FAIL("feature from nowhere"); });
  CHECK_FALSE(s.found);

  write_points(tmp / "p.gpkg", 32633, {{{0.5, 0.5}, "a"}});
  src.path = (tmp / "p.gpkg").string();
  src.layer = "no_such_layer";
  src.required = true;
  CHECK_THROWS_AS(read_features(src, req, [](const Feature&) {}), Error);
}

TEST_CASE("the GB open topographic tile reads completely in its own CRS", "[features]") {
  const std::string dir = "usr/share/plplot5.15.0/ss/";
  auto probe = test::open_data("libplplot-data", dir + "ss64ne_Road_Centreline.shp");
  if (!std::filesystem::exists(probe)) {
    WARN("open data absent (run scripts/fetch-test-data); skipping");
    return;
  }
  // The tile covers SS 65-70 E, 45-50 N (the layers' extents, ogrinfo). A frame covering all of
  // it must deliver every feature GDAL counts (GDAL's own feature count is the oracle).
  ReadRequest req{test::wkt_of_epsg(27700), Box::of(264900, 144900, 270100, 150100), {"FeatCode"}};
  for (const char* name : {"Road_Centreline", "Water_Area", "Water_Line", "Building_Area",
                           "Landform_Area", "Landform_Line", "General_Text", "Height_Contours"}) {
    auto path = test::open_data("libplplot-data", dir + "ss64ne_" + name + ".shp");
    DatasetPtr ds = open_vector(path.string());
    const long expected = static_cast<long>(ds->GetLayer(0)->GetFeatureCount(TRUE));
    project::Source src{name, path.string(), "", "", true};
    long seen = 0;
    auto s = read_features(src, req, [&](const Feature& f) {
      ++seen;
      CHECK(f.value(0) != nullptr);
    });
    INFO(name);
    CHECK(expected > 0);
    CHECK(s.read == expected);
    CHECK(seen == expected);
  }
}

// Invalid UTF-8 in a text field the style reads (docs/features.md, Reading): the read stops
// with an input error naming the source, the feature, the field and the first bad byte, the
// value shown escaped. 0xFF never occurs in UTF-8 (RFC 3629, section 1); "Zell" + 0xE9 is a
// Latin-1 e-acute, a lead byte without its continuation.
TEST_CASE("a name that is not valid UTF-8 is refused naming its feature", "[features]") {
  test::TempDir tmp("utf8-names");
  const auto file = tmp / "names.gpkg";
  write_points(file, 32632, {{{500100, 5200100}, "Harrow"}, {{500200, 5200200}, "Zell\xe9"}});
  project::Source src{"places", file.string(), "pts", "", true};
  ReadRequest req{test::wkt_of_epsg(32632), Box::of(500000, 5200000, 501000, 5201000), {"cls"}};
  std::vector<std::string> names;
  try {
    read_features(src, req, [&](const Feature& f) { names.push_back(*f.values[0]); });
    FAIL("no error for invalid UTF-8");
  } catch (const Error& e) {
    CHECK(e.exit_code() == 2);
    const std::string m = e.what();
    CHECK(m.find("names.gpkg: source 'places': feature 2, field 'cls': \"Zell\\xE9\" is not "
                 "valid UTF-8 (byte 5)") != std::string::npos);
  }
  CHECK(names == std::vector<std::string>{"Harrow"});  // the valid one before it was read
  // A field the style does not read is not checked: the same file with only geometry wanted.
  long n = 0;
  ReadRequest geometry_only{req.sheet_crs_wkt, req.clip_ground, {}};
  read_features(src, geometry_only, [&](const Feature&) { ++n; });
  CHECK(n == 2);
}
