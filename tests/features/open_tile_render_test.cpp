// The GB open topographic tile (Debian's libplplot-data, Open Government Licence) rendered with
// the field style through the feature-layer loop: every mapped layer draws, names are placed,
// and the PDF's text (read back with poppler's pdftotext -bbox) shows no two labels overlapping.

#include <ogr_spatialref.h>

#include <catch2/catch.hpp>
#include <fstream>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "sheetmill/render/feature_layers.hpp"
#include "sheetmill/style/style.hpp"
#include "support/crs.hpp"
#include "support/pdf_words.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

const std::string kDir = "usr/share/plplot5.15.0/ss/";

// An OGR VRT exposing a tile layer under the field style's attribute names (SQLite dialect SQL).
void write_vrt(const std::filesystem::path& file, const std::string& shp,
               const std::string& select) {
  auto src = test::open_data("libplplot-data", kDir + "ss64ne_" + shp + ".shp");
  std::ofstream out(file);
  out << "<OGRVRTDataSource><OGRVRTLayer name=\"l\"><SrcDataSource>" << src.string()
      << "</SrcDataSource><SrcSQL dialect=\"sqlite\">SELECT " << select << ", GEOMETRY FROM ss64ne_"
      << shp << "</SrcSQL><LayerSRS>EPSG:27700</LayerSRS></OGRVRTLayer></OGRVRTDataSource>\n";
}

bool overlap(const Box& a, const Box& b, double shrink) {
  return a.expanded(-shrink).intersects(b.expanded(-shrink));
}

}  // namespace

