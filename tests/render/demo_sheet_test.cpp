// The demo sheet end to end, read back with poppler (pdfinfo, pdffonts, pdftotext) and GDAL.
#include <gdal_priv.h>
#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <map>
#include <optional>
#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4  // qpdf 11: std::shared_ptr, no deprecation warning
#endif
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFObjectHandle.hh>
#include <qpdf/QPDFPageDocumentHelper.hh>
#include <qpdf/QPDFPageObjectHelper.hh>
#include <regex>
#include <set>
#include <sstream>

#include "render/render_support.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/units.hpp"
#include "support/pdf_words.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

// Rendered once for all checks in this file.
const fs::path& demo_pdf() {
  static test::TempDir dir("demo-sheet");
  static fs::path pdf;
  if (pdf.empty()) {
    auto project = test::write_demo_project(dir);
    auto r = test::run_sheetmill({"render", project.string(), "-o", (dir / "sheet.pdf").string()});
    INFO(r.err);
    REQUIRE(r.exit_code == 0);
    pdf = dir / "sheet.pdf";
  }
  return pdf;
}

double page_size_pt(const std::string& pdfinfo, int which) {
  std::smatch m;
  REQUIRE(std::regex_search(pdfinfo, m, std::regex(R"(Page size:\s+([0-9.]+) x ([0-9.]+) pts)")));
  return std::stod(m[which].str());
}

}  // namespace

TEST_CASE("the demo sheet has the project's paper size", "[render]") {
  auto info = test::run_command({"pdfinfo", demo_pdf().string()});
  REQUIRE(info.exit_code == 0);
  // demo_area/project.yaml: A2 landscape, 594 x 420 mm (ISO 216). 1 pt = 25.4/72 mm.
  CHECK(std::abs(page_size_pt(info.out, 1) * 25.4 / 72 - 594) < 0.5);
  CHECK(std::abs(page_size_pt(info.out, 2) * 25.4 / 72 - 420) < 0.5);
  CHECK(std::regex_search(info.out, std::regex(R"(Pages:\s+1\n)")));
}

TEST_CASE("the demo sheet embeds every font it uses", "[render]") {
  auto fonts = test::run_command({"pdffonts", demo_pdf().string()});
  REQUIRE(fonts.exit_code == 0);
  std::istringstream lines(fonts.out);
  std::string line;
  int font_lines = 0;
  while (std::getline(lines, line)) {
    if (line.rfind("name", 0) == 0 || line.rfind("----", 0) == 0 || line.empty()) continue;
    ++font_lines;
    // Columns: name type encoding emb sub uni object ID. A subset font's name has a 6-letter tag.
    INFO(line);
    CHECK(std::regex_search(line, std::regex(R"(^[A-Z]{6}\+\S+ .* yes\s+yes\s+yes)")));
  }
  CHECK(font_lines > 0);
}

TEST_CASE("the demo sheet's collar is text and paths, its only images the relief", "[render]") {
  // Cairo's PDF writer paints what it cannot express as vectors into fallback images; text in
  // such an image is lost to pdftotext, search and copying. The collar words come from
  // styles/field.yaml (legend entries) and the sheet's own furniture.
  auto txt = test::run_command({"pdftotext", "-raw", demo_pdf().string(), "-"});
  REQUIRE(txt.exit_code == 0);
  for (const char* word : {"Legend", "Wood", "Orchard", "Marsh", "Scrub", "Lake, pond", "Main road",
                           "Contour interval", "not a survey"}) {
    INFO(word);
    CHECK(txt.out.find(word) != std::string::npos);
  }
  // pdfimages -list: two header lines, then one line per image or soft mask. The relief is
  // the only raster the sheet draws, with a smoothing filter, which Cairo writes as
  // /Interpolate true (column "interp" yes); its fallback images are never interpolated.
  auto list = test::run_command({"pdfimages", "-list", demo_pdf().string()});
  REQUIRE(list.exit_code == 0);
  std::istringstream lines(list.out);
  std::string line;
  int images = 0;
  for (int i = 0; std::getline(lines, line); ++i) {
    if (i < 2 || line.empty()) continue;
    ++images;
    INFO(line);
    CHECK(std::regex_search(
        line, std::regex(
                  R"(^\s*\d+\s+\d+\s+(image|smask)\s+\d+\s+\d+\s+\w+\s+\d+\s+\d+\s+\w+\s+yes\s)")));
  }
  CHECK(images > 0);  // the relief itself
}

