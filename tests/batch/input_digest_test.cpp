#include "sheetmill/batch/input_digest.hpp"

#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <map>
#include <set>

#include "batch/fake_sheets.hpp"
#include "sheetmill/batch/index_plan.hpp"
#include "sheetmill/batch/output_name.hpp"
#include "sheetmill/batch/runner.hpp"
#include "sheetmill/batch/tile_index_io.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;
using namespace sheetmill::batch;

namespace {

// A point layer in UTM 33N with one feature per 1 km, written with GDAL.
void write_points(const fs::path& path, const std::vector<Point>& points) {
  gdal_init();
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GPKG");
  DatasetPtr ds(drv->Create(path.c_str(), 0, 0, 0, GDT_Unknown, nullptr));
  REQUIRE(ds);
  OGRSpatialReference srs;
  srs.importFromEPSG(32633);
  OGRLayer* layer = ds->CreateLayer("spots", &srs, wkbPoint, nullptr);
  OGRFieldDefn f("label", OFTString);
  layer->CreateField(&f);
  for (std::size_t i = 0; i < points.size(); ++i) {
    FeaturePtr feat(OGRFeature::CreateFeature(layer->GetLayerDefn()));
    feat->SetField("label", ("p" + std::to_string(i)).c_str());
    OGRPoint pt(points[i].x, points[i].y);
    feat->SetGeometry(&pt);
    REQUIRE(layer->CreateFeature(feat.get()) == OGRERR_NONE);
  }
}

// Changes one feature's attribute in place, with GDAL.
void relabel(const fs::path& path, long fid, const std::string& label) {
  DatasetPtr ds(GDALDataset::Open(path.c_str(), GDAL_OF_VECTOR | GDAL_OF_UPDATE));
  REQUIRE(ds);
  OGRLayer* layer = ds->GetLayerByName("spots");
  FeaturePtr f(layer->GetFeature(fid));
  REQUIRE(f);
  f->SetField("label", label.c_str());
  REQUIRE(layer->SetFeature(f.get()) == OGRERR_NONE);
}

}  // namespace

TEST_CASE("changing one feature re-renders only the sheets it falls on", "[batch]") {
  test::TempDir dir("digest");
  // A 4 x 3 grid of 4 x 3 km sheets (160 x 120 mm at 1:25 000) from our own index planner.
  IndexSpec spec;
  spec.crs = "EPSG:32633";
  spec.frame_width_mm = 160;
  spec.frame_height_mm = 120;
  spec.area = Box::of(500000, 5001000, 516000, 5010000);  // on the 4 x 3 km lattice
  write_tile_index(plan_tile_index(spec), dir / "tiles.gpkg", "sheets");
  TileIndexContent index =
      read_tile_index((dir / "tiles.gpkg").string(), "sheets", "sheet_id", "name");
  REQUIRE(index.sheets.size() == 12);
  fs::create_directories(dir / "out");
  for (auto& j : index.sheets) j.output = dir / "out" / expand_output_name("{id}.pdf", j, "t");

  // One point in the middle of each sheet, plus one exactly on the corner of four sheets.
  std::vector<Point> points;
  for (const auto& j : index.sheets) points.push_back(j.footprint.centre());
  points.push_back({504000, 5004000});
  write_points(dir / "spots.gpkg", points);
  test::write_text(dir / "project.yaml", "title: digest test\n");

  DigestInputs in;
  in.program_version = "test";
  in.files = {dir / "project.yaml"};
  in.vectors = {{"spots", (dir / "spots.gpkg").string(), "spots", "", true}};
  in.index_crs_wkt = index.crs_wkt;
  in.margin_m = 250;  // 10 mm at 1:25 000
  test::FakeRenderer fake;
  fake.log = dir / "renders.log";
  WorkerSetup setup = [in, fake] {
    auto digester = std::make_shared<InputDigester>(in);
    SheetTasks t;
    t.digest = [digester](const SheetJob& j) { return digester->digest(j); };
    t.render = fake;
    return t;
  };
  RunOptions options;
  options.workers = 2;
  options.progress = ProgressMode::none;
  REQUIRE(run_batch(index.sheets, setup, options).count(SheetStatus::rendered) == 12);
  REQUIRE(run_batch(index.sheets, setup, options).count(SheetStatus::up_to_date) == 12);

  // Expected from the geometry alone: the sheets whose footprint grown by the margin holds the
  // changed point (computed here with OGR's point-in-envelope, independently of the digester).
  auto expected_for = [&](Point p) {
    std::set<std::string> ids;
    for (const auto& j : index.sheets) {
      if (j.footprint.expanded(in.margin_m).contains(p)) ids.insert(j.id);
    }
    return ids;
  };
  auto rendered_after = [&](long fid, const std::string& label) {
    fs::remove(fake.log);
    relabel(dir / "spots.gpkg", fid, label);
    BatchResult r = run_batch(index.sheets, setup, options);
    std::vector<std::string> log = test::render_log(fake.log);
    CHECK(r.count(SheetStatus::rendered) == static_cast<int>(log.size()));
    return std::set<std::string>(log.begin(), log.end());
  };
  // GeoPackage FIDs start at 1 in insertion order: FID 6 is the centre point of sheet 6.
  std::set<std::string> one = rendered_after(6, "changed");
  CHECK(one == expected_for(points[5]));
  CHECK(one.size() == 1);
  // The corner point lies on four sheets.
  std::set<std::string> four = rendered_after(13, "moved label");
  CHECK(four == expected_for(points[12]));
  CHECK(four.size() == 4);
  // Nothing changed: nothing rendered.
  CHECK(rendered_after(13, "moved label").empty());
}

