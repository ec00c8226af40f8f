#include "pdf/raster_export.hpp"

#include <gdal_priv.h>

#include <vector>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"

namespace sheetmill::pdf {

namespace {
// Reopens the written file: a truncated GeoTIFF fails to open or to read its last row.
void verify_geotiff(const std::filesystem::path& path, int width, int height,
                    const std::string& shown_as) {
  GdalErrorScope errors;
  DatasetPtr ds(GDALDataset::Open(path.c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY));
  std::vector<unsigned char> row(static_cast<std::size_t>(width) * 3);
  bool whole = ds && ds->GetRasterXSize() == width && ds->GetRasterYSize() == height &&
               ds->GetRasterCount() == 3 &&
               ds->RasterIO(GF_Read, 0, height - 1, width, 1, row.data(), width, 1, GDT_Byte, 3,
                            nullptr, 3, static_cast<GSpacing>(width) * 3, 1, nullptr) == CE_None;
  if (!whole) {
    throw_input_error(shown_as, "the written GeoTIFF does not read back whole (" +
                                    library_write_failure(path, errors.last_failure()) + ")");
  }
}
}  // namespace

void write_geotiff_strips(const std::filesystem::path& path, const std::string& shown_as, int width,
                          int height, const std::array<double, 6>& gt, const std::string& crs_wkt,
                          const std::function<void(cairo_t*)>& draw, int strip_rows, double dpi) {
  gdal_init();
  GdalErrorScope errors;
  GDALDriver* driver = GetGDALDriverManager()->GetDriverByName("GTiff");
  if (!driver) throw_internal_error("GDAL has no GTiff driver");
  const char* options[] = {"COMPRESS=DEFLATE", "PHOTOMETRIC=RGB", "TILED=YES", nullptr};
  DatasetPtr ds(
      driver->Create(path.c_str(), width, height, 3, GDT_Byte, const_cast<char**>(options)));
  if (!ds) {
    throw_input_error(shown_as, "cannot create the GeoTIFF: " +
                                    library_write_failure(path, errors.last_failure()));
  }
  if (dpi > 0) {
    const std::string v = std::to_string(dpi);
    ds->SetMetadataItem("TIFFTAG_XRESOLUTION", v.c_str());
    ds->SetMetadataItem("TIFFTAG_YRESOLUTION", v.c_str());
    ds->SetMetadataItem("TIFFTAG_RESOLUTIONUNIT", "2");  // inch
  }
  double t[6] = {gt[0], gt[1], gt[2], gt[3], gt[4], gt[5]};
  ds->SetGeoTransform(t);
  if (!crs_wkt.empty()) {
    OGRSpatialReference srs;
    if (srs.importFromWkt(crs_wkt.c_str()) == OGRERR_NONE) ds->SetSpatialRef(&srs);
  }
  std::vector<unsigned char> rgb(static_cast<std::size_t>(width) * strip_rows * 3);
  for (int y0 = 0; y0 < height; y0 += strip_rows) {
    int rows = std::min(strip_rows, height - y0);
    CairoSurfacePtr surface(cairo_image_surface_create(CAIRO_FORMAT_RGB24, width, rows));
    check_cairo(cairo_surface_status(surface.get()), "creating a raster strip");
    {
      CairoPtr cr(cairo_create(surface.get()));
      cairo_set_source_rgb(cr.get(), 1, 1, 1);
      cairo_paint(cr.get());
      cairo_translate(cr.get(), 0, -y0);
      draw(cr.get());
      check_cairo(cairo_status(cr.get()), "drawing a raster strip");
    }
    cairo_surface_flush(surface.get());
    const unsigned char* data = cairo_image_surface_get_data(surface.get());
    int stride = cairo_image_surface_get_stride(surface.get());
    for (int y = 0; y < rows; ++y) {
      const auto* row =
          reinterpret_cast<const uint32_t*>(data + static_cast<std::size_t>(y) * stride);
      for (int x = 0; x < width; ++x) {
        uint32_t p = row[x];  // CAIRO_FORMAT_RGB24: 0x00RRGGBB in native order
        std::size_t o = (static_cast<std::size_t>(y) * width + x) * 3;
        rgb[o] = (p >> 16) & 0xff;
        rgb[o + 1] = (p >> 8) & 0xff;
        rgb[o + 2] = p & 0xff;
      }
    }
    CPLErr err = ds->RasterIO(GF_Write, 0, y0, width, rows, rgb.data(), width, rows, GDT_Byte, 3,
                              nullptr, 3, static_cast<GSpacing>(width) * 3, 1, nullptr);
    if (err != CE_None) {
      throw_input_error(shown_as, "cannot write the GeoTIFF: " +
                                      library_write_failure(path, errors.last_failure()));
    }
  }
  ds->FlushCache(true);
  ds.reset();  // GDAL 3.6 closes in the destructor and reports failures through CPLError
  if (!errors.last_failure().empty()) {
    throw_input_error(shown_as, "cannot write the GeoTIFF: " +
                                    library_write_failure(path, errors.last_failure()));
  }
  verify_geotiff(path, width, height, shown_as);
}

}  // namespace sheetmill::pdf
