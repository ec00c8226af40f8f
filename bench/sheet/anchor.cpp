// The anchor of the sheet benchmark: the floor any Cairo renderer pays for an A1 sheet at 300 dpi.
// A plain Cairo program, no sheetmill code: one grey raster of 9213 x 6378 cells (the relief grid
// of the demo project's A1 frame at 300 dpi) painted through Cairo's default image path into a PDF
// (Cairo deflates it; an all-grey RGB24 surface is written as DeviceGray), and 20 000 short
// stroked paths (the order of a sheet's contour and road pieces).
// Usage: sheet_anchor OUT.pdf [WIDTH HEIGHT PATHS]
#include <cairo-pdf.h>
#include <cairo.h>

#include <cmath>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <string>
#include <vector>

int main(int argc, char** argv) {
  if (argc < 2) {
    std::fprintf(stderr, "usage: sheet_anchor OUT.pdf [WIDTH HEIGHT PATHS]\n");
    return 2;
  }
  const int w = argc > 3 ? std::atoi(argv[2]) : 9213;
  const int h = argc > 3 ? std::atoi(argv[3]) : 6378;
  const int paths = argc > 4 ? std::atoi(argv[4]) : 20000;
  const double page_w_mm = 841, page_h_mm = 594, pt_per_mm = 72 / 25.4;
  const double frame_w_mm = 780, frame_h_mm = frame_w_mm * h / w;

  cairo_surface_t* pdf =
      cairo_pdf_surface_create(argv[1], page_w_mm * pt_per_mm, page_h_mm * pt_per_mm);
  cairo_t* cr = cairo_create(pdf);
  cairo_scale(cr, pt_per_mm, pt_per_mm);

  // A smooth grey relief-like field (sums of sines, from tables so that making the pixels costs
  // little next to Cairo's work): compresses like a hillshade, not like noise.
  cairo_surface_t* img = cairo_image_surface_create(CAIRO_FORMAT_RGB24, w, h);
  unsigned char* data = cairo_image_surface_get_data(img);
  const int stride = cairo_image_surface_get_stride(img);
  std::vector<double> sx(w), cy(h), diag(w + 2 * h), anti(3 * w + h);
  for (int x = 0; x < w; ++x) sx[x] = 0.2 * std::sin(x * 0.013);
  for (int y = 0; y < h; ++y) cy[y] = std::cos(y * 0.011);
  for (std::size_t i = 0; i < diag.size(); ++i) diag[i] = 0.1 * std::sin(i * 0.051);
  for (std::size_t i = 0; i < anti.size(); ++i) anti[i] = 0.05 * std::sin((i - h) * 0.17);
  for (int y = 0; y < h; ++y) {
    auto* row = reinterpret_cast<std::uint32_t*>(data + static_cast<std::size_t>(y) * stride);
    for (int x = 0; x < w; ++x) {
      const double v = 0.5 + sx[x] * cy[y] + diag[x + 2 * y] + anti[3 * x - y + h];
      const auto g = static_cast<std::uint32_t>(std::fmin(1.0, std::fmax(0.0, v)) * 255 + 0.5);
      row[x] = (g << 16) | (g << 8) | g;
    }
  }
  cairo_surface_mark_dirty(img);
  cairo_save(cr);
  cairo_translate(cr, 30, 30);
  cairo_scale(cr, frame_w_mm / w, frame_h_mm / h);
  cairo_set_source_surface(cr, img, 0, 0);
  cairo_paint(cr);
  cairo_restore(cr);

  // Short paths: five-vertex polylines a few millimetres long, scattered over the frame.
  std::uint32_t seed = 12345;
  auto rnd = [&] {
    seed = seed * 1664525u + 1013904223u;
    return (seed >> 8) / 16777216.0;
  };
  cairo_set_line_width(cr, 0.18);
  cairo_set_source_rgb(cr, 0.6, 0.35, 0.15);
  for (int i = 0; i < paths; ++i) {
    double x = 30 + rnd() * frame_w_mm, y = 30 + rnd() * frame_h_mm;
    cairo_move_to(cr, x, y);
    for (int k = 0; k < 4; ++k) {
      x += (rnd() - 0.5) * 3;
      y += (rnd() - 0.5) * 3;
      cairo_line_to(cr, x, y);
    }
    cairo_stroke(cr);
  }
  cairo_show_page(cr);
  cairo_destroy(cr);
  cairo_surface_finish(pdf);
  const cairo_status_t status = cairo_surface_status(pdf);
  cairo_surface_destroy(pdf);
  cairo_surface_destroy(img);
  if (status != CAIRO_STATUS_SUCCESS) {
    std::fprintf(stderr, "sheet_anchor: %s\n", cairo_status_to_string(status));
    return 1;
  }
  return 0;
}
