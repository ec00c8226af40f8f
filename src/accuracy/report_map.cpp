// The report's data (the hillshade window under the points) and its file (PDF or PNG).
#include <cairo-pdf.h>

#include <algorithm>
#include <cmath>

#include "sheetmill/accuracy/report_page.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/terrain/shade.hpp"

namespace sheetmill::accuracy {

namespace {

// The map panel's shape (width / height), kept in step with report_page.cpp's layout.
constexpr double kMapAspect = 160.0 / 160.0;

Box points_extent(const Assessment& a) {
  Box b;
  for (const Residual& r : a.residuals) {
    if (r.status == PointStatus::used) b.add(r.xy);
  }
  return b;
}

}  // namespace

ReportMap prepare_report_map(const Assessment& a, const terrain::DemReadOptions& dem_options) {
  const Box dem_box = a.dem_grid.bounds();
  Box b = points_extent(a);
  // A margin around the points, at least a few DEM cells, and the panel's aspect ratio.
  double pad = std::max(
      {0.08 * std::max(b.width(), b.height()), 10 * a.dem_grid.cell_x(), 10 * a.dem_grid.cell_y()});
  b = Box::of(b.min_x - pad, b.min_y - pad, b.max_x + pad, b.max_y + pad);
  if (b.width() / b.height() < kMapAspect) {
    double grow = (b.height() * kMapAspect - b.width()) / 2;
    b = Box::of(b.min_x - grow, b.min_y, b.max_x + grow, b.max_y);
  } else {
    double grow = (b.width() / kMapAspect - b.height()) / 2;
    b = Box::of(b.min_x, b.min_y - grow, b.max_x, b.max_y + grow);
  }
  // Within the DEM: the panel fits the window and keeps its shape.
  b = Box::of(std::max(b.min_x, dem_box.min_x), std::max(b.min_y, dem_box.min_y),
              std::min(b.max_x, dem_box.max_x), std::min(b.max_y, dem_box.max_y));
  ReportMap m;
  double cell = std::max({b.width() / kReportMapCells, b.height() / kReportMapCells,
                          std::min(a.dem_grid.cell_x(), a.dem_grid.cell_y())});
  m.grid.width = std::max(1, static_cast<int>(std::ceil(b.width() / cell)));
  m.grid.height = std::max(1, static_cast<int>(std::ceil(b.height() / cell)));
  m.grid.geotransform[0] = b.min_x;
  m.grid.geotransform[1] = cell;
  m.grid.geotransform[3] = b.max_y;
  m.grid.geotransform[5] = -cell;
  m.grid.crs_wkt = a.dem_grid.crs_wkt;
  terrain::Dem dem = terrain::read_dem_window(a.dem_path, m.grid, dem_options);
  m.shade = terrain::hillshade(dem, terrain::ShadeParams{});
  return m;
}

void write_report(const Assessment& a, const std::filesystem::path& out,
                  const terrain::DemReadOptions& dem_options) {
  std::string ext = out.extension().string();
  for (auto& c : ext) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  if (ext != ".pdf" && ext != ".png") {
    throw_input_error(out.string(), "expected a report file ending in .pdf or .png");
  }
  ReportMap map = prepare_report_map(a, dem_options);
  text::FontCache fonts;
  AtomicOutput file(out);
  constexpr double kPtPerMm = 72 / 25.4;
  constexpr double kPngDpi = 150;
  {
    CairoSurfacePtr surface;
    double px_per_mm = 0;
    if (ext == ".pdf") {
      surface.reset(cairo_pdf_surface_create(file.temp_path().c_str(), kReportWidthMm * kPtPerMm,
                                             kReportHeightMm * kPtPerMm));
      px_per_mm = kPtPerMm;
    } else {
      px_per_mm = kPngDpi / 25.4;
      surface.reset(cairo_image_surface_create(
          CAIRO_FORMAT_RGB24, static_cast<int>(std::lround(kReportWidthMm * px_per_mm)),
          static_cast<int>(std::lround(kReportHeightMm * px_per_mm))));
    }
    check_cairo(cairo_surface_status(surface.get()), "report surface");
    CairoPtr cr(cairo_create(surface.get()));
    cairo_scale(cr.get(), px_per_mm, px_per_mm);
    draw_report_page(cr.get(), a, map, fonts);
    check_cairo(cairo_status(cr.get()), "report page");
    cr.reset();
    if (ext == ".png") {
      check_cairo(cairo_surface_write_to_png(surface.get(), file.temp_path().c_str()),
                  "report PNG");
    }
    cairo_surface_finish(surface.get());
    check_cairo(cairo_surface_status(surface.get()), "report file");
  }
  file.commit();
}

}  // namespace sheetmill::accuracy
