// The drawing order inside the map frame: relief and contours take their places among the style's
// layers. Checked on the demo sheet exported as GeoTIFF against GDAL's own contour program
// (GDALContourGenerateEx on the demo DEM) and the demo's woods read with OGR: where a GDAL
// contour runs inside a wood, the sheet shows contour ink there, unless the style puts the
// contours under the area fills.
#include "sheetmill/render/draw_order.hpp"

#include <gdal_alg.h>
#include <gdal_priv.h>
#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <map>
#include <regex>

#include "render/render_support.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/style/style.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

constexpr double kDpi = 200;
constexpr double kMetresPerMm = 25;  // the demo sheet is at 1:25 000

// Points every 100 m along GDAL's 10 m contours of the demo DEM (the project's interval), inside
// `frame`. Lines under 5 mm on paper are left out: the sheet drops loops under 1.5 mm
// (contours.min_loop) and generalises the rest.
std::vector<Point> gdal_contour_points(const fs::path& dem_path, const Box& frame) {
  DatasetPtr dem(GDALDataset::Open(dem_path.c_str(), GDAL_OF_RASTER));
  REQUIRE(dem);
  DatasetPtr mem(
      GetGDALDriverManager()->GetDriverByName("Memory")->Create("", 0, 0, 0, GDT_Unknown, nullptr));
  OGRLayer* layer = mem->CreateLayer("contours", nullptr, wkbLineString);
  OGRFieldDefn elev("elev", OFTReal);
  layer->CreateField(&elev);
  const char* options[] = {"LEVEL_INTERVAL=10", "LEVEL_BASE=0", "ELEV_FIELD=0", nullptr};
  REQUIRE(GDALContourGenerateEx(dem->GetRasterBand(1), layer, const_cast<char**>(options), nullptr,
                                nullptr) == CE_None);
  std::vector<Point> out;
  for (auto& f : *layer) {
    const OGRLineString* ls = f->GetGeometryRef()->toLineString();
    if (ls->get_Length() < 5 * kMetresPerMm) continue;
    for (double at = 0; at < ls->get_Length(); at += 100) {
      OGRPoint p;
      ls->Value(at, &p);
      if (frame.contains({p.getX(), p.getY()})) out.push_back({p.getX(), p.getY()});
    }
  }
  return out;
}

// Vertices, every 10 m, of the features drawn above the contours (water lines, transport, power
// lines, buildings), hashed in 25 m cells: a contour point within 1 mm on paper (25 m) of one of
// them may lie under its ink.
struct OtherInk {
  std::map<std::pair<long, long>, std::vector<Point>> cells;
  void add_line(const OGRLineString& ls) {
    for (double at = 0; at <= ls.get_Length(); at += 10) {
      OGRPoint p;
      ls.Value(at, &p);
      cells[{std::lround(p.getX() / 25), std::lround(p.getY() / 25)}].push_back(
          {p.getX(), p.getY()});
    }
  }
  bool near(Point p) const {
    const long cx = std::lround(p.x / 25), cy = std::lround(p.y / 25);
    for (long dy = -2; dy <= 2; ++dy)
      for (long dx = -2; dx <= 2; ++dx) {
        auto it = cells.find({cx + dx, cy + dy});
        if (it == cells.end()) continue;
        for (Point q : it->second)
          if (distance(p, q) < 1 * kMetresPerMm + 10) return true;
      }
    return false;
  }
};

void add_geometry(OtherInk& ink, const OGRGeometry* g) {
  if (!g) return;
  const auto type = wkbFlatten(g->getGeometryType());
  if (type == wkbLineString) {
    ink.add_line(*g->toLineString());
  } else if (type == wkbPolygon) {
    ink.add_line(*g->toPolygon()->getExteriorRing());
  } else if (OGR_GT_IsSubClassOf(type, wkbGeometryCollection)) {
    for (const OGRGeometry* part : *g->toGeometryCollection()) add_geometry(ink, part);
  }
}

struct Sample {
  std::vector<Point> in_woods;  // GDAL contour points inside a wood, away from other ink
};

