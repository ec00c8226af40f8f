#include <fcntl.h>
#include <ogrsf_frmts.h>
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <array>
#include <catch2/catch.hpp>
#include <chrono>
#include <map>
#include <set>
#include <sstream>
#include <thread>

#include "batch/demo_project.hpp"
#include "batch/fake_sheets.hpp"
#include "sheetmill/batch/stamp.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

namespace {

// The report's CSV as id -> status (IDs here have no commas or quotes).
std::map<std::string, std::string> report_statuses(const fs::path& csv) {
  std::map<std::string, std::string> m;
  std::istringstream in(test::read_text(csv));
  std::string line;
  std::getline(in, line);  // header
  while (std::getline(in, line)) {
    auto a = line.find(','), b = line.find(',', a + 1), c = line.find(',', b + 1);
    m[line.substr(0, a)] = line.substr(b + 1, c - b - 1);
  }
  return m;
}

std::set<std::string> pdfs_in(const fs::path& dir) {
  std::set<std::string> out;
  for (const auto& e : fs::directory_iterator(dir)) {
    if (e.path().extension() == ".pdf") out.insert(e.path().stem().string());
  }
  return out;
}

}  // namespace

TEST_CASE("sheetmill index writes a tile index and rejects bad options with exit 2", "[batch]") {
  test::TempDir dir("cli");
  auto ok = test::run_sheetmill({"index", (dir / "t.gpkg").string(), "--crs", "EPSG:32632",
                                 "--scale", "1:25000", "--frame", "400x300mm", "--snap", "500m",
                                 "--extent", "470000,5190000,490000,5205000"});
  INFO(ok.err);
  REQUIRE(ok.exit_code == 0);
  // Oracle: ogrinfo counts the sheets. 400 x 300 mm at 1:25 000 is 10 x 7.5 km (whole 500 m):
  // 20 km / 10 km = 2 columns, 15 km / 7.5 km = 2 rows (5 190 000 is on the 7.5 km lattice).
  auto info = test::run_command({"ogrinfo", "-so", (dir / "t.gpkg").string(), "sheets"});
  CHECK(info.out.find("Feature Count: 4") != std::string::npos);
  for (std::vector<std::string> bad :
       std::vector<std::vector<std::string>>{{"--frame", "400x300"},  // no unit
                                             {"--frame", "1x1mm"},    // smaller than the snap
                                             {"--scale", "big"},
                                             {"--crs", "EPSG:999999"}}) {
    std::vector<std::string> args{"index",    (dir / "u.gpkg").string(),
                                  "--crs",    "EPSG:32632",
                                  "--scale",  "25000",
                                  "--frame",  "400x300mm",
                                  "--extent", "470000,5190000,490000,5205000"};
    for (std::size_t i = 0; i < args.size(); ++i) {
      if (args[i] == bad[0]) args[i + 1] = bad[1];
    }
    auto r = test::run_sheetmill(args);
    INFO(bad[0] << " " << bad[1] << ": " << r.err);
    CHECK(r.exit_code == 2);
    CHECK(std::count(r.err.begin(), r.err.end(), '\n') == 1);  // one line
    CHECK_FALSE(fs::exists(dir / "u.gpkg"));
  }
}

