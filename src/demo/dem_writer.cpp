#include <cpl_string.h>
#include <ogr_spatialref.h>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/demo/scenario.hpp"
#include "sheetmill/demo/writers.hpp"

namespace sheetmill::demo {

void write_dem_geotiff(const std::filesystem::path& path, const FloatGrid& dem) {
  gdal_init();
  GdalErrorScope errors;
  GDALDriver* driver = GetGDALDriverManager()->GetDriverByName("GTiff");
  if (!driver) throw_internal_error("GDAL has no GTiff driver");
  CPLStringList options;
  options.SetNameValue("TILED", "YES");
  options.SetNameValue("BLOCKXSIZE", "256");
  options.SetNameValue("BLOCKYSIZE", "256");
  options.SetNameValue("COMPRESS", "DEFLATE");
  options.SetNameValue("PREDICTOR", "3");
  // GTiff compresses blocks on worker threads but writes them in submission order, so the
  // bytes do not depend on the thread count.
  options.SetNameValue("NUM_THREADS", "ALL_CPUS");
  const GridSpec& g = dem.spec;
  DatasetPtr ds(driver->Create(path.c_str(), g.width, g.height, 1, GDT_Float32, options.List()));
  if (!ds)
    throw_input_error(path.string(), "cannot create the GeoTIFF (" + errors.last_failure() + ")");
  double gt[6] = {g.x0, g.cell_m, 0, g.y_top, 0, -g.cell_m};
  ds->SetGeoTransform(gt);
  OGRSpatialReference srs;
  if (srs.importFromEPSG(kEpsg) != OGRERR_NONE) {
    throw_internal_error("PROJ does not know EPSG:32632 (is proj-data installed?)");
  }
  ds->SetSpatialRef(&srs);
  GDALRasterBand* band = ds->GetRasterBand(1);
  band->SetNoDataValue(-9999);
  CPLErr err =
      band->RasterIO(GF_Write, 0, 0, g.width, g.height, const_cast<float*>(dem.values.data()),
                     g.width, g.height, GDT_Float32, 0, 0);
  if (err != CE_None) throw_input_error(path.string(), "cannot write: " + errors.last_failure());
  errors.clear();
  ds.reset();  // closing flushes the last tiles
  if (!errors.last_failure().empty()) {
    throw_input_error(path.string(), "cannot finish the GeoTIFF: " + errors.last_failure());
  }
}

}  // namespace sheetmill::demo