Sample contour_points_in_woods(const fs::path& area, const Box& frame) {
  DatasetPtr gpkg(GDALDataset::Open((area / "features.gpkg").c_str(), GDAL_OF_VECTOR));
  REQUIRE(gpkg);
  // Woods shrunk by 1 mm on paper, so their edges (outline, generalisation) do not count.
  std::vector<std::unique_ptr<OGRGeometry>> woods;
  OGRLayer* landcover = gpkg->GetLayerByName("landcover");
  landcover->SetAttributeFilter("kind = 'wood'");
  for (auto& f : *landcover) {
    std::unique_ptr<OGRGeometry> inner(f->GetGeometryRef()->Buffer(-1 * kMetresPerMm));
    if (inner && !inner->IsEmpty()) woods.push_back(std::move(inner));
  }
  REQUIRE(woods.size() > 10);
  OtherInk ink;
  for (const char* name :
       {"water_lines", "roads", "tracks", "railways", "power_lines", "buildings", "water_areas"}) {
    OGRLayer* l = gpkg->GetLayerByName(name);
    REQUIRE(l);
    for (auto& f : *l) add_geometry(ink, f->GetGeometryRef());
  }
  Sample s;
  for (Point p : gdal_contour_points(area / "dem.tif", frame)) {
    OGRPoint op(p.x, p.y);
    bool in_wood = false;
    for (const auto& w : woods) {
      OGREnvelope e;
      w->getEnvelope(&e);
      if (p.x < e.MinX || p.x > e.MaxX || p.y < e.MinY || p.y > e.MaxY) continue;
      if (w->Contains(&op)) {
        in_wood = true;
        break;
      }
    }
    if (in_wood && !ink.near(p)) s.in_woods.push_back(p);
  }
  return s;
}

// Share of `points` where the GeoTIFF shows contour ink within 0.35 mm (the contours'
// generalisation tolerance of 0.25 mm plus half a 0.13 mm pixel at 200 dpi): a pixel redder than
// it is green. The contour colour (#9a5b2e) is, the wood fill (#c3e3ad) is not, whatever the
// relief's shading multiplies both with.
double share_with_contour_ink(const fs::path& tif, const std::vector<Point>& points) {
  DatasetPtr ds(GDALDataset::Open(tif.c_str(), GDAL_OF_RASTER));
  REQUIRE(ds);
  double gt[6];
  REQUIRE(ds->GetGeoTransform(gt) == CE_None);
  const int r = static_cast<int>(std::ceil(0.35 / (25.4 / kDpi)));
  const int side = 2 * r + 1;
  std::vector<unsigned char> rgb(static_cast<std::size_t>(side) * side * 3);
  int with_ink = 0;
  for (Point p : points) {
    const int col = static_cast<int>((p.x - gt[0]) / gt[1]);
    const int row = static_cast<int>((p.y - gt[3]) / gt[5]);
    REQUIRE(ds->RasterIO(GF_Read, col - r, row - r, side, side, rgb.data(), side, side, GDT_Byte, 3,
                         nullptr, 3, 3 * side, 1, nullptr) == CE_None);
    bool ink = false;
    for (int y = 0; y < side; ++y)
      for (int x = 0; x < side; ++x) {
        if ((x - r) * (x - r) + (y - r) * (y - r) > r * r) continue;
        const unsigned char* px = &rgb[(static_cast<std::size_t>(y) * side + x) * 3];
        if (px[0] > px[1] + 8) ink = true;
      }
    with_ink += ink;
  }
  return points.empty() ? 0 : static_cast<double>(with_ink) / points.size();
}

struct Rendered {
  fs::path tif;
  Box frame_ground;
};

// The demo sheet as GeoTIFF, with `style_edit` applied to a copy of the field style.
Rendered render_demo(const test::TempDir& dir,
                     const std::function<std::string(std::string)>& style_edit) {
  auto project = test::write_demo_project(dir);
  const fs::path style = dir / "style.yaml";
  test::write_text(style, style_edit(test::read_text(test::source_dir() / "styles/field.yaml")));
  std::string text = test::read_text(project);
  text = std::regex_replace(text, std::regex("style: .*"), "style: " + style.string());
  test::write_text(project, text);
  Rendered out;
  out.tif = dir / "sheet.tif";
  auto r = test::run_sheetmill({"--quiet", "render", project.string(), "-o", out.tif.string(),
                                "--dpi", std::to_string(static_cast<int>(kDpi))});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  const project::Project p = project::load_project(project);
  out.frame_ground =
      sheet::compute_layout(p, style::load_style(p.style), std::nullopt).frame.ground;
  return out;
}

std::string with_contours_order(std::string style, int order) {
  // In place of the style's own contours.order, if it gives one.
  return std::regex_replace(style, std::regex("\ncontours:\n(  order: [^\n]*\n)?"),
                            "\ncontours:\n  order: " + std::to_string(order) + "\n");
}

}  // namespace

