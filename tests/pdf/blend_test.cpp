// A drawing composed with the multiply blend only darkens what lies under it, in the PDF (read
// back by poppler's pdftoppm, an outside renderer of ISO 32000 blend modes) and in the PNG export
// alike; a group interleaved with another keeps one optional content group.
#include <catch2/catch.hpp>
#include <cstring>
#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4  // qpdf 11: std::shared_ptr, no deprecation warning
#endif
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFObjectHandle.hh>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

// A green square (0.2, 0.8, 0.2) under a grey one (0.5) drawn with `blend`, then a second
// drawing of the "fill" group above the grey: a red bar.
void draw(pdf::LayeredCanvas& canvas, pdf::Blend blend) {
  cairo_t* cr = canvas.begin_group("fill");
  cairo_set_source_rgb(cr, 0.2, 0.8, 0.2);
  cairo_rectangle(cr, 10, 10, 40, 40);
  cairo_fill(cr);
  canvas.end_group();
  cr = canvas.begin_group("shade", blend);
  cairo_set_source_rgb(cr, 0.5, 0.5, 0.5);
  cairo_rectangle(cr, 10, 10, 80, 40);
  cairo_fill(cr);
  canvas.end_group();
  cr = canvas.begin_group("fill");
  cairo_set_source_rgb(cr, 1, 0, 0);
  cairo_rectangle(cr, 10, 60, 80, 10);
  cairo_fill(cr);
  canvas.end_group();
}

// The pixel at page (x_mm, y_mm) of a PNG rendered at 25.4 dpi (1 pixel = 1 mm).
std::array<int, 3> pixel(const std::filesystem::path& png, int x_mm, int y_mm) {
  CairoSurfacePtr s(cairo_image_surface_create_from_png(png.c_str()));
  REQUIRE(cairo_surface_status(s.get()) == CAIRO_STATUS_SUCCESS);
  cairo_surface_flush(s.get());
  const unsigned char* data = cairo_image_surface_get_data(s.get());
  const int stride = cairo_image_surface_get_stride(s.get());
  std::uint32_t v;
  std::memcpy(&v, data + y_mm * stride + x_mm * 4, 4);
  return {static_cast<int>((v >> 16) & 255), static_cast<int>((v >> 8) & 255),
          static_cast<int>(v & 255)};
}

void check_near(std::array<int, 3> got, std::array<double, 3> want) {
  INFO(got[0] << " " << got[1] << " " << got[2]);
  for (int i = 0; i < 3; ++i) CHECK(std::abs(got[i] - want[i] * 255) <= 2);
}

}  // namespace

// Multiply (ISO 32000-1 section 11.3.5: B(cb, cs) = cb x cs): green x 0.5 = (0.1, 0.4, 0.1); over
// paper, white x 0.5 = 0.5. Normal: the grey covers the green.
TEST_CASE("multiply blend in the PDF and the PNG", "[pdf][blend]") {
  test::TempDir dir("blend");
  for (pdf::Blend blend : {pdf::Blend::multiply, pdf::Blend::normal}) {
    const bool multiply = blend == pdf::Blend::multiply;
    pdf::LayeredCanvas canvas(100, 80);
    draw(canvas, blend);
    CHECK(canvas.group_names() == std::vector<std::string>{"fill", "shade"});
    CHECK(canvas.drawing_order() == std::vector<std::string>{"fill", "shade", "fill"});
    const auto pdf_path = dir / (multiply ? "m.pdf" : "n.pdf");
    canvas.finish_pdf(pdf_path, {}, {});
    const auto png_path = dir / (multiply ? "m.png" : "n.png");
    canvas.finish_png(png_path, 25.4);
    const auto stem = dir / (multiply ? "poppler-m" : "poppler-n");
    REQUIRE(test::run_command(
                {"pdftoppm", "-r", "25.4", "-singlefile", "-png", pdf_path.string(), stem.string()})
                .exit_code == 0);
    const auto poppler_png = std::filesystem::path(stem.string() + ".png");
    for (const auto& png : {png_path, poppler_png}) {
      INFO(png);
      check_near(pixel(png, 30, 30), multiply ? std::array<double, 3>{0.1, 0.4, 0.1}
                                              : std::array<double, 3>{0.5, 0.5, 0.5});
      check_near(pixel(png, 70, 30), {0.5, 0.5, 0.5});
      check_near(pixel(png, 50, 65), {1, 0, 0});  // the second "fill" drawing lies above
    }
    // One optional content group per name.
    QPDF q;
    q.processFile(pdf_path.c_str());
    CHECK(q.getRoot().getKey("/OCProperties").getKey("/OCGs").getArrayNItems() == 2);
  }
}
