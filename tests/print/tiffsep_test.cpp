// The plates against Ghostscript's separations (the oracle): the demo sheet rendered with a
// style whose inks are the four process colours (black = K, water = C, roads = M, contours and
// vegetation = Y), as PDF/X-4 and as plates; Ghostscript's tiffsep device separates the PDF/X
// file into its colorants, overprint included. Each of our plates must carry the same ink where
// Ghostscript puts it.
//
// The two rasterisers differ at edges (Cairo covers pixels by area, Ghostscript's separation
// device anti-aliases less, so its hairlines and small type come out heavier), so the
// comparison is at 200 dpi on 24 x 24 pixel blocks (3 mm): the block coverages of a plate and
// of its separation must correlate (Pearson r >= 0.9) and better than with any other
// separation; the mean coverage difference must stay under 1 % of full ink and the share of
// blocks that differ by more than a quarter of full ink under 1 %. Tolerances are ours, stated
// here. Measured when written (r, mean difference, share): black 0.997 / 0.0038 / 0, yellow
// 0.977 / 0.0037 / 0.0007, cyan 0.979 / 0.0005 / 0, magenta 0.934 / 0.0015 / 0.0005.
#include <gdal_priv.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <regex>
#include <vector>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/colour/colour_engine.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

constexpr int kDpi = 200;
constexpr int kBlock = 24;

struct Raster {
  int w = 0, h = 0;
  std::vector<double> v;  // ink coverage 0..1
};

// Our plates store coverage (MinIsWhite); tiffsep's separation files store 255 for no ink
// (from memory of Ghostscript's device notes; the non-empty and small-difference checks below
// would both fail were it the other way round), so their values are inverted.
Raster read(const fs::path& p, bool stores_coverage) {
  gdal_init();
  GDALDatasetUniquePtr ds(GDALDataset::Open(p.c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY));
  REQUIRE(ds);
  Raster r{ds->GetRasterXSize(), ds->GetRasterYSize(), {}};
  std::vector<unsigned char> b(static_cast<std::size_t>(r.w) * r.h);
  REQUIRE(ds->GetRasterBand(1)->RasterIO(GF_Read, 0, 0, r.w, r.h, b.data(), r.w, r.h, GDT_Byte, 0,
                                         0, nullptr) == CE_None);
  r.v.resize(b.size());
  for (std::size_t i = 0; i < b.size(); ++i) r.v[i] = (stores_coverage ? b[i] : 255 - b[i]) / 255.0;
  return r;
}

Raster blocks(const Raster& r, int w, int h) {
  Raster o{w / kBlock, h / kBlock, {}};
  o.v.assign(static_cast<std::size_t>(o.w) * o.h, 0);
  for (int y = 0; y < o.h * kBlock; ++y)
    for (int x = 0; x < o.w * kBlock; ++x)
      o.v[(y / kBlock) * o.w + x / kBlock] += r.v[static_cast<std::size_t>(y) * r.w + x];
  for (double& v : o.v) v /= kBlock * kBlock;
  return o;
}

double correlation(const Raster& a, const Raster& b, int edge) {
  double sa = 0, sb = 0, saa = 0, sbb = 0, sab = 0;
  long n = 0;
  for (int y = edge; y < a.h - edge; ++y) {
    for (int x = edge; x < a.w - edge; ++x) {
      double u = a.v[y * a.w + x], v = b.v[y * b.w + x];
      sa += u;
      sb += v;
      saa += u * u;
      sbb += v * v;
      sab += u * v;
      ++n;
    }
  }
  double cov = sab / n - sa / n * sb / n;
  double va = saa / n - sa / n * sa / n, vb = sbb / n - sb / n * sb / n;
  return va > 0 && vb > 0 ? cov / std::sqrt(va * vb) : 0;
}

struct Sheet {
  test::TempDir dir{"tiffsep"};
  fs::path pdf = dir / "print.pdf", plates = dir / "plates";
  Sheet() {
    std::string style = test::read_text(test::source_dir() / "styles" / "field.yaml");
    const std::string process = R"(  inks:
    black: { cmyk: [0, 0, 0, 100] }
    contour_brown: { cmyk: [0, 0, 100, 0] }
    water_blue: { cmyk: [100, 0, 0, 0] }
    road_red: { cmyk: [0, 100, 0, 0] }
)";
    std::smatch m;
    REQUIRE(std::regex_search(style, m, std::regex("  inks:\\n(    .*\\n)+")));
    style = m.prefix().str() + process + m.suffix().str();
    style = std::regex_replace(style, std::regex("vegetation_green"), "contour_brown");
    test::write_text(dir / "style.yaml", style);
    std::string project = test::read_text(test::source_dir() / "demo_area" / "project.yaml");
    project =
        std::regex_replace(project, std::regex("generated/"), test::demo_area().string() + "/");
    project = std::regex_replace(project, std::regex("\\.\\./styles/field\\.yaml"),
                                 (dir / "style.yaml").string());
    project = std::regex_replace(project, std::regex("size: A2"), "size: A4");
    test::write_text(dir / "project.yaml", project);
    auto r =
        test::run_sheetmill({"render", (dir / "project.yaml").string(), "-o", pdf.string(),
                             "--print-profile", print::default_cmyk_profile().string(), "--plates",
                             plates.string(), "--plate-dpi", std::to_string(kDpi)});
    INFO(r.err);
    REQUIRE(r.exit_code == 0);
    // Anti-aliased like Cairo, as far as the separation device allows.
    auto g = test::run_command({"gs", "-q", "-dNOPAUSE", "-dBATCH", "-dSAFER", "-sDEVICE=tiffsep",
                                "-dGraphicsAlphaBits=4", "-dTextAlphaBits=4",
                                "-r" + std::to_string(kDpi),
                                "-sOutputFile=" + (dir / "gs.tif").string(), pdf.string()});
    INFO(g.err);
    REQUIRE(g.exit_code == 0);
  }
};

