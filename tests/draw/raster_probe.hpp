#pragma once
// A small cairo image surface in page millimetres for measuring what the draw functions put on
// paper: `px_per_mm` pixels per millimetre, white background, ARGB32.

#include <cairo.h>

#include <cstdint>

#include "sheetmill/core/handles.hpp"

namespace sheetmill::test {

class RasterProbe {
 public:
  RasterProbe(double width_mm, double height_mm, double px_per_mm)
      : px_per_mm_(px_per_mm),
        surface_(cairo_image_surface_create(CAIRO_FORMAT_ARGB32,
                                            static_cast<int>(width_mm * px_per_mm),
                                            static_cast<int>(height_mm * px_per_mm))),
        cr_(cairo_create(surface_.get())) {
    cairo_set_source_rgb(cr_.get(), 1, 1, 1);
    cairo_paint(cr_.get());
    cairo_scale(cr_.get(), px_per_mm, px_per_mm);
  }
  cairo_t* cr() { return cr_.get(); }
  int width() const { return cairo_image_surface_get_width(surface_.get()); }
  int height() const { return cairo_image_surface_get_height(surface_.get()); }
  // Darkness 0 (white) .. 1 (black) of the pixel's green channel.
  double ink(int x, int y) {
    cairo_surface_flush(surface_.get());
    const unsigned char* d = cairo_image_surface_get_data(surface_.get());
    int stride = cairo_image_surface_get_stride(surface_.get());
    uint32_t v = *reinterpret_cast<const uint32_t*>(d + y * stride + 4 * x);
    return 1.0 - ((v >> 8) & 0xff) / 255.0;
  }
  double px_per_mm() const { return px_per_mm_; }

 private:
  double px_per_mm_;
  CairoSurfacePtr surface_;
  CairoPtr cr_;
};

}  // namespace sheetmill::test
