// Lakes cut contours (GEOS through OGR as the oracle); spot heights by prominence on a grid
// whose answer follows from the definition by hand; elevation figures.
#include <ogr_geometry.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

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

TEST_CASE("spot heights: none on a tilted plane, none along a DEM's edge", "[contours][spots]") {
  // A plane rising north-east: every cell's highest neighbour lies toward the edge, so the only
  // maximum is the corner cell and the only minimum the opposite one, both on the edge where the
  // ground beyond is unknown.
  auto plane = synthetic::make_dem(120, 80, 10, 0, 800,
                                   [](double x, double y) { return 100 + 0.02 * x + 0.01 * y; });
  CHECK(find_summits(plane, 5).empty());
  CHECK(find_depression_bottoms(plane, 5).empty());
  // A knoll 30 m high on the same plane (analytic top at (600, 400)) is still found, alone.
  auto knoll = synthetic::make_dem(120, 80, 10, 0, 800, [](double x, double y) {
    double r2 = (x - 605) * (x - 605) + (y - 405) * (y - 405);
    return 100 + 0.02 * x + 0.01 * y + 30 * std::exp(-r2 / (80.0 * 80.0));
  });
  auto summits = find_summits(knoll, 5);
  REQUIRE(summits.size() == 1);
  CHECK(distance(summits[0].ground, {605, 405}) <= 20);  // within two cells of the analytic top
}

TEST_CASE("spot heights: none on the border of a nodata hole", "[contours][spots]") {
  // A cone rising toward a nodata hole of radius 200 m: the hole's border holds the highest known
  // cells, but the ground inside the hole is unknown, so no summit may sit there. A knoll 25 m
  // high well away from the hole and the edges is a real summit and must be kept.
  const Point hole{400, 400}, top{1205, 405};
  auto dem = synthetic::make_dem(160, 80, 10, 0, 800, [&](double x, double y) {
    double r2 = (x - top.x) * (x - top.x) + (y - top.y) * (y - top.y);
    return 300 - 0.1 * distance({x, y}, hole) + 25 * std::exp(-r2 / (60.0 * 60.0));
  });
  const double* gt = dem.grid.geotransform;
  for (int r = 0; r < dem.height(); ++r)
    for (int c = 0; c < dem.width(); ++c)
      if (distance({gt[0] + (c + 0.5) * 10, gt[3] - (r + 0.5) * 10}, hole) < 200)
        dem.z[static_cast<std::size_t>(r) * dem.width() + c] =
            std::numeric_limits<float>::quiet_NaN();
  auto summits = find_summits(dem, 5);
  for (const auto& s : summits) {
    INFO("summit at " << s.ground.x << ", " << s.ground.y << ": " << s.elevation_m);
    CHECK(distance(s.ground, hole) > 200 + 3 * 10);
  }
  REQUIRE(summits.size() == 1);
  CHECK(distance(summits[0].ground, top) <= 20);
}
