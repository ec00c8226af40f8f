#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <cmath>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::sheet;

namespace {

// A 3 x 3 tile index of 5' x 5' graticule cells (invented sheet ids A1..C3, rows from the north)
// in EPSG:4326, written with GDAL's GeoPackage driver.
constexpr double kCell = 5.0 / 60;
constexpr double kLon0 = 14.75, kLat0 = 47.0;  // south-west corner of the index

std::filesystem::path write_index(const test::TempDir& dir) {
  gdal_init();
  auto path = dir / "index.gpkg";
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GPKG");
  REQUIRE(drv);
  GDALDatasetUniquePtr ds(drv->Create(path.c_str(), 0, 0, 0, GDT_Unknown, nullptr));
  REQUIRE(ds);
  OGRSpatialReference wgs84;
  wgs84.importFromEPSG(4326);
  wgs84.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  OGRLayer* layer = ds->CreateLayer("sheets", &wgs84, wkbPolygon, nullptr);
  REQUIRE(layer);
  OGRFieldDefn id("sheet_id", OFTString), name("name", OFTString);
  layer->CreateField(&id);
  layer->CreateField(&name);
  for (int row = 0; row < 3; ++row) {
    for (int col = 0; col < 3; ++col) {
      double w = kLon0 + col * kCell, s = kLat0 + (2 - row) * kCell;
      OGRLinearRing ring;
      ring.addPoint(w, s);
      ring.addPoint(w + kCell, s);
      ring.addPoint(w + kCell, s + kCell);
      ring.addPoint(w, s + kCell);
      ring.closeRings();
      OGRPolygon poly;
      poly.addRing(&ring);
      OGRFeature f(layer->GetLayerDefn());
      std::string sid = std::string(1, char('A' + row)) + std::to_string(col + 1);
      f.SetField("sheet_id", sid.c_str());
      f.SetField("name", ("Cell " + sid).c_str());
      f.SetGeometry(&poly);
      REQUIRE(layer->CreateFeature(&f) == OGRERR_NONE);
    }
  }
  return path;
}

}  // namespace

// A sheet bounded by meridians and parallels: its neatline in UTM is the cell's outline, every
// vertex on a bounding meridian or parallel (checked by projecting back with PROJ), and the
// parallels are curved on the page (a straight top edge would miss the middle of the parallel).
TEST_CASE("graticule sheet from a tile index gets its true neatline", "[sheet]") {
  test::TempDir dir("grat");
  project::Project p;
  p.crs = "EPSG:32633";
  p.scale = 25000;
  p.paper = {"A1", 841, 594};
  p.tile_index = project::TileIndex{write_index(dir).string(), "sheets", "sheet_id", "name"};
  p.extent.sheet_id = "B2";
  style::Style style;
  auto L = compute_layout(p, style, std::nullopt);
  CHECK(L.neatline_is_graticule);
  REQUIRE(L.index_sheet);
  CHECK(L.index_sheet->name == "Cell B2");
  auto crs = SheetCrs::resolve(p.crs);
  double w = kLon0 + kCell, s = kLat0 + kCell;
  double worst = 0;
  for (Point g : L.frame.neatline) {
    Point ll = crs.to_lonlat(g);
    double d = std::min({std::abs(ll.x - w), std::abs(ll.x - (w + kCell)), std::abs(ll.y - s),
                         std::abs(ll.y - (s + kCell))});
    worst = std::max(worst, d);
  }
  CHECK(worst < 1e-9);
  // The north edge follows the parallel, not its chord: the neatline passes through the
  // parallel's midpoint, which lies off the chord by the sag L^2 / (8 rho). Near a transverse
  // Mercator central meridian a parallel curves about like the tangent cone's, rho = nu cot(lat)
  // (nu the prime-vertical radius of WGS 84; from memory, a first-order rule): about 0.8 m of
  // ground, 0.03 mm of paper, here. Within 10 % of that rule.
  Point nw = crs.to_ground({w, s + kCell}), ne = crs.to_ground({w + kCell, s + kCell});
  Point mid = crs.to_ground({w + kCell / 2, s + kCell});
  double nearest = 1e9;
  for (Point g : L.frame.neatline) nearest = std::min(nearest, distance(g, mid));
  CHECK(nearest < 1e-6);
  Point chord = (nw + ne) * 0.5;
  double lat = (s + kCell) * M_PI / 180, a = 6378137, e2 = 0.00669437999014;
  double nu = a / std::sqrt(1 - e2 * std::sin(lat) * std::sin(lat));
  double rho = nu / std::tan(lat);
  double chord_m = distance(nw, ne);
  double sag_m = distance(mid, chord);
  CHECK(sag_m == Approx(chord_m * chord_m / (8 * rho)).epsilon(0.10));
  // And the frame's bounding box is the neatline's.
  Box b;
  for (Point g : L.frame.neatline) b.add(g);
  CHECK(b.min_x == L.frame.ground.min_x);
  CHECK(b.max_y == L.frame.ground.max_y);

  // Neighbours for the adjoining-sheets diagram: all eight, in their places.
  auto info = describe_sheet(p, L);
  CHECK(info.sheet_id == "B2");
  REQUIRE(info.neighbours.size() == 8);
  for (const auto& n : info.neighbours) {
    int row = n.id[0] - 'B', col = n.id[1] - '2';
    CHECK(n.row == row);
    CHECK(n.column == col);
  }
  CHECK(info.index_outlines.size() == 9);
}
