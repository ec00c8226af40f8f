#pragma once
// Synthetic DEMs for the terrain tests: analytic surfaces sampled at cell centres, and writing
// them as GeoTIFF for the tests that go through files or compare with GDAL.

#include <gdal_priv.h>
#include <ogr_spatialref.h>

#include <cmath>
#include <filesystem>
#include <functional>
#include <string>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/terrain/dem.hpp"
#include "support/crs.hpp"

namespace sheetmill::terrain::fixture {

// WKT of an EPSG CRS (traditional axis order is applied by readers).
inline std::string wkt_of(int epsg) {
  return test::wkt_of_epsg(epsg);
}

// A north-up grid with its top-left corner at (x0, y0) and square cells.
inline RasterGrid make_grid(int width, int height, double x0, double y0, double cell,
                            const std::string& crs_wkt) {
  RasterGrid g;
  g.width = width;
  g.height = height;
  g.geotransform[0] = x0;
  g.geotransform[1] = cell;
  g.geotransform[3] = y0;
  g.geotransform[5] = -cell;
  g.crs_wkt = crs_wkt;
  return g;
}

// z(E, N) sampled at cell centres of a projected grid (cells in metres).
inline Dem sample_dem(const RasterGrid& g, const std::function<double(double, double)>& f) {
  Dem d;
  d.grid = g;
  d.cell_x_m = g.cell_x();
  d.cell_y_m = g.cell_y();
  d.z.resize(static_cast<std::size_t>(g.width) * g.height);
  for (int r = 0; r < g.height; ++r) {
    for (int c = 0; c < g.width; ++c) {
      double e = g.geotransform[0] + (c + 0.5) * g.geotransform[1];
      double n = g.geotransform[3] + (r + 0.5) * g.geotransform[5];
      d.z[static_cast<std::size_t>(r) * g.width + c] = static_cast<float>(f(e, n));
    }
  }
  return d;
}

// Writes z as a Float32 GeoTIFF (NaN cells become `nodata`); tiled when asked.
inline void write_geotiff(const std::filesystem::path& path, const RasterGrid& g,
                          const std::vector<float>& z, double nodata = -9999, bool tiled = false) {
  gdal_init();
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GTiff");
  const char* tiled_opts[] = {"TILED=YES", nullptr};
  DatasetPtr ds(drv->Create(path.c_str(), g.width, g.height, 1, GDT_Float32,
                            tiled ? const_cast<char**>(tiled_opts) : nullptr));
  double gt[6];
  std::copy(g.geotransform, g.geotransform + 6, gt);
  ds->SetGeoTransform(gt);
  if (!g.crs_wkt.empty()) ds->SetProjection(g.crs_wkt.c_str());
  GDALRasterBand* b = ds->GetRasterBand(1);
  b->SetNoDataValue(nodata);
  std::vector<float> out(z);
  for (float& v : out) {
    if (std::isnan(v)) v = static_cast<float>(nodata);
  }
  if (b->RasterIO(GF_Write, 0, 0, g.width, g.height, out.data(), g.width, g.height, GDT_Float32, 0,
                  0, nullptr) != CE_None) {
    throw std::runtime_error("write_geotiff failed");
  }
}

}  // namespace sheetmill::terrain::fixture