TEST_CASE("the DEM window under a sheet is part of its digest", "[batch]") {
  test::TempDir dir("digest");
  // A flat 2 x 1 km DEM at 10 m cells, written with GDAL; two sheets side by side on it.
  gdal_init();
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GTiff");
  fs::path dem = dir / "dem.tif";
  {
    DatasetPtr ds(drv->Create(dem.c_str(), 200, 100, 1, GDT_Float32, nullptr));
    double gt[6] = {500000, 10, 0, 5001000, 0, -10};
    ds->SetGeoTransform(gt);
    OGRSpatialReference srs;
    srs.importFromEPSG(32633);
    ds->SetSpatialRef(&srs);
    std::vector<float> v(200 * 100, 100.0f);
    REQUIRE(ds->GetRasterBand(1)->RasterIO(GF_Write, 0, 0, 200, 100, v.data(), 200, 100,
                                           GDT_Float32, 0, 0, nullptr) == CE_None);
  }
  OGRSpatialReference srs;
  srs.importFromEPSG(32633);
  char* wkt = nullptr;
  srs.exportToWkt(&wkt);
  DigestInputs in;
  in.dem_path = dem.string();
  in.index_crs_wkt = wkt;
  CPLFree(wkt);
  SheetJob west, east;
  west.id = "W";
  west.footprint = Box::of(500000, 5000000, 501000, 5001000);
  east.id = "E";
  east.footprint = Box::of(501000, 5000000, 502000, 5001000);
  std::string w0, e0;
  {
    InputDigester d(in);
    w0 = d.digest(west).hex;
    e0 = d.digest(east).hex;
  }
  {
    // Raise one cell near the east edge (column 190): only the east sheet's window holds it.
    DatasetPtr ds(GDALDataset::Open(dem.c_str(), GDAL_OF_RASTER | GDAL_OF_UPDATE));
    float v = 150.0f;
    REQUIRE(ds->GetRasterBand(1)->RasterIO(GF_Write, 190, 50, 1, 1, &v, 1, 1, GDT_Float32, 0, 0,
                                           nullptr) == CE_None);
  }
  InputDigester d(in);
  CHECK(d.digest(west).hex == w0);
  CHECK(d.digest(east).hex != e0);
}