TEST_CASE("contours lie over woods on the demo sheet, under them when the style says so",
          "[render][draw-order]") {
  gdal_init();
  test::TempDir above_dir("order-default"), below_dir("order-below");
  // Contour figures are spaced out of the way (every 5 m of line instead of 70 mm): their line
  // gaps and halos are drawn above the contours on purpose and are not what this test measures.
  const auto sparse_figures = [](std::string s) {
    return std::regex_replace(s, std::regex("\n    every: 70mm\n"), "\n    every: 5000mm\n");
  };
  const Rendered above = render_demo(above_dir, sparse_figures);
  const Sample sample = contour_points_in_woods(test::demo_area(), above.frame_ground);
  INFO(sample.in_woods.size() << " GDAL contour points inside woods");
  // The demo's woods lie on the valley sides: hundreds of contour crossings (not a test of
  // nothing).
  REQUIRE(sample.in_woods.size() > 300);
  // The default stack: area fills, relief, water areas, contours. Some contour points lie under a
  // name's halo or a contour figure's gap (drawn above), hence not every one.
  const double above_share = share_with_contour_ink(above.tif, sample.in_woods);
  CHECK(above_share > 0.95);

  // contours.order 5, below the landcover layer's 10: the woods' fill covers them.
  const Rendered below = render_demo(
      below_dir, [&](std::string s) { return with_contours_order(sparse_figures(s), 5); });
  const double below_share = share_with_contour_ink(below.tif, sample.in_woods);
  CHECK(below_share < 0.05);
}

// The sequence itself: relief and contours after every layer of a lower or equal order.
TEST_CASE("relief and contours take their places among the layers", "[render][draw-order]") {
  style::Layer fills, water, lines, names;
  fills.order = 10;
  water.order = 20;
  lines.order = 25;
  names.order = 90;
  const std::vector<const style::Layer*> layers{&fills, &water, &lines, &names};
  using K = render::DrawStep::Kind;
  auto kinds = [&](int relief, int contours) {
    std::vector<std::pair<K, std::size_t>> out;
    for (const auto& s : render::draw_sequence(layers, relief, contours))
      out.push_back({s.kind, s.kind == K::layer ? s.layer : 99});
    return out;
  };
  using V = std::vector<std::pair<K, std::size_t>>;
  CHECK(kinds(15, 22) == V{{K::layer, 0},
                           {K::relief, 99},
                           {K::layer, 1},
                           {K::contours, 99},
                           {K::layer, 2},
                           {K::layer, 3}});
  // Ties: after the layers of that order, relief before contours.
  CHECK(kinds(10, 10) == V{{K::layer, 0},
                           {K::relief, 99},
                           {K::contours, 99},
                           {K::layer, 1},
                           {K::layer, 2},
                           {K::layer, 3}});
  // Both under everything, or contours over every layer.
  CHECK(kinds(0, 100) == V{{K::relief, 99},
                           {K::layer, 0},
                           {K::layer, 1},
                           {K::layer, 2},
                           {K::layer, 3},
                           {K::contours, 99}});
}

// A style with no order numbers at all: the field style with every `order:` line removed. Its
// layers take their kinds' places (docs/style.md, layers), so the sheet still gets the usual
// stack (common practice: area fills, relief, water areas, contours, water lines, transport,
// buildings, names), not relief and contours over everything as when every layer was 0.
TEST_CASE("a style without order numbers gets the usual stack by layer kind",
          "[render][draw-order]") {
  std::string text = test::read_text(test::source_dir() / "styles/field.yaml");
  text = std::regex_replace(text, std::regex(R"(\n +order: [0-9]+[^\n]*)"), "");
  REQUIRE(text.find("order:") == std::string::npos);
  test::TempDir dir("order-none");
  test::write_text(dir / "style.yaml", text);
  const style::Style style = style::load_style(dir / "style.yaml");
  std::vector<const style::Layer*> layers;
  for (const auto& l : style.layers) layers.push_back(&l);
  std::vector<std::string> seq;
  for (const auto& s : render::draw_sequence(layers, style.relief.order, style.contours.order))
    seq.push_back(s.kind == render::DrawStep::Kind::relief     ? "relief"
                  : s.kind == render::DrawStep::Kind::contours ? "contours"
                                                               : layers[s.layer]->id);
  // The field style's own numbers give this sequence too (power lines join transport at 50:
  // a line layer; tracks and roads keep their file order).
  const std::vector<std::string> expected{
      "landcover", "relief",      "water_areas", "contours",       "water_lines", "tracks", "roads",
      "railways",  "power_lines", "buildings",   "control_points", "summits",     "places"};
  CHECK(seq == expected);
}
