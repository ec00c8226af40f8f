#pragma once
// Readers for the demo-area tests: the DEM as a plain array with GDAL's geotransform, bilinear
// interpolation written out independently of the generator's, and the features of a layer.

#include <gdal_priv.h>
#include <ogrsf_frmts.h>

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <string>
#include <vector>

#include "sheetmill/core/gdal_env.hpp"

namespace sheetmill::test {

struct DemArray {
  int width = 0, height = 0;
  double gt[6] = {0, 1, 0, 0, 0, -1};
  std::vector<float> z;

  float at(int col, int row) const { return z[static_cast<std::size_t>(row) * width + col]; }
  // Bilinear between cell centres (GDAL convention: a pixel's value stands at its centre),
  // clamped at the outermost centres.
  double bilinear(double x, double y) const {
    double fc = std::clamp((x - gt[0]) / gt[1] - 0.5, 0.0, width - 1.0);
    double fr = std::clamp((y - gt[3]) / gt[5] - 0.5, 0.0, height - 1.0);
    int c0 = std::min(static_cast<int>(fc), width - 2);
    int r0 = std::min(static_cast<int>(fr), height - 2);
    double tx = fc - c0, ty = fr - r0;
    double top = at(c0, r0) * (1 - tx) + at(c0 + 1, r0) * tx;
    double bottom = at(c0, r0 + 1) * (1 - tx) + at(c0 + 1, r0 + 1) * tx;
    return top * (1 - ty) + bottom * ty;
  }
  double cell_x(int col) const { return gt[0] + (col + 0.5) * gt[1]; }
  double cell_y(int row) const { return gt[3] + (row + 0.5) * gt[5]; }
};

inline DemArray read_dem(const std::filesystem::path& path) {
  DatasetPtr ds = open_raster(path.string());
  DemArray d;
  d.width = ds->GetRasterXSize();
  d.height = ds->GetRasterYSize();
  ds->GetGeoTransform(d.gt);
  d.z.resize(static_cast<std::size_t>(d.width) * d.height);
  if (ds->GetRasterBand(1)->RasterIO(GF_Read, 0, 0, d.width, d.height, d.z.data(), d.width,
                                     d.height, GDT_Float32, 0, 0) != CE_None) {
    d.z.clear();
  }
  return d;
}

// All features of a layer as owned clones.
inline std::vector<OGRFeatureUniquePtr> read_layer(GDALDataset& ds, const char* name) {
  std::vector<OGRFeatureUniquePtr> out;
  OGRLayer* layer = ds.GetLayerByName(name);
  if (!layer) return out;
  layer->ResetReading();
  for (auto& f : *layer) out.emplace_back(f->Clone());
  return out;
}

inline std::vector<OGRRawPoint> line_points(const OGRFeature& f) {
  std::vector<OGRRawPoint> pts;
  const OGRGeometry* g = f.GetGeometryRef();
  if (!g || wkbFlatten(g->getGeometryType()) != wkbLineString) return pts;
  const OGRLineString* ls = g->toLineString();
  for (int i = 0; i < ls->getNumPoints(); ++i) pts.push_back({ls->getX(i), ls->getY(i)});
  return pts;
}

inline double percentile(std::vector<double> v, double q) {
  if (v.empty()) return 0;
  std::sort(v.begin(), v.end());
  std::size_t k = static_cast<std::size_t>(std::floor(q * (v.size() - 1)));
  return v[k];
}

}  // namespace sheetmill::test