// Rendered once for the checks in this file.
Sheet& sheet() {
  static Sheet s;
  return s;
}

}  // namespace

TEST_CASE("each plate matches Ghostscript's tiffsep separation of the PDF/X file", "[print][gs]") {
  Sheet& s = sheet();
  const std::pair<const char*, const char*> pairs[] = {{"1-black.tif", "gs(Black).tif"},
                                                       {"2-contour_brown.tif", "gs(Yellow).tif"},
                                                       {"3-water_blue.tif", "gs(Cyan).tif"},
                                                       {"4-road_red.tif", "gs(Magenta).tif"}};
  std::vector<Raster> seps;
  for (auto [ours, theirs] : pairs) seps.push_back(read(s.dir / theirs, false));
  int index = 0;
  for (auto [ours, theirs] : pairs) {
    INFO(ours << " against " << theirs);
    const int self = index++;
    Raster a = read(s.plates / ours, true), b = seps[self];
    // The same page at the same resolution, give or take Ghostscript's rounding of the size.
    CHECK(std::abs(a.w - b.w) <= 1);
    CHECK(std::abs(a.h - b.h) <= 1);
    const int w = std::min(a.w, b.w), h = std::min(a.h, b.h);
    Raster ab = blocks(a, w, h), bb = blocks(b, w, h);
    double sum = 0, ours_total = 0, theirs_total = 0;
    long far = 0;
    // The plate marks and name lie outside the PDF's content: leave out the paper margin's
    // outer half (5 mm) where they are.
    const int edge = static_cast<int>(std::ceil(5.0 / 25.4 * kDpi / kBlock));
    long n = 0;
    for (int y = edge; y < ab.h - edge; ++y) {
      for (int x = edge; x < ab.w - edge; ++x) {
        double d = std::abs(ab.v[y * ab.w + x] - bb.v[y * bb.w + x]);
        sum += d;
        ours_total += ab.v[y * ab.w + x];
        theirs_total += bb.v[y * bb.w + x];
        if (d > 0.25) ++far;
        ++n;
      }
    }
    const double mean = sum / n, far_share = static_cast<double>(far) / n;
    const double r = correlation(ab, bb, edge);
    INFO("correlation with its separation " << r);
    CHECK(r >= 0.9);
    for (std::size_t j = 0; j < seps.size(); ++j) {
      if (static_cast<int>(j) == self) continue;
      double other = correlation(ab, blocks(seps[j], w, h), edge);
      INFO("correlation with separation " << pairs[j].second << ": " << other);
      CHECK(other < r);
    }
    INFO("mean block difference " << mean << ", blocks off by > 25 %: " << far_share
                                  << ", coverage ours " << ours_total / n << " theirs "
                                  << theirs_total / n);
    CHECK(theirs_total / n > 0.002);  // the separation is not empty: the ink is on the sheet
    CHECK(mean < 0.01);
    CHECK(far_share < 0.01);
  }
}

TEST_CASE("the plate report says which layers went onto which plate", "[print][gs]") {
  Sheet& s = sheet();
  std::string report = test::read_text(s.plates / "plates.txt");
  INFO(report);
  CHECK(report.find("1-black.tif: ink black") != std::string::npos);
  // Contours are on the contour plate and on no other.
  std::regex contour_line("2-contour_brown\\.tif[^\\n]*\\n  layers: [^\\n]*contours");
  CHECK(std::regex_search(report, contour_line));
  std::regex water_line("3-water_blue\\.tif[^\\n]*\\n  layers: [^\\n]*contours");
  CHECK_FALSE(std::regex_search(report, water_line));
  CHECK(report.find("relief") != std::string::npos);
}

TEST_CASE("plates are georeferenced like the GeoTIFF export; the PDF/X keeps its viewport",
          "[print][gs]") {
  Sheet& s = sheet();
  // GDAL as the oracle: the plate and the GeoTIFF export of the same sheet at the same dpi.
  auto tif = s.dir / "sheet.tif";
  auto r = test::run_sheetmill({"render", (s.dir / "project.yaml").string(), "-o", tif.string(),
                                "--dpi", std::to_string(kDpi)});
  INFO(r.err);
  REQUIRE(r.exit_code == 0);
  gdal_init();
  GDALDatasetUniquePtr plate(
      GDALDataset::Open((s.plates / "1-black.tif").c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY));
  GDALDatasetUniquePtr exp(GDALDataset::Open(tif.c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY));
  REQUIRE(plate);
  REQUIRE(exp);
  CHECK(plate->GetRasterXSize() == exp->GetRasterXSize());
  CHECK(plate->GetRasterYSize() == exp->GetRasterYSize());
  double a[6], b[6];
  REQUIRE(plate->GetGeoTransform(a) == CE_None);
  REQUIRE(exp->GetGeoTransform(b) == CE_None);
  for (int i = 0; i < 6; ++i) CHECK(a[i] == Approx(b[i]).margin(1e-6));
  REQUIRE(plate->GetSpatialRef());
  CHECK(plate->GetSpatialRef()->IsSame(exp->GetSpatialRef()));
  CHECK(std::string(plate->GetMetadataItem("TIFFTAG_XRESOLUTION")) == std::to_string(kDpi));
  // The PDF/X file still opens in GDAL's PDF driver with the frame's CRS (the viewport kept).
  GDALDatasetUniquePtr pdf(GDALDataset::Open(s.pdf.c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY));
  REQUIRE(pdf);
  REQUIRE(pdf->GetSpatialRef());
  CHECK(pdf->GetSpatialRef()->IsSame(exp->GetSpatialRef()));
}