TEST_CASE("sheetmill batch killed with SIGKILL resumes: complete PDFs, none redone", "[batch]") {
  test::TempDir dir("cli");
  test::DemoProject demo = test::make_demo_project(dir.path());
  fs::path out = dir / "out";
  std::vector<std::string> argv{test::sheetmill_exe().string(),
                                "batch",
                                demo.project.string(),
                                "-o",
                                out.string(),
                                "-j",
                                "2",
                                "--progress",
                                "lines"};
  pid_t pid = ::fork();
  REQUIRE(pid >= 0);
  if (pid == 0) {
    std::vector<char*> args;
    for (auto& a : argv) args.push_back(a.data());
    args.push_back(nullptr);
    int null_fd = ::open("/dev/null", O_WRONLY);
    ::dup2(null_fd, 2);
    ::execv(args[0], args.data());
    ::_exit(127);
  }
  auto stamps = [&] {
    int n = 0;
    std::error_code ec;
    for (fs::directory_iterator it(out, ec), end; !ec && it != end; it.increment(ec)) {
      n += it->path().extension() == ".stamp";
    }
    return n;
  };
  auto deadline = std::chrono::steady_clock::now() + std::chrono::minutes(5);
  while (stamps() < 3 && std::chrono::steady_clock::now() < deadline) {
    std::this_thread::sleep_for(std::chrono::milliseconds(20));
  }
  ::kill(pid, SIGKILL);
  int status = 0;
  ::waitpid(pid, &status, 0);
  REQUIRE(WIFSIGNALED(status));
  std::this_thread::sleep_for(std::chrono::milliseconds(500));

  // Every PDF present is complete; the stamped ones are the finished ones.
  std::map<std::string, fs::file_time_type> finished;
  for (const std::string& id : pdfs_in(out)) {
    INFO(id);
    CHECK(test::pdf_opens(out / (id + ".pdf")));
    fs::path stamp = batch::stamp_path(out / (id + ".pdf"));
    if (fs::exists(stamp)) finished[id] = fs::last_write_time(stamp);
  }
  REQUIRE(finished.size() >= 3);

  auto again = test::run_sheetmill({"batch", demo.project.string(), "-o", out.string(), "-j", "2"});
  INFO(again.err);
  REQUIRE(again.exit_code == 0);
  auto statuses = report_statuses(out / "batch-report.csv");
  REQUIRE(statuses.size() >= finished.size() + 1);
  for (const auto& [id, st] : statuses) {
    INFO(id);
    CHECK(st == (finished.count(id) ? "up-to-date" : "rendered"));
    CHECK(test::pdf_opens(out / (id + ".pdf")));
    if (finished.count(id)) {
      CHECK(fs::last_write_time(batch::stamp_path(out / (id + ".pdf"))) == finished[id]);
    }
  }
  CHECK(pdfs_in(out).size() == statuses.size());
  // The folder's lock file stays by design (batch/folder_lock.hpp: removing it would race with
  // its next holder); nothing else with a leading dot, no temporary.
  for (const auto& e : fs::directory_iterator(out)) {
    INFO(e.path().filename().string());
    CHECK(
        (e.path().filename().string()[0] != '.' || e.path().filename() == ".sheetmill-batch.lock"));
  }
}

TEST_CASE("hostile IDs in a tile index stay inside the output folder, duplicates stop the batch",
          "[batch]") {
  test::TempDir dir("cli");
  test::DemoProject demo = test::make_demo_project(dir.path(), "478000,5195000,482000,5196500");
  // Rewrite the IDs of the (4 x 1) index with GDAL: traversal, absolute, newline, device name.
  std::vector<std::string> hostile = {"../escape", "/etc/owned", "line\nbreak", "CON"};
  auto set_ids = [&](const std::vector<std::string>& ids) {
    gdal_init();
    DatasetPtr ds(GDALDataset::Open(demo.index.c_str(), GDAL_OF_VECTOR | GDAL_OF_UPDATE));
    REQUIRE(ds);
    OGRLayer* layer = ds->GetLayerByName("sheets");
    REQUIRE(layer->GetFeatureCount() == static_cast<GIntBig>(ids.size()));
    std::size_t k = 0;
    layer->ResetReading();
    std::vector<FeaturePtr> features;
    for (auto& f : *layer) features.emplace_back(f->Clone());
    for (auto& f : features) {
      f->SetField("sheet_id", ids[k++].c_str());
      REQUIRE(layer->SetFeature(f.get()) == OGRERR_NONE);
    }
  };
  set_ids(hostile);
  fs::path out = dir / "out";
  auto r =
      test::run_sheetmill({"-q", "batch", demo.project.string(), "-o", out.string(), "-j", "2"});
  INFO(r.err);
  CHECK(r.exit_code == 0);
  // Everything written is directly inside out/: four PDFs, four stamps and the two reports.
  std::set<std::string> names;
  for (const auto& e : fs::recursive_directory_iterator(dir.path())) {
    fs::path rel = fs::relative(e.path(), dir.path());
    if (rel.begin()->string() != "out" || rel == "out") continue;
    CHECK(std::distance(rel.begin(), rel.end()) == 2);
    names.insert(rel.filename().string());
  }
  CHECK(names == std::set<std::string>{"_.._escape.pdf", "_etc_owned.pdf", "line_break.pdf",
                                       "_CON.pdf", "_.._escape.pdf.stamp", "_etc_owned.pdf.stamp",
                                       "line_break.pdf.stamp", "_CON.pdf.stamp",
                                       "batch-report.json", "batch-report.csv",
                                       ".sheetmill-batch.lock"});
  CHECK_FALSE(fs::exists(dir.path().parent_path() / "escape.pdf"));
  for (const auto& n : names) {
    if (n.ends_with(".pdf")) CHECK(test::pdf_opens(out / n));
  }

  // Two sheets with one name: an error before anything is written.
  set_ids({"dup", "dup", "x", "y"});
  fs::path out2 = dir / "out2";
  r = test::run_sheetmill({"batch", demo.project.string(), "-o", out2.string()});
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("\"dup\" and \"dup\"") != std::string::npos);
  CHECK_FALSE(fs::exists(out2));
}

