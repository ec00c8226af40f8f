#include "pdf/streamed_raster_pdf.hpp"

#include <cpl_vsi.h>
#include <fmt/format.h>
#include <gdal.h>

#include <algorithm>
#include <array>
#include <cmath>
#include <map>
#include <qpdf/Buffer.hh>
#include <qpdf/Pipeline.hh>
#include <qpdf/QPDFObjectHandle.hh>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"

namespace sheetmill::pdf {

namespace {

// A placeholder is 8 x 2 RGB pixels: fifteen of the magic colour and, last in the first row, the
// tag in green and blue behind a marker red. Nothing else on a sheet is an 8 x 2 image of these.
constexpr int kTagW = 8, kTagH = 2;
constexpr std::array<std::uint8_t, 3> kMagic{0x3c, 0xa5, 0x5a};
constexpr std::uint8_t kTagMarker = 0x2b;

CairoSurfacePtr placeholder(int tag) {
  CairoSurfacePtr s(cairo_image_surface_create(CAIRO_FORMAT_RGB24, kTagW, kTagH));
  check_cairo(cairo_surface_status(s.get()), "raster placeholder");
  cairo_surface_flush(s.get());
  unsigned char* data = cairo_image_surface_get_data(s.get());
  const int stride = cairo_image_surface_get_stride(s.get());
  for (int y = 0; y < kTagH; ++y) {
    auto* row = reinterpret_cast<std::uint32_t*>(data + y * stride);
    for (int x = 0; x < kTagW; ++x) {
      std::uint32_t v =
          (std::uint32_t{kMagic[0]} << 16) | (std::uint32_t{kMagic[1]} << 8) | kMagic[2];
      if (y == 0 && x == kTagW - 1) {
        v = (std::uint32_t{kTagMarker} << 16) | static_cast<std::uint32_t>(tag & 0xffff);
      }
      row[x] = v;
    }
  }
  cairo_surface_mark_dirty(s.get());
  return s;
}

// The tag a placeholder's decoded pixels carry, or -1 when they are not a placeholder.
long placeholder_tag(const unsigned char* rgb, std::size_t size) {
  if (size != static_cast<std::size_t>(kTagW * kTagH * 3)) return -1;
  long tag = -1;
  for (int i = 0; i < kTagW * kTagH; ++i) {
    const unsigned char* p = rgb + 3 * i;
    if (i == kTagW - 1) {
      if (p[0] != kTagMarker) return -1;
      tag = (long{p[1]} << 8) | p[2];
    } else if (p[0] != kMagic[0] || p[1] != kMagic[1] || p[2] != kMagic[2]) {
      return -1;
    }
  }
  return tag;
}

void ring_path(cairo_t* cr, const std::vector<Point>& ring) {
  for (std::size_t i = 0; i < ring.size(); ++i) {
    if (i == 0)
      cairo_move_to(cr, ring[i].x, ring[i].y);
    else
      cairo_line_to(cr, ring[i].x, ring[i].y);
  }
  cairo_close_path(cr);
}

// A strip as a baseline JPEG in memory, through GDAL's JPEG driver (libjpeg).
std::string encode_jpeg(const std::vector<std::uint8_t>& pixels, int width, int rows, int channels,
                        int quality) {
  gdal_init();
  GDALDriverH mem = GDALGetDriverByName("MEM");
  GDALDriverH jpeg = GDALGetDriverByName("JPEG");
  if (!mem || !jpeg) throw_internal_error("GDAL lacks the MEM or JPEG driver");
  GdalErrorScope errors;
  GDALDatasetH src = GDALCreate(mem, "", width, rows, channels, GDT_Byte, nullptr);
  if (!src) throw_internal_error("raster strip: cannot create a MEM dataset");
  DatasetPtr src_owner(GDALDataset::FromHandle(src));
  // Pixel-interleaved straight from our buffer.
  int bands[3] = {1, 2, 3};
  if (GDALDatasetRasterIO(src, GF_Write, 0, 0, width, rows,
                          const_cast<std::uint8_t*>(pixels.data()), width, rows, GDT_Byte, channels,
                          bands, channels, static_cast<GSpacing>(channels) * width, 1) != CE_None) {
    throw_internal_error("raster strip: " + errors.last_failure());
  }
  const std::string path =
      fmt::format("/vsimem/sheetmill-strip-{}.jpg", reinterpret_cast<std::uintptr_t>(&pixels));
  const std::string q = fmt::format("QUALITY={}", quality);
  const char* options[] = {q.c_str(), nullptr};
  GDALDatasetH out =
      GDALCreateCopy(jpeg, path.c_str(), src, FALSE, const_cast<char**>(options), nullptr, nullptr);
  if (!out) throw_internal_error("raster strip JPEG: " + errors.last_failure());
  GDALClose(out);
  vsi_l_offset size = 0;
  GByte* bytes = VSIGetMemFileBuffer(path.c_str(), &size, FALSE);
  std::string data(reinterpret_cast<const char*>(bytes), static_cast<std::size_t>(size));
  VSIUnlink(path.c_str());
  return data;
}

class StripProvider : public QPDFObjectHandle::StreamDataProvider {
 public:
  struct Source {
    const StreamedRaster* raster;
    std::size_t strip;
  };
  void add(QPDFObjGen og, Source s) { sources_[og] = s; }