TEST_CASE("the open tile renders with the field style: layers drawn, names placed apart",
          "[features]") {
  if (!std::filesystem::exists(
          test::open_data("libplplot-data", kDir + "ss64ne_Road_Centreline.shp"))) {
    WARN("open data absent (run scripts/fetch-test-data); skipping");
    return;
  }
  gdal_init();
  test::TempDir tmp("tile");
  const style::Style style = style::load_style(test::source_dir() / "styles" / "field.yaml");

  // The tile's attributes mapped onto the names the field style filters on.
  write_vrt(tmp / "roads.vrt", "Road_Centreline",
            "CASE WHEN FeatDesc LIKE 'A Road%' THEN 'main' WHEN FeatDesc LIKE 'Minor Road%' THEN "
            "'secondary' ELSE 'minor' END AS class, COALESCE(roadnumber, roadname) AS ref");
  write_vrt(tmp / "water_areas.vrt", "Water_Area",
            "CASE WHEN FeatDesc = 'Sea polygon' THEN 'Sea' END AS name");
  write_vrt(tmp / "water_lines.vrt", "Water_Line",
            "CASE WHEN FeatDesc = 'Water Feature' THEN 'stream' ELSE 'river' END AS kind");
  write_vrt(tmp / "buildings.vrt", "Building_Area", "'house' AS kind");
  write_vrt(tmp / "landcover.vrt", "Landform_Area",
            "CASE WHEN FeatDesc LIKE '%woodland%' THEN 'wood' WHEN FeatDesc = 'Marsh' THEN 'marsh' "
            "WHEN FeatDesc LIKE 'Heathland%' THEN 'scrub' END AS kind");
  write_vrt(tmp / "places.vrt", "General_Text",
            "textstring AS name, CASE WHEN FeatDesc = 'Miscellaneous name' THEN 'hamlet' ELSE "
            "'locality' END AS kind");
  project::Project project;
  project.scale = 25000;
  for (const char* name :
       {"roads", "water_areas", "water_lines", "buildings", "landcover", "places"})
    project.sources[name] = {name, (tmp / (std::string(name) + ".vrt")).string(), "", "", true};

  MapFrame frame;
  frame.crs_wkt = test::wkt_of_epsg(27700);
  frame.epsg = 27700;
  frame.scale_denominator = 25000;
  frame.ground = Box::of(265000, 145000, 270000, 150000);  // 200 x 200 mm at 1:25 000
  frame.page_origin_mm = {10, 10};

  text::FontCache fonts;
  render::PreparedLayers prepared;
  auto result = render::prepare_feature_layers(project, style, frame, fonts, prepared);

  std::map<std::string, long> features;
  for (const auto& r : result.reports) features[r.layer] = r.features;
  for (const char* id :
       {"roads", "water_areas", "water_lines", "buildings", "landcover", "places"}) {
    INFO(id);
    CHECK(features[id] > 0);
  }
  // Every layer puts ink on paper: each drawn alone onto a white image (4 px per mm).
  for (const auto& layer : prepared.layers) {
    CairoSurfacePtr img(cairo_image_surface_create(CAIRO_FORMAT_RGB24, 880, 880));
    CairoPtr cr(cairo_create(img.get()));
    cairo_set_source_rgb(cr.get(), 1, 1, 1);
    cairo_paint(cr.get());
    cairo_scale(cr.get(), 4, 4);
    render::draw_prepared_layer(cr.get(), layer, prepared.clip_page_mm);
    cairo_surface_flush(img.get());
    const unsigned char* px = cairo_image_surface_get_data(img.get());
    const int stride = cairo_image_surface_get_stride(img.get());
    long inked = 0;
    for (int y = 0; y < 880; ++y)
      for (int x = 0; x < 880; ++x)
        inked +=
            (*reinterpret_cast<const uint32_t*>(px + y * stride + 4 * x) & 0xffffff) != 0xffffff;
    INFO(layer.layer->id);
    if (layer.layer->id != "places") CHECK(inked > 100);  // places carry names only
  }
  CHECK(!result.legend_rules.empty());
  CHECK(!result.obstacles.empty());  // roads and buildings block labels in the field style

  text::CollisionIndex index(Box::of(0, 0, 220, 220));
  index.set_bounds(frame.page_box_mm());
  index.insert_all(result.obstacles);
  auto counts = labels::place(result.name_candidates, index);
  long placed = 0;
  for (const auto& [layer, c] : counts) placed += c.placed;
  CHECK(counts["places"].placed > 20);
  CHECK(counts["roads"].placed > 0);

  // Names keep off the symbols of layers that block labels: no chosen (droppable) name footprint
  // overlaps a small area of such a layer (the field style's buildings).
  long small_areas = 0, obstacle_overlaps = 0;
  for (const auto& layer : prepared.layers) {
    if (!layer.layer->obstacle) continue;
    for (const auto& rule : layer.rules) {
      for (const auto& area : rule.areas) {
        Box b;
        for (const Point& p : area.front()) b.add(p);
        if (b.width() > 10 || b.height() > 10) continue;
        ++small_areas;
        const text::Quad q = text::box_quad(b);
        for (const auto& c : result.name_candidates) {
          if (!c.chosen || !c.may_drop) continue;
          for (const auto& f : c.placements[*c.chosen].footprint)
            obstacle_overlaps += text::quads_overlap(f, q);
        }
      }
    }
  }
  CHECK(small_areas > 0);
  CHECK(obstacle_overlaps == 0);

  pdf::LayeredCanvas canvas(220, 220);
  render::draw_feature_layers(canvas, prepared, style);
  labels::draw_placed(canvas.begin_group("names"), result.name_candidates);
  canvas.end_group();
  pdf::GeoRegistration geo;
  geo.frame_page_mm = frame.page_box_mm();
  const Box& g = frame.ground;
  geo.neatline_ground = {
      {g.min_x, g.min_y}, {g.max_x, g.min_y}, {g.max_x, g.max_y}, {g.min_x, g.max_y}};
  for (const Point& p : geo.neatline_ground) geo.neatline_page_mm.push_back(frame.to_page(p));
  geo.crs_wkt = frame.crs_wkt;
  geo.epsg = 27700;
  canvas.finish_pdf(tmp / "tile.pdf", geo, {});

  // No two words on the tile's page overlap: every word poppler reads, in content order (the
  // letters of a curved name, one string per glyph, count as one word).
  {
    const auto overlaps = test::overlapping_words(test::pdf_words(tmp / "tile.pdf", true));
    for (const auto& [a, b] : overlaps)
      UNSCOPED_INFO("'" << a.text << "' at " << a.box_mm().min_x << ", " << a.box_mm().min_y
                        << " mm overlaps '" << b.text << "' at " << b.box_mm().min_x << ", "
                        << b.box_mm().min_y << " mm");
    CHECK(overlaps.empty());
  }

  // The PDF shows the bottom layer too: poppler's raster of the page holds the wood fill
  // (#c3e3ad in the field style) over a good part of the tile's woods.
  {
    auto r = test::run_command({"pdftoppm", "-r", "50", "-png", "-singlefile",
                                (tmp / "tile.pdf").string(), (tmp / "tile").string()});
    REQUIRE(r.exit_code == 0);
    CairoSurfacePtr img(cairo_image_surface_create_from_png((tmp / "tile.png").c_str()));
    REQUIRE(cairo_surface_status(img.get()) == CAIRO_STATUS_SUCCESS);
    const int w = cairo_image_surface_get_width(img.get());
    const int h = cairo_image_surface_get_height(img.get());
    const int stride = cairo_image_surface_get_stride(img.get());
    const unsigned char* px = cairo_image_surface_get_data(img.get());
    long wood = 0;
    for (int y = 0; y < h; ++y)
      for (int x = 0; x < w; ++x) {
        uint32_t v = *reinterpret_cast<const uint32_t*>(px + y * stride + 4 * x);
        int rr = (v >> 16) & 0xff, gg = (v >> 8) & 0xff, bb = v & 0xff;
        wood += std::abs(rr - 0xc3) < 8 && std::abs(gg - 0xe3) < 8 && std::abs(bb - 0xad) < 8;
      }
    CHECK(wood > 500);  // about 2 % of the page's 190 000 pixels
  }

  // Read the labels back from the PDF. Horizontal labels (point and area names) have exact
  // boxes in pdftotext's output; curved ones are split into rotated glyphs whose axis-aligned
  // boxes overlap their neighbours, so those are checked by their exact glyph quads instead.
  std::vector<test::PdfWord> words = test::pdf_words(tmp / "tile.pdf");
  REQUIRE(words.size() >= static_cast<std::size_t>(counts["places"].placed));
  std::vector<std::pair<Box, std::size_t>> horizontal;  // word box, owning candidate
  for (const test::PdfWord& w : words) {
    for (std::size_t i = 0; i < result.name_candidates.size(); ++i) {
      const auto& c = result.name_candidates[i];
      if (!c.chosen) continue;
      const auto& fp = c.placements[*c.chosen].footprint;
      if (fp.size() != 1) continue;
      Box b;
      for (const Point& p : fp[0]) b.add(p);
      if (b.expanded(0.3).contains(w.box_mm().centre())) {
        horizontal.push_back({w.box_mm(), i});
        break;
      }
    }
  }
  CHECK(horizontal.size() > 20);
  long overlaps = 0;
  for (std::size_t a = 0; a < horizontal.size(); ++a)
    for (std::size_t b = a + 1; b < horizontal.size(); ++b)
      // 0.1 mm allowance: pdftotext's boxes come from font metrics, not ink.
      if (horizontal[a].second != horizontal[b].second &&
          overlap(horizontal[a].first, horizontal[b].first, 0.1))
        ++overlaps;
  CHECK(overlaps == 0);
  // Every chosen footprint (curved labels included) is free of every other candidate's.
  std::vector<const std::vector<text::Quad>*> chosen;
  for (const auto& c : result.name_candidates)
    if (c.chosen && c.may_drop) chosen.push_back(&c.placements[*c.chosen].footprint);
  long quad_overlaps = 0;
  for (std::size_t a = 0; a < chosen.size(); ++a)
    for (std::size_t b = a + 1; b < chosen.size(); ++b)
      for (const auto& qa : *chosen[a])
        for (const auto& qb : *chosen[b]) quad_overlaps += text::quads_overlap(qa, qb);
  CHECK(quad_overlaps == 0);
  INFO("labels placed: " << placed);
}
