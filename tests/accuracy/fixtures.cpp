#include "fixtures.hpp"

#include <gdal_priv.h>
#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"

namespace sheetmill::accuracy::fixture {

void write_plane_dem(const std::filesystem::path& path, const Plane& plane, int width, int height,
                     double x0, double y0, double cell_m, int epsg,
                     std::optional<float> nodata_in_first_row) {
  gdal_init();
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GTiff");
  DatasetPtr ds(drv->Create(path.c_str(), width, height, 1, GDT_Float32, nullptr));
  REQUIRE(ds);
  double gt[6] = {x0, cell_m, 0, y0, 0, -cell_m};
  ds->SetGeoTransform(gt);
  OGRSpatialReference srs;
  srs.importFromEPSG(epsg);
  ds->SetSpatialRef(&srs);
  std::vector<float> z(static_cast<std::size_t>(width) * height);
  for (int r = 0; r < height; ++r) {
    for (int c = 0; c < width; ++c) {
      Point centre{x0 + (c + 0.5) * cell_m, y0 - (r + 0.5) * cell_m};
      z[static_cast<std::size_t>(r) * width + c] = static_cast<float>(plane.at(centre));
    }
  }
  GDALRasterBand* band = ds->GetRasterBand(1);
  if (nodata_in_first_row) {
    band->SetNoDataValue(*nodata_in_first_row);
    for (int c = 0; c < width; ++c) z[c] = *nodata_in_first_row;
  }
  REQUIRE(band->RasterIO(GF_Write, 0, 0, width, height, z.data(), width, height, GDT_Float32, 0, 0,
                         nullptr) == CE_None);
}

void write_points(const std::filesystem::path& path, const std::vector<PointRecord>& points,
                  int epsg, const std::string& height_field) {
  gdal_init();
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GPKG");
  DatasetPtr ds(drv->Create(path.c_str(), 0, 0, 0, GDT_Unknown, nullptr));
  REQUIRE(ds);
  OGRSpatialReference srs;
  if (epsg) {
    srs.importFromEPSG(epsg);
    srs.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  }
  OGRLayer* layer = ds->CreateLayer("points", epsg ? &srs : nullptr, wkbPoint, nullptr);
  REQUIRE(layer);
  OGRFieldDefn id("id", OFTString);
  layer->CreateField(&id);
  if (!height_field.empty()) {
    OGRFieldDefn h(height_field.c_str(), OFTReal);
    layer->CreateField(&h);
  }
  OGRFieldDefn cover("cover", OFTString);
  layer->CreateField(&cover);
  for (const auto& p : points) {
    FeaturePtr f(OGRFeature::CreateFeature(layer->GetLayerDefn()));
    f->SetField("id", p.id.c_str());
    if (!height_field.empty() && p.height) f->SetField(height_field.c_str(), *p.height);
    if (!p.cover.empty()) f->SetField("cover", p.cover.c_str());
    OGRPoint g(p.xy.x, p.xy.y);
    f->SetGeometry(&g);
    REQUIRE(layer->CreateFeature(f.get()) == OGRERR_NONE);
  }
}

}  // namespace sheetmill::accuracy::fixture
