#include "exhibit_fixture.hpp"

#include <fmt/format.h>
#include <gdal.h>
#include <ogr_srs_api.h>

#include <cstdio>
#include <fstream>
#include <sstream>
#include <stdexcept>

#include "sheetmill/core/gdal_env.hpp"
#include "support/test_env.hpp"

namespace sheetmill::exhibit_fixture {

void write_plane_dem(const std::filesystem::path& path, double z0, double slope, double cell_m) {
  gdal_init();
  const double e = kE0 - 10000, n = kN0 + kHeightM + 10000;
  const int w = static_cast<int>((kWidthM + 20000) / cell_m),
            h = static_cast<int>((kHeightM + 20000) / cell_m);
  GDALDriverH drv = GDALGetDriverByName("GTiff");
  GDALDatasetH ds = GDALCreate(drv, path.c_str(), w, h, 1, GDT_Float32, nullptr);
  if (!ds) throw std::runtime_error("cannot create " + path.string());
  double gt[6] = {e, cell_m, 0, n, 0, -cell_m};
  GDALSetGeoTransform(ds, gt);
  OGRSpatialReferenceH srs = OSRNewSpatialReference(nullptr);
  OSRImportFromEPSG(srs, 32632);
  char* wkt = nullptr;
  OSRExportToWkt(srs, &wkt);
  GDALSetProjection(ds, wkt);
  CPLFree(wkt);
  OSRDestroySpatialReference(srs);
  std::vector<float> row(static_cast<std::size_t>(w));
  for (int c = 0; c < w; ++c) {
    const double x = e + (c + 0.5) * cell_m;  // cell centres (GDAL's pixel-is-area convention)
    row[static_cast<std::size_t>(c)] = static_cast<float>(z0 + slope * (x - kE0));
  }
  GDALRasterBandH band = GDALGetRasterBand(ds, 1);
  for (int r = 0; r < h; ++r) {
    if (GDALRasterIO(band, GF_Write, 0, r, w, 1, row.data(), w, 1, GDT_Float32, 0, 0) != CE_None) {
      throw std::runtime_error("cannot write " + path.string());
    }
  }
  GDALClose(ds);
}

std::string exhibit_yaml(const std::filesystem::path& dem, const std::string& paper, bool landscape,
                         double exaggeration, const std::string& relief_extra,
                         const std::string& extra) {
  return fmt::format(
      "title: Fenwick Reach Flood Storage\n"
      "subtitle: Alternatives for the public hearing\n"
      "producer: Test office\n"
      "date: 2026-12-01\n"
      "credits: [\"Terrain: synthetic test plane\"]\n"
      "crs: EPSG:32632\n"
      "paper: {{size: {}, orientation: {}}}\n"
      "extent: [{}, {}, {}, {}]\n"
      "relief:\n"
      "  dem: {}\n"
      "  exaggeration: {}\n"
      "{}"
      "{}",
      paper, landscape ? "landscape" : "portrait", kE0, kN0, kE0 + kWidthM, kN0 + kHeightM,
      dem.string(), exaggeration, relief_extra, extra);
}

Rgb Raster::at(int x, int y) const {
  const std::size_t i = (static_cast<std::size_t>(y) * width + x) * 3;
  return {rgb[i], rgb[i + 1], rgb[i + 2]};
}

Raster rasterise(const std::filesystem::path& pdf, double dpi, const std::filesystem::path& dir) {
  const std::filesystem::path stem = dir / "page";
  auto r = sheetmill::test::run_command(
      {"pdftoppm", "-r", fmt::format("{}", dpi), "-singlefile", pdf.string(), stem.string()});
  if (r.exit_code != 0) throw std::runtime_error("pdftoppm failed: " + r.err);
  std::ifstream in(stem.string() + ".ppm", std::ios::binary);
  std::string magic;
  int maxval = 0;
  Raster out;
  in >> magic >> out.width >> out.height >> maxval;
  in.get();
  if (magic != "P6" || maxval != 255) throw std::runtime_error("unexpected PPM from pdftoppm");
  out.rgb.resize(static_cast<std::size_t>(out.width) * out.height * 3);
  in.read(reinterpret_cast<char*>(out.rgb.data()), static_cast<std::streamsize>(out.rgb.size()));
  return out;
}

}  // namespace sheetmill::exhibit_fixture
