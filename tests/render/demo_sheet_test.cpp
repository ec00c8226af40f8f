// The demo sheet end to end, read back with poppler (pdfinfo, pdffonts, pdftotext) and GDAL.
#include <gdal_priv.h>
#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <regex>
#include <set>

#include "render/render_support.hpp"
#include "sheetmill/core/gdal_env.hpp"

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
