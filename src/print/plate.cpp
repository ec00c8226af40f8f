#include "sheetmill/print/plate.hpp"

#include <cairo.h>
#include <gdal_priv.h>

#include <algorithm>
#include <cmath>
#include <numbers>
#include <vector>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::print {

namespace {

constexpr int kStripRows = 256;

// Registration marks (a circle with a cross through it, common practice) centred in the
// margin at the middle of each edge, and the label along the top margin; page mm.
void draw_marks(cairo_t* cr, double w_mm, double h_mm, const PlateMarks& m) {
  const double at = m.margin_mm / 2, r = std::min(2.5, m.margin_mm * 0.3), arm = r * 1.5;
  cairo_set_source_rgba(cr, 0, 0, 0, 1);  // A8: full coverage
  cairo_set_line_width(cr, 0.1);
  const Point centres[4] = {
      {w_mm / 2, at}, {w_mm / 2, h_mm - at}, {at, h_mm / 2}, {w_mm - at, h_mm / 2}};
  for (Point c : centres) {
    cairo_new_sub_path(cr);
    cairo_arc(cr, c.x, c.y, r, 0, 2 * std::numbers::pi);
    cairo_move_to(cr, c.x - arm, c.y);
    cairo_line_to(cr, c.x + arm, c.y);
    cairo_move_to(cr, c.x, c.y - arm);
    cairo_line_to(cr, c.x, c.y + arm);
    cairo_stroke(cr);
  }
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL, CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, std::min(2.5, m.margin_mm * 0.3));
  cairo_move_to(cr, m.margin_mm, at + 0.9);
  cairo_show_text(cr, m.label.c_str());
}

}  // namespace

void write_plate(const std::filesystem::path& plate_render, const std::filesystem::path& out,
                 const PlateMarks& marks, const std::string& shown_as) {
  gdal_init();
  GdalErrorScope errors;
  DatasetPtr src(GDALDataset::Open(plate_render.c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY));
  if (!src || src->GetRasterCount() < 3) throw_internal_error("the plate render does not open");
  const int w = src->GetRasterXSize(), h = src->GetRasterYSize();
  GDALDriver* driver = GetGDALDriverManager()->GetDriverByName("GTiff");
  const char* options[] = {"COMPRESS=DEFLATE", "PHOTOMETRIC=MINISWHITE", nullptr};
  DatasetPtr dst(driver->Create(out.c_str(), w, h, 1, GDT_Byte, const_cast<char**>(options)));
  if (!dst) {
    throw_input_error(
        shown_as, "cannot create the plate: " + library_write_failure(out, errors.last_failure()));
  }
  double gt[6];
  if (src->GetGeoTransform(gt) == CE_None) dst->SetGeoTransform(gt);
  if (const OGRSpatialReference* srs = src->GetSpatialRef()) dst->SetSpatialRef(srs);
  const std::string dpi = std::to_string(static_cast<int>(std::lround(marks.dpi)));
  dst->SetMetadataItem("TIFFTAG_XRESOLUTION", dpi.c_str());
  dst->SetMetadataItem("TIFFTAG_YRESOLUTION", dpi.c_str());
  dst->SetMetadataItem("TIFFTAG_RESOLUTIONUNIT", "2");  // inches
  dst->SetMetadataItem("TIFFTAG_IMAGEDESCRIPTION", marks.label.c_str());

  const double px_per_mm = marks.dpi / kMmPerInch;
  std::vector<unsigned char> rgb(static_cast<std::size_t>(w) * kStripRows * 3);
  std::vector<unsigned char> cover(static_cast<std::size_t>(w) * kStripRows);
  for (int y0 = 0; y0 < h; y0 += kStripRows) {
    const int rows = std::min(kStripRows, h - y0);
    if (src->RasterIO(GF_Read, 0, y0, w, rows, rgb.data(), w, rows, GDT_Byte, 3, nullptr, 3,
                      static_cast<GSpacing>(w) * 3, 1, nullptr) != CE_None) {
      throw_internal_error("cannot read the plate render");
    }
    CairoSurfacePtr mask(cairo_image_surface_create(CAIRO_FORMAT_A8, w, rows));
    check_cairo(cairo_surface_status(mask.get()), "creating the plate marks");
    {
      CairoPtr cr(cairo_create(mask.get()));
      cairo_translate(cr.get(), 0, -y0);
      cairo_scale(cr.get(), px_per_mm, px_per_mm);
      draw_marks(cr.get(), w / px_per_mm, h / px_per_mm, marks);
      check_cairo(cairo_status(cr.get()), "drawing the plate marks");
    }
    cairo_surface_flush(mask.get());
    const unsigned char* m = cairo_image_surface_get_data(mask.get());
    const int stride = cairo_image_surface_get_stride(mask.get());
    for (int y = 0; y < rows; ++y) {
      for (int x = 0; x < w; ++x) {
        std::size_t i = static_cast<std::size_t>(y) * w + x;
        // The render is grey: coverage is what the grey leaves out of white.
        int grey = (rgb[3 * i] + rgb[3 * i + 1] + rgb[3 * i + 2] + 1) / 3;
        cover[i] = static_cast<unsigned char>(
            std::max<int>(255 - grey, m[static_cast<std::size_t>(y) * stride + x]));
      }
    }
    if (dst->RasterIO(GF_Write, 0, y0, w, rows, cover.data(), w, rows, GDT_Byte, 1, nullptr, 1, w,
                      1, nullptr) != CE_None) {
      throw_input_error(
          shown_as, "cannot write the plate: " + library_write_failure(out, errors.last_failure()));
    }
  }
  dst->FlushCache(true);
  dst.reset();
  if (!errors.last_failure().empty()) {
    throw_input_error(
        shown_as, "cannot write the plate: " + library_write_failure(out, errors.last_failure()));
  }
}

double mean_coverage(const std::filesystem::path& plate) {
  gdal_init();
  GdalErrorScope errors;
  DatasetPtr ds(GDALDataset::Open(plate.c_str(), GDAL_OF_RASTER | GDAL_OF_READONLY));
  if (!ds) throw_internal_error("the plate does not open again: " + plate.string());
  // Read row by row rather than with GDAL's statistics, which would leave an .aux.xml beside it.
  const int w = ds->GetRasterXSize(), h = ds->GetRasterYSize();
  std::vector<unsigned char> row(static_cast<std::size_t>(w));
  double sum = 0;
  for (int y = 0; y < h; ++y) {
    if (ds->GetRasterBand(1)->RasterIO(GF_Read, 0, y, w, 1, row.data(), w, 1, GDT_Byte, 0, 0,
                                       nullptr) != CE_None) {
      throw_internal_error("the plate does not read back whole: " + plate.string());
    }
    for (unsigned char v : row) sum += v;
  }
  return w > 0 && h > 0 ? sum / (255.0 * w * h) : 0;
}

}  // namespace sheetmill::print
