// The exhibit PDF comes out of the shared finisher (pdf::LayeredCanvas): GDAL's PDF driver (an
// outside reader of ISO 32000-2 geospatial viewports) reads its frame back in the same CRS with
// a corner within 0.5 m, and qpdf lists its optional content groups. The north arrow uses the
// one sheet CRS type; its angle is checked against PROJ (a meridian step projected with
// proj_trans) and against the first-order formula gamma = (lon - lon0) sin(lat) (common
// practice: the first term of the transverse Mercator convergence series, stated from memory).
#include <cairo.h>
#include <gdal_priv.h>
#include <ogr_spatialref.h>
#include <proj.h>
// qpdf 11: use std::shared_ptr throughout, no PointerHolder.
#define POINTERHOLDER_TRANSITION 4

#include <catch2/catch.hpp>
#include <cmath>
#include <qpdf/QPDF.hh>
#include <set>
#include <string>

#include "exhibit_fixture.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/exhibit/exhibit_layout.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/furniture.hpp"
#include "sheetmill/exhibit/render_exhibit.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

namespace {

struct Rendered {
  sheetmill::test::TempDir dir{"exhibit-geo"};
  ExhibitReport report;
  std::filesystem::path pdf;
};

// A small plane exhibit (ARCH D portrait, relief at 30 dpi) with a focus area and a veil.
void render_plane_exhibit(Rendered& r) {
  fx::write_plane_dem(r.dir / "dem.tif", 100, 0.05, 50);
  sheetmill::test::write_text(
      r.dir / "x.yaml",
      fx::exhibit_yaml(r.dir / "dem.tif", "ARCH D", false, 2, "  dpi: 30\n",
                       "areas:\n"
                       "  - label: Basin\n"
                       "    ring: [[474000, 5193000], [478000, 5193000], [478000, 5196000]]\n"
                       "dim_outside: 30%\n"));
  r.pdf = r.dir / "x.pdf";
  r.report = render_exhibit(load_exhibit_project(r.dir / "x.yaml"), r.pdf);
}

}  // namespace

TEST_CASE("GDAL reads the exhibit PDF's georeferencing back", "[exhibit]") {
  Rendered r;
  render_plane_exhibit(r);
  const MapFrame& frame = r.report.layout.frame;
  gdal_init();
  // At 254 dpi a pixel is 0.1 mm of paper.
  CPLSetThreadLocalConfigOption("GDAL_PDF_DPI", "254");
  GDALDatasetUniquePtr ds(GDALDataset::Open(r.pdf.c_str(), GDAL_OF_RASTER));
  CPLSetThreadLocalConfigOption("GDAL_PDF_DPI", nullptr);
  REQUIRE(ds);
  const OGRSpatialReference* srs = ds->GetSpatialRef();
  REQUIRE(srs);
  OGRSpatialReference utm;
  utm.importFromEPSG(32632);
  CHECK(srs->IsSame(&utm));
  double gt[6];
  REQUIRE(ds->GetGeoTransform(gt) == CE_None);
  const double m_per_px = frame.scale_denominator * 0.1e-3;
  CHECK(gt[1] == Approx(m_per_px).epsilon(0.001));
  CHECK(-gt[5] == Approx(m_per_px).epsilon(0.001));
  auto ground_at_mm = [&](Point mm) {
    const double px = mm.x * 10, py = mm.y * 10;
    return Point{gt[0] + px * gt[1] + py * gt[2], gt[3] + px * gt[4] + py * gt[5]};
  };
  // The frame's top-left and bottom-right corners, from where the layout put them on the page.
  const Box page = frame.page_box_mm();
  const Point tl = ground_at_mm({page.min_x, page.min_y});
  const Point br = ground_at_mm({page.max_x, page.max_y});
  CHECK(tl.x == Approx(frame.ground.min_x).margin(0.5));
  CHECK(tl.y == Approx(frame.ground.max_y).margin(0.5));
  CHECK(br.x == Approx(frame.ground.max_x).margin(0.5));
  CHECK(br.y == Approx(frame.ground.min_y).margin(0.5));
}

TEST_CASE("the exhibit PDF has a layer per overlay, and the relief strips in its relief layer",
          "[exhibit]") {
  Rendered r;
  render_plane_exhibit(r);
  QPDF q;
  q.processFile(r.pdf.c_str());
  auto ocgs = q.getRoot().getKey("/OCProperties").getKey("/OCGs");
  REQUIRE(ocgs.isArray());
  std::set<std::string> names;
  for (int i = 0; i < ocgs.getArrayNItems(); ++i)
    names.insert(ocgs.getArrayItem(i).getKey("/Name").getUTF8Value());
  for (const char* n : {"relief", "water", "roads", "veil", "areas", "places", "furniture"}) {
    INFO(n);
    CHECK(names.count(n) == 1);
  }
  // Every strip is a full-width image: no placeholder is left in the file.
  int strips = 0;
  for (QPDFObjectHandle obj : q.getAllObjects()) {
    if (!obj.isStream()) continue;
    QPDFObjectHandle d = obj.getDict();
    if (!d.getKey("/Subtype").isNameAndEquals("/Image")) continue;
    CHECK(d.getKey("/Width").getIntValue() != 8);
    if (d.getKey("/Width").getIntValue() == r.report.relief_width_px) ++strips;
  }
  CHECK(strips == r.report.relief_strips);
}

TEST_CASE("the exhibit's north arrow turns by the sheet CRS's convergence, with PROJ's sign",
          "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-north");
  fx::write_plane_dem(dir / "dem.tif", 100, 0.05, 50);
  sheetmill::test::write_text(dir / "x.yaml",
                              fx::exhibit_yaml(dir / "dem.tif", "ARCH D", false, 2));
  const ExhibitLayout layout = compute_exhibit_layout(load_exhibit_project(dir / "x.yaml"));
  CairoSurfacePtr s(cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, nullptr));
  CairoPtr cr(cairo_create(s.get()));
  text::FontCache fonts;
  const double true_north_deg =
      draw_north_arrow(cr.get(), layout.scale_box_mm, layout.frame, layout.type, fonts);

  // PROJ alone: the frame centre to longitude/latitude, 0.01 degree north along its meridian,
  // back to the grid; the angle of that step from grid north, clockwise.
  PJ_CONTEXT* ctx = proj_context_create();
  PJ* raw = proj_create_crs_to_crs(ctx, "EPSG:32632", "EPSG:4326", nullptr);
  REQUIRE(raw);
  PJ* op = proj_normalize_for_visualization(ctx, raw);
  proj_destroy(raw);
  REQUIRE(op);
  const Point c = layout.frame.ground.centre();
  PJ_COORD ll = proj_trans(op, PJ_FWD, proj_coord(c.x, c.y, 0, 0));
  const double lon = ll.xy.x, lat = ll.xy.y;
  PJ_COORD up = proj_trans(op, PJ_INV, proj_coord(lon, lat + 0.01, 0, 0));
  const double proj_deg = std::atan2(up.xy.x - c.x, up.xy.y - c.y) * 180 / M_PI;
  proj_destroy(op);
  proj_context_destroy(ctx);

  // The frame lies west of zone 32's central meridian (9 degrees E) in the north: meridians
  // lean towards it, so true north is clockwise (east) of grid north.
  CHECK(lon < 9);
  CHECK(true_north_deg > 0);
  CHECK(true_north_deg == Approx(proj_deg).margin(0.005));
  CHECK(true_north_deg == Approx(-(lon - 9) * std::sin(lat * M_PI / 180)).margin(0.01));
}
