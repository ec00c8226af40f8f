// Roads by class with their numbers, river and lake names on the exhibit (issue 15), read back
// as text with poppler's pdftotext -bbox: each name once, inside the map frame, and the lake's
// name inside the lake. The synthetic layers are GeoJSON in the exhibit's CRS.
#include <fmt/format.h>

#include <catch2/catch.hpp>
#include <set>

#include "exhibit_fixture.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/render_exhibit.hpp"
#include "support/pdf_words.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

namespace {

std::string collection(const std::string& features) {
  return R"({"type": "FeatureCollection",
 "crs": {"type": "name", "properties": {"name": "urn:ogc:def:crs:EPSG::32632"}},
 "features": [)" +
         features + "]}";
}

std::string line(const std::string& props, double e0, double n0, double e1, double n1) {
  return fmt::format(
      R"({{"type": "Feature", "properties": {{{}}},
  "geometry": {{"type": "LineString", "coordinates": [[{}, {}], [{}, {}]]}}}})",
      props, e0, n0, e1, n1);
}

}  // namespace

TEST_CASE("road numbers, river and lake names are on the exhibit", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-names");
  fx::write_plane_dem(dir / "dem.tif", 100, 0.05, 50);
  const double e = fx::kE0, n = fx::kN0;
  sheetmill::test::write_text(
      dir / "roads.geojson",
      collection(line(R"("class": "main", "ref": "Q 7")", e + 500, n + 2000, e + 11500, n + 2000) +
                 "," +
                 line(R"("class": "minor", "ref": "")", e + 500, n + 8000, e + 6000, n + 8500)));
  sheetmill::test::write_text(
      dir / "rivers.geojson",
      collection(line(R"("name": "River Quell")", e + 1000, n + 6000, e + 11000, n + 5000)));
  sheetmill::test::write_text(dir / "lakes.geojson",
                              collection(fmt::format(
                                  R"({{"type": "Feature", "properties": {{"name": "Quellmere"}},
  "geometry": {{"type": "Polygon", "coordinates": [[[{0}, {2}], [{1}, {2}], [{1}, {3}],
  [{0}, {3}], [{0}, {2}]]]}}}})",
                                  e + 7000, e + 10500, n + 500, n + 1700)));
  sheetmill::test::write_text(
      dir / "x.yaml",
      fx::exhibit_yaml(
          dir / "dem.tif", "ARCH D", false, 1, "  dpi: 30\n",
          fmt::format("context:\n  roads: {{file: {}}}\n  water_lines: {{file: {}}}\n"
                      "  water_areas: {{file: {}}}\n",
                      (dir / "roads.geojson").string(), (dir / "rivers.geojson").string(),
                      (dir / "lakes.geojson").string())));
  ExhibitReport rep = render_exhibit(load_exhibit_project(dir / "x.yaml"), dir / "x.pdf");
  const auto words = test::pdf_words(dir / "x.pdf");
  const Box map = rep.layout.map_box_mm;
  std::multiset<std::string> inside;
  Box quellmere;
  for (const auto& w : words) {
    const Box b = w.box_mm();
    if (!map.contains(b.centre())) continue;
    inside.insert(w.text);
    if (w.text == "Quellmere") quellmere = b;
  }
  CHECK(inside.count("Q") == 1);
  CHECK(inside.count("7") == 1);
  CHECK(inside.count("River") == 1);
  CHECK(inside.count("Quell") == 1);
  REQUIRE(inside.count("Quellmere") == 1);
  // The lake's name sits inside the lake.
  const Box lake = Box::of(rep.layout.frame.to_page({e + 7000, n + 1700}).x,
                           rep.layout.frame.to_page({e + 7000, n + 1700}).y,
                           rep.layout.frame.to_page({e + 10500, n + 500}).x,
                           rep.layout.frame.to_page({e + 10500, n + 500}).y);
  CHECK(lake.contains(quellmere.centre()));
}
