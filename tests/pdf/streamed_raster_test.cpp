// Streamed rasters: the strip encoder read back by zlib's own inflate, and a PDF with a streamed
// raster read back by qpdf (stream decoding, PNG predictors included) and by GDAL's PDF driver
// (rasterised by poppler or PDFium), against the pixels the renderer produced.
#include <zlib.h>

#include <catch2/catch.hpp>

#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif
#include <gdal_priv.h>

#include <atomic>
#include <map>
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFObjectHandle.hh>
#include <set>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "sheetmill/pdf/streamed_raster.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

// A test pattern with sharp and smooth parts: what the predictor and the runs must survive.
std::uint8_t pattern(int x, int y, int c) {
  return static_cast<std::uint8_t>((x * 7 + y * 13 + c * 50 + (x / 9) * (y / 5)) & 255);
}

// Blocks of 5 x 5 cells of one colour: a renderer's smoothing, whatever its phase, leaves a
// block's centre cell its colour.
std::uint8_t blocks(int x, int y, int c) {
  return static_cast<std::uint8_t>(((x / 5) * 37 + (y / 5) * 59 + c * 50) & 255);
}

using Pattern = std::uint8_t (*)(int, int, int);

std::vector<std::uint8_t> pattern_rows(int width, int row0, int rows, int channels,
                                       Pattern f = pattern) {
  std::vector<std::uint8_t> v(static_cast<std::size_t>(width) * rows * channels);
  for (int y = 0; y < rows; ++y)
    for (int x = 0; x < width; ++x)
      for (int c = 0; c < channels; ++c)
        v[(static_cast<std::size_t>(y) * width + x) * channels + c] = f(x, row0 + y, c);
  return v;
}

}  // namespace

TEST_CASE("strips deflated on every core inflate with zlib to the rows behind the Up predictor",
          "[pdf]") {
  // Oracle: zlib's uncompress() (RFC 1950 stream, checksum checked) and the PNG Up filter as
  // RFC 2083 section 6.3 defines it (Raw(x) = Up(x) + Prior(x), modulo 256).
  for (int rows : {1, 7, 64, 333}) {
    const int width = 101, channels = 3;
    const std::size_t row_bytes = static_cast<std::size_t>(width) * channels;
    const auto data = pattern_rows(width, 0, rows, channels);
    const auto z = pdf::deflate_rows_parallel(data.data(), rows, row_bytes);
    std::vector<std::uint8_t> out(rows * (row_bytes + 1));
    uLongf out_len = out.size();
    INFO("rows " << rows);
    REQUIRE(uncompress(out.data(), &out_len, z.data(), z.size()) == Z_OK);
    REQUIRE(out_len == out.size());
    std::vector<std::uint8_t> back(data.size());
    for (int r = 0; r < rows; ++r) {
      const std::uint8_t* in = out.data() + r * (row_bytes + 1);
      REQUIRE(in[0] == 2);  // filter type Up on every row
      for (std::size_t i = 0; i < row_bytes; ++i) {
        const std::uint8_t prior = r == 0 ? 0 : back[(r - 1) * row_bytes + i];
        back[r * row_bytes + i] = static_cast<std::uint8_t>(in[i + 1] + prior);
      }
    }
    CHECK(back == data);
  }
}

TEST_CASE("a streamed raster becomes one image per strip, each rendered while the PDF is written",
          "[pdf]") {
  test::TempDir dir("streamed");
  const int width = 240, height = 100, channels = 3;
  auto calls = std::make_shared<std::atomic<int>>(0);
  pdf::LayeredCanvas canvas(120, 80);
  cairo_t* cr = canvas.begin_group("paper");
  cairo_set_source_rgb(cr, 1, 1, 1);
  cairo_paint(cr);
  canvas.end_group();
  pdf::StreamedRaster raster;
  raster.width = width;
  raster.height = height;
  raster.channels = channels;
  raster.strips = {{0, 30}, {30, 30}, {60, 30}, {90, 10}};
  raster.origin_mm = {10, 10};
  raster.px_mm = 0.4;  // 96 x 40 mm
  raster.render = [calls](int row0, int rows) {
    ++*calls;
    return pattern_rows(240, row0, rows, 3, blocks);
  };
  canvas.add_streamed_raster("relief", pdf::Blend::multiply, raster);
  CHECK(*calls == 0);  // nothing rendered before the finish
  const auto path = dir / "streamed.pdf";
  canvas.finish_pdf(path, {}, {});
  CHECK(*calls >= 4);

  // qpdf decodes every image stream (Flate with the PNG predictor): the strips in order of
  // their rows carry exactly the rendered pixels.
  QPDF pdf;
  pdf.processFile(path.c_str());
  std::vector<std::pair<int, std::string>> strips;
  for (QPDFObjectHandle obj : pdf.getAllObjects()) {
    if (!obj.isStream() || !obj.getDict().getKey("/Subtype").isNameAndEquals("/Image")) continue;
    auto dict = obj.getDict();
    CHECK(dict.getKey("/Width").getIntValue() == width);
    CHECK(dict.getKey("/Interpolate").isBool());
    auto data = obj.getStreamData(qpdf_dl_generalized);
    strips.emplace_back(
        static_cast<int>(dict.getKey("/Height").getIntValue()),
        std::string(reinterpret_cast<const char*>(data->getBuffer()), data->getSize()));
  }
  REQUIRE(strips.size() == 4);
  std::set<int> matched;
  for (const auto& [rows, bytes] : strips) {
    for (const auto& s : raster.strips) {
      if (s.rows != rows || matched.count(s.row0)) continue;
      const auto expected = pattern_rows(width, s.row0, s.rows, channels, blocks);
      if (bytes == std::string(expected.begin(), expected.end())) {
        matched.insert(s.row0);
        break;
      }
    }
  }
  CHECK(matched.size() == 4);

  // GDAL's PDF driver rasterises the page: the page pixel at a block's centre shows the block's
  // colour multiplied onto white paper, i.e. the colour itself (within 2 DN), in every strip.
  gdal_init();
  CPLSetConfigOption("GDAL_PDF_DPI", "317.5");  // 12.5 px per mm: 5 px per cell
  DatasetPtr ds(GDALDataset::Open(path.c_str(), GDAL_OF_RASTER));
  CPLSetConfigOption("GDAL_PDF_DPI", nullptr);
  REQUIRE(ds);
  int worst = 0;
  for (int cy : {2, 47, 77, 92}) {
    for (int cx : {2, 102, 202}) {
      const int px = static_cast<int>((10 + (cx + 0.5) * 0.4) * 12.5);
      const int py = static_cast<int>((10 + (cy + 0.5) * 0.4) * 12.5);
      for (int b = 1; b <= 3; ++b) {
        std::uint8_t v = 0;
        REQUIRE(ds->GetRasterBand(b)->RasterIO(GF_Read, px, py, 1, 1, &v, 1, 1, GDT_Byte, 0, 0) ==
                CE_None);
        worst = std::max(worst, std::abs(int{v} - blocks(cx, cy, b - 1)));
      }
    }
  }
  CHECK(worst <= 2);
}
