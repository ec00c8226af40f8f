// Real open data: the Olinda DEM (r-cran-stars, UTM 25 S, ~90 m cells; tests/data/README.md).
// GDAL's own command-line generator is the oracle for the raw lines.
#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <filesystem>

#include "sheetmill/contours/contour_layer.hpp"
#include "sheetmill/contours/generate.hpp"
#include "sheetmill/contours/prepare.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/terrain/dem_source.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::contours;

namespace {

std::filesystem::path olinda() {
  return test::open_data("r-cran-stars", "usr/lib/R/site-library/stars/tif/olinda_dem_utm25s.tif");
}

// Total length and feature count of every line in a vector file (OGR reads it).
std::pair<double, long> total_length(const std::filesystem::path& file) {
  DatasetPtr ds = open_vector(file.string());
  double sum = 0;
  long n = 0;
  for (auto& f : *ds->GetLayer(0)) {
    if (const OGRGeometry* g = f->GetGeometryRef()) {
      sum += g->toCurve()->get_Length();
      ++n;
    }
  }
  return {sum, n};
}

}  // namespace

TEST_CASE("olinda: total length within 0.5 % of gdal_contour's raw lines", "[contours]") {
  if (!std::filesystem::exists(olinda())) {
    WARN("olinda DEM absent (run scripts/fetch-test-data): skipped");
    return;
  }
  test::TempDir tmp("olinda");
  auto gdal = test::run_command({"gdal_contour", "-q", "-i", "10", "-f", "GPKG", olinda().string(),
                                 (tmp / "gdal.gpkg").string()});
  REQUIRE(gdal.exit_code == 0);
  auto [gdal_len, gdal_n] = total_length(tmp / "gdal.gpkg");
  REQUIRE(gdal_n > 50);

  ContourParams p;
  p.interval_m = 10;
  p.scale_denominator = 50000;  // the DEM covers 10 km: a 200 mm sheet at 1:50 000
  terrain::Dem dem = terrain::DemSource(olinda().string()).read_all();
  auto raw = generate_raw(dem, p);
  double raw_len = 0;
  for (const auto& l : raw) raw_len += line_length(l);
  // Our raw lines are GDAL's lines (same generator): equal length to rounding.
  CHECK(raw_len == Approx(gdal_len).epsilon(1e-9));
  CHECK(find_crossings(raw).empty());  // GDAL's raw lines of one surface
  auto stats = prepare_for_print(raw, p, 90);
  double shortening = 1 - stats.length_out_m / gdal_len;
  WARN("olinda at 1:50 000: smoothing shortens the lines by "
       << shortening * 100 << " % (" << stats.loops_dropped << " tiny loops dropped, "
       << stats.lines_restored << " lines kept raw)");
  CHECK(std::abs(shortening) <= 0.005);
  CHECK(find_crossings(raw).empty());

  // The command writes the same prepared lines, with its fields, atomically.
  auto cli = test::run_sheetmill({"contours", olinda().string(), (tmp / "ours.gpkg").string(),
                                  "--interval", "10", "--scale", "50000"});
  INFO(cli.err);
  REQUIRE(cli.exit_code == 0);
  auto [ours_len, ours_n] = total_length(tmp / "ours.gpkg");
  CHECK(ours_len == Approx(stats.length_out_m).epsilon(1e-9));
  CHECK(ours_n == static_cast<long>(raw.size()));
  DatasetPtr ds = open_vector((tmp / "ours.gpkg").string());
  OGRFeatureDefn* defn = ds->GetLayer(0)->GetLayerDefn();
  for (const char* f : {"elevation", "index", "depression"}) CHECK(defn->GetFieldIndex(f) >= 0);
  for (auto& f : *ds->GetLayer(0)) {
    long level = std::lround(f->GetFieldAsDouble("elevation") / 10);
    CHECK(f->GetFieldAsInteger("index") == (level % 5 == 0 ? 1 : 0));
  }
  // No temporary left beside the output.
  int files = 0;
  for (const auto& e : std::filesystem::directory_iterator(tmp.path()))
    files += e.is_regular_file();
  CHECK(files == 2);
}

TEST_CASE("contours command: bad input exits 2 with one line", "[contours]") {
  test::TempDir tmp("cli");
  auto r = test::run_sheetmill(
      {"contours", (tmp / "missing.tif").string(), (tmp / "o.gpkg").string(), "--interval", "10"});
  CHECK(r.exit_code == 2);
  CHECK_THAT(r.err, Catch::Contains("missing.tif"));
  if (!std::filesystem::exists(olinda())) return;
  auto bad = test::run_sheetmill(
      {"contours", olinda().string(), (tmp / "o.gpkg").string(), "--interval", "-5"});
  CHECK(bad.exit_code == 2);
  CHECK_THAT(bad.err, Catch::Contains("interval"));
  CHECK(std::count(bad.err.begin(), bad.err.end(), '\n') == 1);
  CHECK_FALSE(std::filesystem::exists(tmp / "o.gpkg"));
}
