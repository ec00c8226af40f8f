#include "sheetmill/batch/index_plan.hpp"

#include <ogr_api.h>
#include <ogr_geometry.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <map>
#include <sstream>

#include "sheetmill/batch/tile_index_io.hpp"
#include "sheetmill/core/error.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::batch;

namespace {

IndexSpec grid_spec() {
  IndexSpec s;
  s.crs = "EPSG:32633";
  s.scale_denominator = 25000;
  s.frame_width_mm = 400;   // 10 km at 1:25 000
  s.frame_height_mm = 280;  // 7 km
  s.snap_m = 1000;
  s.area = Box::of(500300, 4200200, 519700, 4214900);
  return s;
}

const IndexSheet* find(const IndexPlan& p, const std::string& id) {
  for (const auto& s : p.sheets) {
    if (s.id == id) return &s;
  }
  return nullptr;
}

Box ring_box(const IndexSheet& s) {
  Box b;
  for (const auto& p : s.ring) b.add(p);
  return b;
}

// Every neighbour link is mirrored by the opposite link (n<->s, e<->w, ne<->sw, nw<->se).
void check_neighbours_mirror(const IndexPlan& plan) {
  const int opposite[8] = {1, 0, 3, 2, 7, 6, 5, 4};
  for (const auto& s : plan.sheets) {
    for (int k = 0; k < 8; ++k) {
      if (s.neighbours[k].empty()) continue;
      const IndexSheet* n = find(plan, s.neighbours[k]);
      REQUIRE(n);
      CHECK(n->neighbours[opposite[k]] == s.id);
      CHECK(std::abs(n->row - s.row) <= 1);
      CHECK(std::abs(n->col - s.col) <= 1);
    }
  }
}

}  // namespace

TEST_CASE("grid sheets have whole-km corners, the exact frame size, and cover the area",
          "[batch]") {
  IndexPlan plan = plan_tile_index(grid_spec());
  // Analytic: columns of 10 km from E 500 000 (E 500 300..519 700 -> 2), rows of 7 km from
  // N 4 200 000 (N 4 200 200..4 214 900 meets 4 200 000, 4 207 000 and 4 214 000 -> 3).
  REQUIRE(plan.sheets.size() == 6);
  for (const auto& s : plan.sheets) {
    Box b = ring_box(s);
    for (double v : {b.min_x, b.min_y, b.max_x, b.max_y}) CHECK(std::fmod(v, 1000.0) == 0.0);
    // 1000 mm per metre / 25 000 = exactly 400 x 280 mm on paper.
    CHECK(b.width() * 1000 / 25000 == Approx(400).margin(1e-9));
    CHECK(b.height() * 1000 / 25000 == Approx(280).margin(1e-9));
  }
  // The area's corners each fall in a sheet.
  const Box& a = grid_spec().area;
  for (Point p : {Point{a.min_x, a.min_y}, Point{a.max_x, a.max_y}, Point{a.min_x, a.max_y},
                  Point{a.max_x, a.min_y}}) {
    bool inside = false;
    for (const auto& s : plan.sheets) inside = inside || ring_box(s).contains(p);
    CHECK(inside);
  }
  // Row A is the northernmost, column 1 the westernmost.
  const IndexSheet* a1 = find(plan, "A01");
  REQUIRE(a1);
  CHECK(ring_box(*a1).min_x == 500000);
  CHECK(ring_box(*a1).max_y == 4221000);
  CHECK(a1->neighbours[0].empty());   // nothing north
  CHECK(a1->neighbours[1] == "B01");  // south
  CHECK(a1->neighbours[2] == "A02");  // east
  CHECK(a1->neighbours[6] == "B02");  // south-east
  check_neighbours_mirror(plan);
}

TEST_CASE("an overlap is kept on whole snap units and shared by neighbours", "[batch]") {
  IndexSpec spec = grid_spec();
  spec.snap_m = 250;
  spec.overlap_mm = 10;  // 250 m at 1:25 000
  IndexPlan plan = plan_tile_index(spec);
  CHECK(plan.overlap_m == 250);
  const IndexSheet* a1 = find(plan, "A01");
  REQUIRE(a1);
  const IndexSheet* a2 = find(plan, a1->neighbours[2]);
  REQUIRE(a2);
  CHECK(ring_box(*a1).max_x - ring_box(*a2).min_x == 250);
  // A frame not a whole number of snap units is rounded down (7.5 km -> 7 km with a 1 km snap).
  IndexSpec odd = grid_spec();
  odd.frame_height_mm = 300;
  CHECK(plan_tile_index(odd).frame_height_m == 7000);
}