  void provideStreamData(QPDFObjGen const& og, Pipeline* pipeline) override {
    auto it = sources_.find(og);
    if (it == sources_.end()) throw_internal_error("raster stream without a strip");
    const StreamedRaster& r = *it->second.raster;
    const StreamedRaster::Strip& s = r.strips[it->second.strip];
    std::vector<std::uint8_t> pixels = r.render(s.row0, s.rows);
    const std::size_t row_bytes = static_cast<std::size_t>(r.width) * r.channels;
    if (pixels.size() != row_bytes * s.rows) throw_internal_error("raster strip of the wrong size");
    if (r.compression == RasterCompression::jpeg) {
      const std::string jpg = encode_jpeg(pixels, r.width, s.rows, r.channels, r.jpeg_quality);
      pipeline->write(reinterpret_cast<const unsigned char*>(jpg.data()), jpg.size());
    } else {
      const std::vector<std::uint8_t> z =
          deflate_rows_parallel(pixels.data(), static_cast<std::size_t>(s.rows), row_bytes);
      pipeline->write(z.data(), z.size());
    }
    pipeline->finish();
  }

 private:
  std::map<QPDFObjGen, Source> sources_;
};

}  // namespace

int paint_placeholders(cairo_t* cr, const StreamedRaster& raster, int first_tag) {
  if (first_tag + raster.strips.size() > 0xffff) throw_internal_error("too many raster strips");
  cairo_save(cr);
  if (raster.clip_page_mm.size() >= 3) {
    cairo_new_path(cr);
    ring_path(cr, raster.clip_page_mm);
    cairo_clip(cr);
  }
  int tag = first_tag;
  for (const StreamedRaster::Strip& s : raster.strips) {
    CairoSurfacePtr image = placeholder(tag++);
    cairo_save(cr);
    // The strip's rectangle on the page: the image fills it whatever its pixel count, so the
    // placeholder's place is exactly where the strip will be. Strip i ends where strip i + 1
    // begins, both computed from the same row index.
    cairo_translate(cr, raster.origin_mm.x, raster.origin_mm.y + s.row0 * raster.px_mm);
    cairo_scale(cr, raster.width * raster.px_mm / kTagW, s.rows * raster.px_mm / kTagH);
    cairo_set_source_surface(cr, image.get(), 0, 0);
    cairo_pattern_set_filter(cairo_get_source(cr), CAIRO_FILTER_NEAREST);
    cairo_paint(cr);
    cairo_restore(cr);
  }
  cairo_restore(cr);
  return tag;
}

void substitute_placeholders(QPDF& pdf, const std::vector<const StreamedRaster*>& rasters) {
  std::vector<StripProvider::Source> by_tag;
  for (const StreamedRaster* r : rasters) {
    for (std::size_t i = 0; i < r->strips.size(); ++i) by_tag.push_back({r, i});
  }
  if (by_tag.empty()) return;
  auto provider = std::make_shared<StripProvider>();
  std::vector<bool> seen(by_tag.size(), false);
  for (QPDFObjectHandle obj : pdf.getAllObjects()) {
    if (!obj.isStream()) continue;
    QPDFObjectHandle dict = obj.getDict();
    if (!dict.getKey("/Subtype").isNameAndEquals("/Image")) continue;
    if (!dict.getKey("/Width").isInteger() || dict.getKey("/Width").getIntValue() != kTagW ||
        !dict.getKey("/Height").isInteger() || dict.getKey("/Height").getIntValue() != kTagH) {
      continue;
    }
    auto data = obj.getStreamData(qpdf_dl_generalized);
    const long tag = placeholder_tag(data->getBuffer(), data->getSize());
    if (tag < 0 || static_cast<std::size_t>(tag) >= by_tag.size()) continue;
    seen[static_cast<std::size_t>(tag)] = true;
    const StripProvider::Source& src = by_tag[static_cast<std::size_t>(tag)];
    const StreamedRaster& r = *src.raster;
    provider->add(obj.getObjGen(), src);
    if (r.compression == RasterCompression::jpeg) {
      obj.replaceStreamData(provider, QPDFObjectHandle::newName("/DCTDecode"),
                            QPDFObjectHandle::newNull());
    } else {
      auto parms = QPDFObjectHandle::newDictionary();
      parms.replaceKey("/Predictor", QPDFObjectHandle::newInteger(12));
      parms.replaceKey("/Colors", QPDFObjectHandle::newInteger(r.channels));
      parms.replaceKey("/BitsPerComponent", QPDFObjectHandle::newInteger(8));
      parms.replaceKey("/Columns", QPDFObjectHandle::newInteger(r.width));
      obj.replaceStreamData(provider, QPDFObjectHandle::newName("/FlateDecode"), parms);
    }
    dict.replaceKey("/Width", QPDFObjectHandle::newInteger(r.width));
    dict.replaceKey("/Height", QPDFObjectHandle::newInteger(r.strips[src.strip].rows));
    dict.replaceKey("/ColorSpace",
                    QPDFObjectHandle::newName(r.channels == 1 ? "/DeviceGray" : "/DeviceRGB"));
    dict.replaceKey("/BitsPerComponent", QPDFObjectHandle::newInteger(8));
    // Relief cells sample a continuous surface: viewers may smooth them when zoomed in.
    dict.replaceKey("/Interpolate", QPDFObjectHandle::newBool(true));
    dict.removeKey("/SMask");
  }
  for (std::size_t i = 0; i < seen.size(); ++i) {
    if (!seen[i]) throw_internal_error(fmt::format("raster strip {} missing from the PDF", i));
  }
}

void paint_streamed(cairo_t* cr, const StreamedRaster& raster) {
  if (raster.strips.empty() || !(raster.px_mm > 0)) return;
  double x0, y0, x1, y1;
  cairo_clip_extents(cr, &x0, &y0, &x1, &y1);
  // Rows whose cells reach into the clip, in whole strips.
  const double top = (y0 - raster.origin_mm.y) / raster.px_mm;
  const double bottom = (y1 - raster.origin_mm.y) / raster.px_mm;
  // Smoothing at a strip join reads the next strip's rows: render a few rows beyond each strip
  // (enough for Cairo's widest filter at the exports' scales) and show the strip's own rows only.
  constexpr int kOverlap = 4;
  cairo_save(cr);
  if (raster.clip_page_mm.size() >= 3) {
    cairo_new_path(cr);
    ring_path(cr, raster.clip_page_mm);
    cairo_clip(cr);
  }
  for (const StreamedRaster::Strip& s : raster.strips) {
    if (s.row0 + s.rows < top - 1 || s.row0 > bottom + 1) continue;
    const int r0 = std::max(0, s.row0 - kOverlap);
    const int r1 = std::min(raster.height, s.row0 + s.rows + kOverlap);
    std::vector<std::uint8_t> pixels = raster.render(r0, r1 - r0);
    CairoSurfacePtr image(cairo_image_surface_create(CAIRO_FORMAT_RGB24, raster.width, r1 - r0));
    check_cairo(cairo_surface_status(image.get()), "raster strip");
    cairo_surface_flush(image.get());
    unsigned char* data = cairo_image_surface_get_data(image.get());
    const int stride = cairo_image_surface_get_stride(image.get());
    for (int y = 0; y < r1 - r0; ++y) {
      auto* row = reinterpret_cast<std::uint32_t*>(data + static_cast<std::size_t>(y) * stride);
      const std::uint8_t* p =
          pixels.data() + static_cast<std::size_t>(y) * raster.width * raster.channels;
      for (int x = 0; x < raster.width; ++x) {
        if (raster.channels == 1) {
          const std::uint32_t g = p[x];
          row[x] = g << 16 | g << 8 | g;
        } else {
          row[x] = std::uint32_t{p[3 * x]} << 16 | std::uint32_t{p[3 * x + 1]} << 8 | p[3 * x + 2];
        }
      }
    }
    cairo_surface_mark_dirty(image.get());
    cairo_save(cr);
    cairo_rectangle(cr, raster.origin_mm.x, raster.origin_mm.y + s.row0 * raster.px_mm,
                    raster.width * raster.px_mm, s.rows * raster.px_mm);
    cairo_clip(cr);
    cairo_translate(cr, raster.origin_mm.x, raster.origin_mm.y + r0 * raster.px_mm);
    cairo_scale(cr, raster.px_mm, raster.px_mm);
    cairo_set_source_surface(cr, image.get(), 0, 0);
    cairo_pattern_set_filter(cairo_get_source(cr), CAIRO_FILTER_GOOD);
    cairo_pattern_set_extend(cairo_get_source(cr), CAIRO_EXTEND_PAD);
    cairo_paint(cr);
    cairo_restore(cr);
  }
  cairo_restore(cr);
}

}  // namespace sheetmill::pdf