TEST_CASE("village names and index contour values are real text on the demo sheet", "[render]") {
  auto txt = test::run_command({"pdftotext", "-raw", demo_pdf().string(), "-"});
  REQUIRE(txt.exit_code == 0);
  // The names come from the data, not from this test: every village inside the map frame.
  gdal_init();
  auto area = test::demo_area();
  DatasetPtr ds(GDALDataset::Open((area / "features.gpkg").c_str(), GDAL_OF_VECTOR));
  REQUIRE(ds);
  OGRLayer* places = ds->GetLayerByName("places");
  REQUIRE(places);
  places->SetAttributeFilter("kind = 'village'");
  // The map frame as GDAL's PDF driver reads it back from the geospatial viewport (NEATLINE),
  // shrunk by 500 m so a name near the edge may still be dropped for lack of room.
  DatasetPtr pdf(GDALDataset::Open(demo_pdf().c_str(), GDAL_OF_RASTER));
  REQUIRE(pdf);
  const char* neatline = pdf->GetMetadataItem("NEATLINE");
  REQUIRE(neatline);
  OGRGeometry* frame = nullptr;
  REQUIRE(OGRGeometryFactory::createFromWkt(neatline, nullptr, &frame) == OGRERR_NONE);
  OGREnvelope env;
  frame->getEnvelope(&env);
  OGRGeometryFactory::destroyGeometry(frame);
  places->SetSpatialFilterRect(env.MinX + 500, env.MinY + 500, env.MaxX - 500, env.MaxY - 500);
  int villages = 0;
  for (auto& f : *places) {
    std::string name = f->GetFieldAsString("name");
    INFO("village " << name);
    CHECK(txt.out.find(name) != std::string::npos);
    ++villages;
  }
  CHECK(villages >= 1);
  // Index contours every 5 x 10 m: some multiple of 50 m is printed as a label.
  std::smatch m;
  std::set<int> index_values;
  std::string rest = txt.out;
  std::regex number(R"(\b([1-9][0-9]{2,3})\b)");
  for (std::sregex_iterator it(rest.begin(), rest.end(), number), end; it != end; ++it) {
    int v = std::stoi((*it)[1].str());
    if (v % 50 == 0) index_values.insert(v);
  }
  CHECK(index_values.size() >= 3);
}

TEST_CASE("the same sheet exported as GeoTIFF is georeferenced at the chosen dpi", "[render]") {
  test::TempDir dir;
  auto project = test::write_demo_project(dir);
  auto tif = dir / "sheet.tif";
  auto r = test::run_sheetmill(
      {"--quiet", "render", project.string(), "-o", tif.string(), "--dpi", "100"});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  gdal_init();
  DatasetPtr ds(GDALDataset::Open(tif.c_str(), GDAL_OF_RASTER));
  REQUIRE(ds);
  double gt[6];
  REQUIRE(ds->GetGeoTransform(gt) == CE_None);
  // At 1:25 000 a pixel of 1/100 in on paper is 25 000 x 0.254 mm = 6.35 m on the ground.
  CHECK(gt[1] == Approx(6.35).epsilon(0.001));
  CHECK(-gt[5] == Approx(6.35).epsilon(0.001));
  const OGRSpatialReference* srs = ds->GetSpatialRef();
  REQUIRE(srs);
  CHECK(std::string(srs->GetAuthorityCode(nullptr)) == "32632");
  // A2 landscape at 100 dpi: 594 mm x 420 mm -> 2339 x 1654 pixels.
  CHECK(std::abs(ds->GetRasterXSize() - 2339) <= 1);
  CHECK(std::abs(ds->GetRasterYSize() - 1654) <= 1);
}

namespace {

// x' = a x + c y + e, y' = b x + d y + f: a PDF matrix [a b c d e f].
struct Affine {
  double a = 1, b = 0, c = 0, d = 1, e = 0, f = 0;
};
// `m` applied first, then `n` (PDF's "m x n").
Affine then(const Affine& m, const Affine& n) {
  return {m.a * n.a + m.b * n.c, m.a * n.b + m.b * n.d,       m.c * n.a + m.d * n.c,
          m.c * n.b + m.d * n.d, m.e * n.a + m.f * n.c + n.e, m.e * n.b + m.f * n.d + n.f};
}
Affine affine_of(std::vector<QPDFObjectHandle> v) {
  return {v[0].getNumericValue(), v[1].getNumericValue(), v[2].getNumericValue(),
          v[3].getNumericValue(), v[4].getNumericValue(), v[5].getNumericValue()};
}

// Walks a content stream with qpdf: the graphics state stack (q, Q, cm), the text matrices
// (each Tm times the current transformation, in page space), form XObjects (Do) with their own
// /Matrix, and which optional content group each drawing belongs to (BDC /OC /name ... EMC).
struct ContentWalker : QPDFObjectHandle::ParserCallbacks {
  QPDFObjectHandle resources;
  std::vector<Affine> ctm{Affine{}};
  std::vector<QPDFObjectHandle> operands;
  std::vector<std::string> groups;  // open marked-content groups (OCG names)
  std::map<std::string, std::string> oc_names;
  std::vector<std::pair<std::string, Affine>>* text = nullptr;  // (group, text matrix)