TEST_CASE("graticule sheets are whole 7.5-minute cells covering the area", "[batch]") {
  IndexSpec spec;
  spec.crs = "EPSG:32633";
  spec.alignment = IndexAlignment::graticule;
  spec.scale_denominator = 24000;
  spec.area = Box::of(500000, 5200000, 520000, 5215000);
  IndexPlan plan = plan_tile_index(spec);
  // Oracle: the area's corners in longitude/latitude from GDAL's gdaltransform (UTM 33N ->
  // WGS 84), each of which must fall inside some cell.
  std::ostringstream corners;
  corners << "500000 5200000\n520000 5215000\n500000 5215000\n520000 5200000\n";
  sheetmill::test::TempDir dir;
  sheetmill::test::write_text(dir / "in.txt", corners.str());
  auto r = sheetmill::test::run_command(
      {"sh", "-c",
       "gdaltransform -s_srs EPSG:32633 -t_srs EPSG:4326 -output_xy < " +
           (dir / "in.txt").string()});
  REQUIRE(r.exit_code == 0);
  std::istringstream out(r.out);
  double lon = 0, lat = 0;
  int n = 0;
  while (out >> lon >> lat) {
    ++n;
    bool inside = false;
    for (const auto& s : plan.sheets) inside = inside || ring_box(s).contains({lon, lat});
    CHECK(inside);
  }
  CHECK(n == 4);
  for (const auto& s : plan.sheets) {
    Box b = ring_box(s);
    // Corners on multiples of 7.5' = 0.125 degrees, cells exactly that size.
    for (double v : {b.min_x, b.min_y, b.max_x, b.max_y}) {
      CHECK(std::abs(v / 0.125 - std::round(v / 0.125)) < 1e-9);
    }
    CHECK(b.width() == Approx(0.125).margin(1e-12));
    CHECK(b.height() == Approx(0.125).margin(1e-12));
  }
  check_neighbours_mirror(plan);
}

TEST_CASE("an area polygon keeps only the sheets it meets", "[batch]") {
  IndexSpec spec = grid_spec();
  spec.area = Box::of(500000, 4200000, 540000, 4228000);  // 4 x 4 sheets as a box
  // A triangle over the western column and the southern row (a corner region).
  spec.area_polygons_wkt = {
      "POLYGON ((500500 4200500, 539500 4200500, 500500 4227500, 500500 4200500))"};
  IndexPlan plan = plan_tile_index(spec);
  // Oracle: OGR's own intersection test on each candidate cell of the 4 x 4 lattice.
  OGRGeometry* tri = nullptr;
  OGRGeometryFactory::createFromWkt(spec.area_polygons_wkt[0].c_str(), nullptr, &tri);
  std::unique_ptr<OGRGeometry> triangle(tri);
  int expected = 0;
  for (int i = 0; i < 4; ++i) {
    for (int j = 0; j < 4; ++j) {
      OGRPolygon cell;
      OGRLinearRing ring;
      double x = 500000 + i * 10000, y = 4200000 + j * 7000;
      ring.addPoint(x, y);
      ring.addPoint(x + 10000, y);
      ring.addPoint(x + 10000, y + 7000);
      ring.addPoint(x, y + 7000);
      ring.closeRings();
      cell.addRing(&ring);
      std::unique_ptr<OGRGeometry> inter(cell.Intersection(triangle.get()));
      expected += inter && OGR_G_Area(OGRGeometry::ToHandle(inter.get())) > 0;
    }
  }
  CHECK(static_cast<int>(plan.sheets.size()) == expected);
  CHECK(expected < 16);
  check_neighbours_mirror(plan);
}

TEST_CASE("ID templates give row/column and corner IDs, clashes are errors", "[batch]") {
  IndexSpec spec = grid_spec();
  spec.id_template = "T{e_km}-{n_km}";
  spec.name_template = "Sheet {id} (row {row}, column {col_a})";
  IndexPlan plan = plan_tile_index(spec);
  const IndexSheet* s = find(plan, "T500-4214");
  REQUIRE(s);
  CHECK(s->name == "Sheet T500-4214 (row 1, column A)");
  spec.id_template = "{row}";  // two sheets per row
  CHECK_THROWS_AS(plan_tile_index(spec), sheetmill::Error);
  spec.id_template = "{nosuch}";
  CHECK_THROWS_AS(plan_tile_index(spec), sheetmill::Error);
  CHECK(letters_for(1) == "A");
  CHECK(letters_for(26) == "Z");
  CHECK(letters_for(27) == "AA");
  CHECK(letters_for(703) == "AAA");
}

TEST_CASE("a written index reads back with its IDs, names and neighbours", "[batch]") {
  sheetmill::test::TempDir dir;
  IndexPlan plan = plan_tile_index(grid_spec());
  auto path = dir / "tiles.gpkg";
  write_tile_index(plan, path, "sheets");
  // Oracle: ogrinfo sees one layer of 6 polygons with the documented fields.
  auto info = sheetmill::test::run_command({"ogrinfo", "-so", "-al", path.string()});
  REQUIRE(info.exit_code == 0);
  CHECK(info.out.find("Feature Count: 6") != std::string::npos);
  for (const char* field : {"sheet_id:", "name:", "row:", "col:", "n:", "se:", "sw:"}) {
    CHECK(info.out.find(field) != std::string::npos);
  }
  TileIndexContent back = read_tile_index(path.string(), "sheets", "sheet_id", "name");
  REQUIRE(back.sheets.size() == 6);
  std::map<std::string, std::string> south;
  for (const auto& j : back.sheets) south[j.id] = j.fields.at("s");
  CHECK(south["A01"] == "B01");
  CHECK(south["C01"] == "");  // NULL: no sheet south of the last row
  CHECK(back.sheets.front().footprint.width() == 10000);
  // No temporaries beside it.
  int files = 0;
  for (const auto& e : std::filesystem::directory_iterator(dir.path()))
    files += !!e.is_regular_file();
  CHECK(files == 1);
}
