// Lakes cut contours (GEOS through OGR as the oracle); spot heights by prominence on a grid
// whose answer follows from the definition by hand; elevation figures.
#include <ogr_geometry.h>

#include <catch2/catch.hpp>
#include <cmath>

#include "contours/synthetic_dem.hpp"
#include "sheetmill/contours/contour_layer.hpp"
#include "sheetmill/contours/generate.hpp"
#include "sheetmill/contours/prepare.hpp"
#include "sheetmill/contours/spot_heights.hpp"
#include "sheetmill/contours/water_clip.hpp"
#include "sheetmill/core/error.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::contours;

namespace {

OGRLineString ogr_line(const ContourLine& l) {
  OGRLineString g;
  for (const auto& p : l.ground) g.addPoint(p.x, p.y);
  if (l.closed) g.addPoint(l.ground[0].x, l.ground[0].y);
  return g;
}

OGRPolygon ogr_polygon(const std::vector<Polyline>& rings) {
  OGRPolygon poly;
  for (const auto& r : rings) {
    OGRLinearRing ring;
    for (const auto& p : r) ring.addPoint(p.x, p.y);
    ring.closeRings();
    poly.addRing(&ring);
  }
  return poly;
}

}  // namespace

TEST_CASE("contours stop at a lake shore and keep around its island", "[contours]") {
  if (!OGRGeometryFactory::haveGEOS()) {
    WARN("GDAL built without GEOS: no oracle for the clipped length");
    return;
  }
  const Point c{1000, 1000};
  auto dem = synthetic::make_dem(200, 200, 10, 0, 2000, [&](double x, double y) {
    return 400 - 0.3 * distance({x, y}, c);
  });
  ContourParams p;
  p.interval_m = 10;
  auto lines = generate(dem, p);
  // A lake (a quadrilateral) with an island (a hole) on the slope.
  std::vector<Polyline> lake = {{{1200, 900}, {1700, 950}, {1650, 1400}, {1250, 1350}},
                                {{1380, 1080}, {1500, 1080}, {1500, 1200}, {1380, 1200}}};
  OGRPolygon water = ogr_polygon(lake);
  double expected = 0;
  for (const auto& l : lines) {
    auto g = ogr_line(l);
    std::unique_ptr<OGRGeometry> dry(g.Difference(&water));
    if (!dry || dry->IsEmpty()) continue;
    auto type = wkbFlatten(dry->getGeometryType());
    if (type == wkbLineString) expected += dry->toLineString()->get_Length();
    if (type == wkbMultiLineString) expected += dry->toMultiLineString()->get_Length();
  }
  auto clipped = lines;
  clip_out_polygons(clipped, {lake});
  double got = 0;
  for (const auto& l : clipped) {
    got += line_length(l);
    auto g = ogr_line(l);
    // Nothing runs through the water (a tiny negative buffer allows for the shore itself).
    std::unique_ptr<OGRGeometry> inner(water.Buffer(-0.01));
    CHECK_FALSE(g.Intersects(inner.get()));
  }
  CHECK(got == Approx(expected).epsilon(1e-9));
  CHECK(clipped.size() > lines.size());  // lines crossing the lake are split, others stay whole
}

TEST_CASE("summits by prominence, from the definition", "[contours]") {
  // 7 x 5 cells of 0 but row 2 = 10, 50, 30, 40, 10 in columns 1-5. Peak A (50) is the highest:
  // prominence 50 - 0 = 50. Peak B (40) reaches A only over the col of 30: prominence 10.
  auto dem = synthetic::make_dem(7, 5, 10, 0, 50, [](double, double) { return 0.0; });
  float row[] = {0, 10, 50, 30, 40, 10, 0};
  for (int i = 0; i < 7; ++i) dem.z[2 * 7 + i] = row[i];
  auto all = find_summits(dem, 5);
  REQUIRE(all.size() == 2);
  CHECK(all[0].elevation_m == 50);
  CHECK(all[0].ground.x == Approx(25));  // cell centre of column 2
  CHECK(all[0].ground.y == Approx(25));  // row 2 from the top edge at 50
  CHECK(all[1].elevation_m == 40);
  CHECK(find_summits(dem, 11).size() == 1);
  // The same grid upside down: two pits, -50 and -40, the shallower 10 deep.
  for (auto& v : dem.z) v = -v;
  auto pits = find_depression_bottoms(dem, 5);
  REQUIRE(pits.size() == 2);
  CHECK(pits[0].elevation_m == -50);
  CHECK(pits[0].kind == SpotHeight::Kind::depression);
}

TEST_CASE("elevation figures: rounded, no trailing zeros, template kept", "[contours]") {
  CHECK(elevation_text(1234.4, 1, "{elevation_m}") == "1234");
  CHECK(elevation_text(1234.6, 1, "") == "1235");
  CHECK(elevation_text(12.5, 0.5, "{elevation_m}") == "12.5");
  CHECK(elevation_text(-0.2, 1, "{ele} m") == "0 m");
  CHECK(elevation_text(987.0, 5, "{elevation_m}") == "985");
}

TEST_CASE("supplied contour layers: elevation field required, lines read back", "[contours]") {
  test::TempDir tmp("layer");
  auto dem = synthetic::make_dem(100, 100, 10, 0, 1000,
                                 [](double x, double y) { return x / 20 + y / 40; });
  ContourParams p;
  p.interval_m = 5;
  auto lines = generate(dem, p);
  write_geopackage(tmp / "c.gpkg", lines, "");
  try {
    read_layer((tmp / "c.gpkg").string(), "", "height", {}, "", p);
    FAIL("no error for a missing field");
  } catch (const Error& e) {
    CHECK(e.kind() == Error::Kind::input);
    CHECK_THAT(e.what(), Catch::Contains("no elevation field 'height'"));
    CHECK_THAT(e.what(), Catch::Contains("c.gpkg"));
  }
  auto back = read_layer((tmp / "c.gpkg").string(), "contours", "elevation", {}, "", p, &dem);
  REQUIRE(back.size() == lines.size());
  for (std::size_t i = 0; i < back.size(); ++i) {
    CHECK(back[i].elevation_m == lines[i].elevation_m);
    CHECK(back[i].index == lines[i].index);
    CHECK(back[i].uphill_known);
  }
  // Real data: the Ordnance-style height contours of the plplot tile carry no height
  // attribute (tests/data/README.md), so asking for one is a clear error.
  auto shp =
      test::open_data("libplplot-data", "usr/share/plplot5.15.0/ss/ss64ne_Height_Contours.shp");
  if (std::filesystem::exists(shp)) {
    CHECK_THROWS_WITH(read_layer(shp.string(), "", "height", {}, "", p),
                      Catch::Contains("no elevation field"));
  }
}