  void handleObject(QPDFObjectHandle o) override {
    if (!o.isOperator()) {
      operands.push_back(o);
      return;
    }
    const std::string op = o.getOperatorValue();
    if (op == "q") {
      ctm.push_back(ctm.back());
    } else if (op == "Q") {
      if (ctm.size() > 1) ctm.pop_back();
    } else if (op == "cm" && operands.size() == 6) {
      ctm.back() = then(affine_of(operands), ctm.back());
    } else if (op == "Tm" && operands.size() == 6) {
      text->push_back({groups.empty() ? "" : groups.back(), then(affine_of(operands), ctm.back())});
    } else if (op == "BDC" && operands.size() == 2 && operands[1].isName()) {
      groups.push_back(oc_names[operands[1].getName()]);
    } else if (op == "BMC") {
      groups.push_back(groups.empty() ? "" : groups.back());
    } else if (op == "EMC") {
      if (!groups.empty()) groups.pop_back();
    } else if (op == "Do" && operands.size() == 1) {
      QPDFObjectHandle xobjects = resources.getKey("/XObject");
      QPDFObjectHandle form = xobjects.isDictionary() ? xobjects.getKey(operands[0].getName())
                                                      : QPDFObjectHandle::newNull();
      if (form.isStream() && form.getDict().getKey("/Subtype").getName() == "/Form") {
        ContentWalker inner;
        inner.resources = form.getDict().getKey("/Resources");
        Affine m;
        QPDFObjectHandle mat = form.getDict().getKey("/Matrix");
        if (mat.isArray() && mat.getArrayNItems() == 6) m = affine_of(mat.getArrayAsVector());
        inner.ctm = {then(m, ctm.back())};
        inner.groups = groups;
        inner.oc_names = oc_names;
        inner.text = text;
        QPDFObjectHandle::parseContentStream(form, &inner);
      }
    }
    operands.clear();
  }
  void handleEOF() override {}
};

}  // namespace