namespace {
// Renames sheet `id` of the index in place, with GDAL.
void rename_sheet(const fs::path& index, const std::string& id, const std::string& name) {
  DatasetPtr ds(GDALDataset::Open(index.c_str(), GDAL_OF_VECTOR | GDAL_OF_UPDATE));
  REQUIRE(ds);
  OGRLayer* layer = ds->GetLayerByName("sheets");
  REQUIRE(layer);
  REQUIRE(layer->SetAttributeFilter(("sheet_id = '" + id + "'").c_str()) == OGRERR_NONE);
  FeaturePtr f(layer->GetNextFeature());
  REQUIRE(f);
  f->SetField("name", name.c_str());
  REQUIRE(layer->SetFeature(f.get()) == OGRERR_NONE);
}

// The digest of every sheet of the index at `path`, with the index as the only source.
std::map<std::string, std::string> index_digests(const fs::path& path,
                                                 std::vector<SheetJob>* jobs_out = nullptr) {
  TileIndexContent index = read_tile_index(path.string(), "sheets", "sheet_id", "name");
  DigestInputs in;
  in.program_version = "test";
  in.vectors = {{kTileIndexSource, path.string(), "sheets", "", true}};
  in.index_crs_wkt = index.crs_wkt;
  in.margin_m = 250;
  InputDigester d(in);
  std::map<std::string, std::string> out;
  for (const auto& j : index.sheets) out[j.id] = d.digest(j).hex;
  if (jobs_out) *jobs_out = index.sheets;
  return out;
}

std::set<std::string> changed(const std::map<std::string, std::string>& a,
                              const std::map<std::string, std::string>& b) {
  std::set<std::string> ids;
  for (const auto& [id, h] : a) {
    if (b.at(id) != h) ids.insert(id);
  }
  return ids;
}
}  // namespace

TEST_CASE("renaming an index sheet re-renders the sheets whose collar shows it", "[batch]") {
  test::TempDir dir("digest-index");
  IndexSpec spec;
  spec.crs = "EPSG:32633";
  spec.frame_width_mm = 40;  // 1 x 1 km at 1:25 000
  spec.frame_height_mm = 40;

  SECTION("a small index is drawn whole in every location diagram: all sheets change") {
    spec.area = Box::of(500000, 5000000, 504000, 5003000);  // 4 x 3 = 12 sheets
    write_tile_index(plan_tile_index(spec), dir / "small.gpkg", "sheets");
    std::vector<SheetJob> jobs;
    auto before = index_digests(dir / "small.gpkg", &jobs);
    REQUIRE(jobs.size() == 12);
    rename_sheet(dir / "small.gpkg", jobs.front().id, "Renamed");
    CHECK(changed(before, index_digests(dir / "small.gpkg")).size() == 12);
  }
  SECTION("a large index: only sheets within the location diagram's reach change") {
    spec.area = Box::of(500000, 5000000, 520000, 5020000);  // 20 x 20 = 400 sheets
    write_tile_index(plan_tile_index(spec), dir / "large.gpkg", "sheets");
    std::vector<SheetJob> jobs;
    auto before = index_digests(dir / "large.gpkg", &jobs);
    REQUIRE(jobs.size() == 400);
    REQUIRE(jobs.size() > sheet::kLocationWholeIndex);
    // The sheet whose centre is (510.5 km E, 5010.5 km N), renamed.
    const SheetJob* target = nullptr;
    for (const auto& j : jobs) {
      if (j.footprint.contains({510500, 5010500})) target = &j;
    }
    REQUIRE(target);
    rename_sheet(dir / "large.gpkg", target->id, "Renamed");
    // Expected from the lattice alone: the diagram of a sheet shows the sheets its footprint,
    // grown by kLocationReach (4) sheet sizes on every side, meets (touching counts), so those
    // whose centres are at most 5 sheets away in each direction: an 11 x 11 block.
    std::set<std::string> expected;
    const Point c = target->footprint.centre();
    for (const auto& j : jobs) {
      Point d = j.footprint.centre() - c;
      if (std::abs(d.x) <= 5000.5 && std::abs(d.y) <= 5000.5) expected.insert(j.id);
    }
    CHECK(expected.size() == 121);
    CHECK(changed(before, index_digests(dir / "large.gpkg")) == expected);
  }
}