// --single-file: one multi-page PDF with every sheet, in index order. Each page is checked
// against the sheet's own PDF with poppler (pdftotext per page) and GDAL (the page's
// georeferencing, read through the PDF driver's per-page subdatasets).
TEST_CASE("sheetmill batch --single-file merges the sheets in index order, georeferenced",
          "[batch]") {
  test::TempDir dir("cli-merge");
  test::DemoProject demo = test::make_demo_project(dir.path());
  fs::path out = dir / "out";
  auto r = test::run_sheetmill({"batch", demo.project.string(), "-o", out.string(), "-j", "2",
                                "--single-file", "series.pdf"});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  fs::path merged = out / "series.pdf";
  REQUIRE(fs::exists(merged));

  // The index order, read from the index itself with OGR (feature order).
  std::vector<std::string> ids;
  {
    gdal_init();
    DatasetPtr ds(GDALDataset::Open(demo.index.c_str(), GDAL_OF_VECTOR));
    REQUIRE(ds);
    OGRLayer* layer = ds->GetLayer(0);
    for (auto& f : *layer) ids.push_back(f->GetFieldAsString("sheet_id"));
  }
  REQUIRE(ids.size() >= 4);
  auto info = test::run_command({"pdfinfo", merged.string()});
  REQUIRE(info.exit_code == 0);
  auto pages_at = info.out.find("Pages:");
  REQUIRE(pages_at != std::string::npos);
  CHECK(std::stoul(info.out.substr(pages_at + 6)) == ids.size());
  auto text_of = [](const fs::path& pdf, int page) {
    auto t = test::run_command({"pdftotext", "-f", std::to_string(page), "-l", std::to_string(page),
                                "-layout", pdf.string(), "-"});
    REQUIRE(t.exit_code == 0);
    return t.out;
  };
  auto geotransform_of = [](const std::string& name) {
    DatasetPtr ds(GDALDataset::Open(name.c_str(), GDAL_OF_RASTER));
    REQUIRE(ds);
    std::array<double, 6> gt{};
    REQUIRE(ds->GetGeoTransform(gt.data()) == CE_None);
    return gt;
  };
  for (std::size_t k = 0; k < ids.size(); ++k) {
    INFO("page " << k + 1 << ", sheet " << ids[k]);
    fs::path single = out / (ids[k] + ".pdf");
    REQUIRE(fs::exists(single));
    CHECK(text_of(merged, static_cast<int>(k) + 1) == text_of(single, 1));
    if (k == 0 || k + 1 == ids.size()) {
      auto a = geotransform_of("PDF:" + std::to_string(k + 1) + ":" + merged.string());
      auto b = geotransform_of(single.string());
      for (int i = 0; i < 6; ++i) CHECK(a[i] == Approx(b[i]).margin(1e-6));
    }
  }
  // Nothing half-written is left beside it.
  // The folder's lock file stays by design (batch/folder_lock.hpp: removing it would race with
  // its next holder); nothing else with a leading dot, no temporary.
  for (const auto& e : fs::directory_iterator(out)) {
    INFO(e.path().filename().string());
    CHECK(
        (e.path().filename().string()[0] != '.' || e.path().filename() == ".sheetmill-batch.lock"));
  }
}