// Contour labels read back from the PDF itself: poppler's pdftotext -bbox gives each value and
// where it is, qpdf's content parser gives the orientation of the text, GDAL's PDF driver gives
// the page's georeferencing, and GDAL reads the DEM for the gradient. For every label the
// direction from baseline to the tops of the figures points uphill (common practice), and no two
// labels' boxes overlap.
TEST_CASE("contour labels in the demo PDF face uphill and keep apart", "[render]") {
  QPDF pdf;
  pdf.processFile(demo_pdf().c_str());
  auto pages = QPDFPageDocumentHelper(pdf).getAllPages();
  REQUIRE(pages.size() == 1);
  QPDFObjectHandle page = pages[0].getObjectHandle();
  ContentWalker walker;
  walker.resources = page.getKey("/Resources");
  for (auto [key, ocg] : walker.resources.getKey("/Properties").ditems())
    if (ocg.isDictionary() && ocg.getKey("/Name").isString())
      walker.oc_names[key] = ocg.getKey("/Name").getUTF8Value();
  std::vector<std::pair<std::string, Affine>> runs;
  walker.text = &runs;
  pages[0].parseContents(&walker);
  const double page_h_pt = page.getKey("/MediaBox").getArrayItem(3).getNumericValue();
  const double page_w_pt = page.getKey("/MediaBox").getArrayItem(2).getNumericValue();

  // Page points to ground through the georeferencing GDAL reads from the PDF.
  gdal_init();
  DatasetPtr geo(GDALDataset::Open(demo_pdf().c_str(), GDAL_OF_RASTER));
  REQUIRE(geo);
  double gt[6];
  REQUIRE(geo->GetGeoTransform(gt) == CE_None);
  const double px_per_pt = geo->GetRasterXSize() / page_w_pt;
  auto ground_of = [&](double x_pt, double y_down_pt) {
    double px = x_pt * px_per_pt, py = y_down_pt * px_per_pt;
    return Point{gt[0] + px * gt[1] + py * gt[2], gt[3] + px * gt[4] + py * gt[5]};
  };
  // The DEM read with GDAL: the mean over 5 x 5 cells (25 m) around a ground point.
  DatasetPtr dem(GDALDataset::Open((test::demo_area() / "dem.tif").c_str(), GDAL_OF_RASTER));
  REQUIRE(dem);
  double dgt[6];
  REQUIRE(dem->GetGeoTransform(dgt) == CE_None);
  auto height_at = [&](Point g) -> std::optional<double> {
    int c = static_cast<int>((g.x - dgt[0]) / dgt[1]),
        r = static_cast<int>((g.y - dgt[3]) / dgt[5]);
    if (c < 2 || r < 2 || c + 3 > dem->GetRasterXSize() || r + 3 > dem->GetRasterYSize())
      return std::nullopt;
    float z[25];
    if (dem->GetRasterBand(1)->RasterIO(GF_Read, c - 2, r - 2, 5, 5, z, 5, 5, GDT_Float32, 0, 0,
                                        nullptr) != CE_None)
      return std::nullopt;
    double sum = 0;
    for (float v : z) sum += v;
    return sum / 25;
  };

  // Rotated text in the contours group is a contour value; spot heights there are set level
  // (an exactly axis-aligned matrix) and are not part of this check.
  auto is_label_run = [&](std::size_t k) {
    const auto& [group, t] = runs[k];
    return group == "contours" && !(t.b == 0 && t.c == 0);
  };
  // Poppler may split a rotated value into several words; each word of figures belongs to the
  // label run whose origin (start of the baseline) it lies nearest.
  struct Word {
    Box box_pt;
    std::size_t run;
  };
  std::vector<Word> found;
  int checked = 0;
  for (const test::PdfWord& w : test::pdf_words(demo_pdf())) {
    if (w.text.empty() || w.text.find_first_not_of("0123456789") != std::string::npos) continue;
    std::optional<std::size_t> best;
    double best_d = 1e300;
    for (std::size_t k = 0; k < runs.size(); ++k) {
      if (!is_label_run(k)) continue;
      Point origin{runs[k].second.e, page_h_pt - runs[k].second.f};
      double d = distance(origin, w.box_pt.centre());
      if (w.box_pt.expanded(12.0).contains(origin) && d < best_d) best = k, best_d = d;
    }
    if (best) found.push_back({w.box_pt, *best});
  }
  for (std::size_t k = 0; k < runs.size(); ++k) {
    if (!is_label_run(k)) continue;
    const Affine& t = runs[k].second;
    // The middle of the figures: from the start of the baseline, about 0.85 em along it (three
    // digits) and 0.35 em up (half the figure height); the font size is the matrix's scale.
    const double em = std::hypot(t.a, t.b);
    const Point along{t.a / em, t.b / em}, up{t.c / em, t.d / em};
    const Point mid = Point{t.e, t.f} + along * (0.85 * em) + up * (0.35 * em);
    Point g = ground_of(mid.x, page_h_pt - mid.y);
    INFO("label run at " << t.e << ", " << page_h_pt - t.f << " pt, ground " << std::fixed << g.x
                         << ", " << g.y << "; up " << t.c << ", " << t.d);
    // Uphill, read off the DEM across the line at the label: the ground 0.4 mm of paper (10 m)
    // towards the tops of the figures against the ground as far the other way, each the mean
    // of 5 x 5 cells: the DEM's gradient at the label, as the issue defines the check. Farther
    // out the demo's rough ground may turn (a ridge 20 m wide beside a contour). Where the two
    // differ by less than 0.5 m the ground is flat there (valley floors): nothing to face.
    // North is up on this sheet (the geotransform has no rotation), so page up is north.
    REQUIRE(gt[2] == 0);
    const double reach_pt = 0.4 / kMmPerPt;
    auto top = height_at(ground_of(mid.x + up.x * reach_pt, page_h_pt - (mid.y + up.y * reach_pt)));
    auto foot =
        height_at(ground_of(mid.x - up.x * reach_pt, page_h_pt - (mid.y - up.y * reach_pt)));
    if (!top || !foot || std::abs(*top - *foot) < 0.5) continue;
    INFO("ground towards the tops " << *top << " m, towards the feet " << *foot << " m");
    CHECK(*top > *foot);
    ++checked;
  }
  CHECK(checked >= 20);
  // Poppler found the figures of the label runs as text.
  std::set<std::size_t> with_words;
  for (const auto& w : found) with_words.insert(w.run);
  CHECK(with_words.size() >= static_cast<std::size_t>(checked) * 9 / 10);
  // No two labels' boxes overlap: words of different labels, each box as poppler reports it
  // shrunk by a quarter point for rounding. (For rotated figures poppler's boxes are upright
  // and larger than the figures, so this is the stricter test.)
  int overlaps = 0;
  for (std::size_t i = 0; i < found.size(); ++i)
    for (std::size_t j = i + 1; j < found.size(); ++j)
      if (found[i].run != found[j].run)
        overlaps += found[i].box_pt.expanded(-0.25).intersects(found[j].box_pt.expanded(-0.25));
  CHECK(overlaps == 0);
}

