// A tile index is data from elsewhere: one bad feature must be named, by its ID shown escaped,
// and never poison its neighbours or reach the terminal raw. The escapes follow common
// practice for showing untrusted text (C-style \xHH and \u{HHHH}); the unsafe code points are
// Unicode's own (UAX #9 explicit directional formatting characters, U+202A-202E, U+2066-2069).
#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <functional>

#include "sheetmill/batch/output_name.hpp"
#include "sheetmill/batch/tile_index_io.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/utf8.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

struct Feature {
  std::string id;
  double nan_x = 0;  // added to one vertex: NaN poisons it
};

// A GeoPackage tile index of unit squares side by side, written with OGR directly.
std::string write_index(const test::TempDir& dir, const std::vector<Feature>& features) {
  gdal_init();
  std::string path = (dir / "index.gpkg").string();
  GDALDriver* driver = GetGDALDriverManager()->GetDriverByName("GPKG");
  DatasetPtr ds(driver->Create(path.c_str(), 0, 0, 0, GDT_Unknown, nullptr));
  OGRLayer* layer = ds->CreateLayer("sheets", nullptr, wkbPolygon, nullptr);
  OGRFieldDefn id("sheet_id", OFTString), name("name", OFTString);
  layer->CreateField(&id);
  layer->CreateField(&name);
  for (std::size_t k = 0; k < features.size(); ++k) {
    FeaturePtr f(OGRFeature::CreateFeature(layer->GetLayerDefn()));
    f->SetField("sheet_id", features[k].id.c_str());
    f->SetField("name", "Sheet");
    OGRLinearRing ring;
    double x = static_cast<double>(k);
    ring.addPoint(x, 0);
    ring.addPoint(x + 1 + features[k].nan_x, 0);
    ring.addPoint(x + 1, 1);
    ring.addPoint(x, 1);
    ring.closeRings();
    OGRPolygon poly;
    poly.addRing(&ring);
    f->SetGeometry(&poly);
    REQUIRE(layer->CreateFeature(f.get()) == OGRERR_NONE);
  }
  return path;
}

std::string error_of(const std::function<void()>& f) {
  try {
    f();
  } catch (const Error& e) {
    CHECK(e.exit_code() == 2);
    std::string m = e.what();
    return m.substr(m.find("index.gpkg"));
  }
  return "(no error)";
}

}  // namespace

TEST_CASE("untrusted text is shown escaped, as the data holds it", "[batch][tile-index]") {
  CHECK(quote_untrusted("A01") == "\"A01\"");
  CHECK(quote_untrusted("a\"b\\c") == "\"a\\\"b\\\\c\"");
  CHECK(quote_untrusted("x\x1b[2Jy\n") == "\"x\\x1B[2Jy\\n\"");
  CHECK(quote_untrusted("\xff\xfe") == "\"\\xFF\\xFE\"");
  // U+202E RIGHT-TO-LEFT OVERRIDE (E2 80 AE in UTF-8) and a plain accented letter kept as is.
  CHECK(quote_untrusted("\xe2\x80\xae"
                        "10A") == "\"\\u{202E}10A\"");
  CHECK(quote_untrusted("Mühl") == "\"Mühl\"");
  CHECK(quote_untrusted(std::string(200, 'x'), 4) == "\"xxxx...\"");
}

TEST_CASE("a sheet ID that is not valid UTF-8 is refused naming its feature",
          "[batch][tile-index]") {
  test::TempDir dir("tile-index-utf8");
  std::string path = write_index(dir, {{"A1"}, {"B\xff\xfe"}, {"C1"}});
  CHECK(error_of([&] { batch::read_tile_index(path, "sheets", "sheet_id", "name"); }) ==
        "index.gpkg: feature 2: the sheet ID \"B\\xFF\\xFE\" is not valid UTF-8 (byte 2); fix the "
        "ID in the tile index");
  // A direction override is text: allowed in an ID (file names replace it), shown escaped.
  test::TempDir dir2("tile-index-bidi");
  path = write_index(dir2, {{"A1"},
                            {"\xe2\x80\xae"
                             "1A"}});
  CHECK(batch::read_tile_index(path, "sheets", "sheet_id", "name").sheets.size() == 2);
}

TEST_CASE("a footprint with a NaN vertex is refused by its ID, the others read",
          "[batch][tile-index]") {
  test::TempDir dir("tile-index-nan");
  std::string path = write_index(dir, {{"A1"}, {"A2", std::nan("")}, {"A3"}});
  CHECK(error_of([&] { batch::read_tile_index(path, "sheets", "sheet_id", "name"); }) ==
        "index.gpkg: feature 2: sheet \"A2\": the footprint has a vertex that is not a finite "
        "number (NaN or infinite); fix or remove that feature");
  test::TempDir dir2("tile-index-fine");
  path = write_index(dir2, {{"A1"}, {"A2"}, {"A3"}});
  CHECK(batch::read_tile_index(path, "sheets", "sheet_id", "name").sheets.size() == 3);
}

TEST_CASE("IDs that collide on one file name are both shown as the data holds them",
          "[batch][tile-index]") {
  // U+202E and a control character both become "_" in a file name.
  std::vector<batch::SheetJob> jobs(2);
  jobs[0].id = "\xe2\x80\xae";
  jobs[1].id = "\x07";
  for (auto& j : jobs) j.output = "/out" / batch::expand_output_name("{id}.pdf", j, "t");
  try {
    batch::check_unique_outputs(jobs, "index.gpkg");
    FAIL("expected a collision");
  } catch (const Error& e) {
    std::string m = e.what();
    CHECK(m.find("sheets \"\\u{202E}\" and \"\\x07\" would both be written to _.pdf") !=
          std::string::npos);
    CHECK(m.find('\x07') == std::string::npos);
    CHECK(m.find("\xe2\x80\xae") == std::string::npos);
  }
}