// A DEM whose values are feet (the band's unit type says so): the sheet shows its contour
// interval and heights in feet (on A3: an A4 sheet at this scale has no room for the notes).
TEST_CASE("a DEM in feet gives a sheet in feet", "[render]") {
  test::TempDir dir("feet-sheet");
  gdal_init();
  // The demo DEM's middle 6 x 4 km, in feet, written with GDAL.
  DatasetPtr src(GDALDataset::Open((test::demo_area() / "dem.tif").c_str(), GDAL_OF_RASTER));
  REQUIRE(src);
  double gt[6];
  REQUIRE(src->GetGeoTransform(gt) == CE_None);
  const int c0 = 1400, r0 = 1100, w = 1200, h = 800;  // 5 m cells
  std::vector<float> z(static_cast<std::size_t>(w) * h);
  REQUIRE(src->GetRasterBand(1)->RasterIO(GF_Read, c0, r0, w, h, z.data(), w, h, GDT_Float32, 0, 0,
                                          nullptr) == CE_None);
  for (float& v : z) v = static_cast<float>(v / kMetresPerFoot);
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GTiff");
  fs::path feet = dir / "feet.tif";
  {
    DatasetPtr out(drv->Create(feet.c_str(), w, h, 1, GDT_Float32, nullptr));
    double ogt[6] = {gt[0] + c0 * gt[1], gt[1], 0, gt[3] + r0 * gt[5], 0, gt[5]};
    out->SetGeoTransform(ogt);
    out->SetSpatialRef(src->GetSpatialRef());
    out->GetRasterBand(1)->SetUnitType("ft");
    REQUIRE(out->GetRasterBand(1)->RasterIO(GF_Write, 0, 0, w, h, z.data(), w, h, GDT_Float32, 0, 0,
                                            nullptr) == CE_None);
  }
  std::string text = test::read_text(test::source_dir() / "demo_area" / "project.yaml");
  text = std::regex_replace(text, std::regex("generated/dem.tif"), feet.string());
  text = std::regex_replace(text, std::regex("generated/"), test::demo_area().string() + "/");
  text = std::regex_replace(text, std::regex("\\.\\./styles/"),
                            (test::source_dir() / "styles").string() + "/");
  text = std::regex_replace(text, std::regex("size: A2"), "size: A3");
  text = std::regex_replace(text, std::regex("interval: 10m"), "interval: 20ft");
  test::write_text(dir / "project.yaml", text);
  auto r = test::run_sheetmill(
      {"render", (dir / "project.yaml").string(), "-o", (dir / "sheet.pdf").string()});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  auto txt = test::run_command({"pdftotext", "-raw", (dir / "sheet.pdf").string(), "-"});
  REQUIRE(txt.exit_code == 0);
  CHECK(txt.out.find("Contour interval 20 ft.") != std::string::npos);
  CHECK(txt.out.find("Heights in feet above the demo datum") != std::string::npos);
  CHECK(txt.out.find("Contour interval 6.096") == std::string::npos);
}

TEST_CASE("no two words on the demo sheet overlap", "[render][overlap]") {
  // Every word on the page (map, grid and graticule values, collar), read back by poppler in
  // content order; the letters of a curved name (one string per glyph) count as one word.
  const auto words = test::pdf_words(demo_pdf(), true);
  REQUIRE(words.size() > 300);
  const auto overlaps = test::overlapping_words(words);
  for (const auto& [a, b] : overlaps)
    UNSCOPED_INFO("'" << a.text << "' at " << a.box_mm().min_x << ", " << a.box_mm().min_y
                      << " mm overlaps '" << b.text << "' at " << b.box_mm().min_x << ", "
                      << b.box_mm().min_y << " mm");
  CHECK(overlaps.empty());
}
