#include "sheetmill/exhibit/pdf_relief.hpp"

#include <cpl_vsi.h>
#include <gdal.h>
// qpdf 11: use std::shared_ptr throughout, no PointerHolder.
#define POINTERHOLDER_TRANSITION 4
#include <fmt/format.h>

#include <array>
#include <atomic>
#include <map>
#include <qpdf/Buffer.hh>
#include <qpdf/Pipeline.hh>
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFObjectHandle.hh>
#include <qpdf/QPDFWriter.hh>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"

namespace sheetmill::exhibit {

namespace {

// A placeholder is 8 x 2 RGB pixels: seven of the magic colour and, last in the first row, the
// strip index in green and blue. Nothing else on an exhibit is an 8 x 2 image.
constexpr int kTagW = 8, kTagH = 2;
constexpr std::array<std::uint8_t, 3> kMagic{0x5a, 0xa5, 0x3c};

CairoSurfacePtr placeholder(std::size_t index) {
  CairoSurfacePtr s(cairo_image_surface_create(CAIRO_FORMAT_RGB24, kTagW, kTagH));
  check_cairo(cairo_surface_status(s.get()), "relief placeholder");
  cairo_surface_flush(s.get());
  unsigned char* data = cairo_image_surface_get_data(s.get());
  const int stride = cairo_image_surface_get_stride(s.get());
  for (int y = 0; y < kTagH; ++y) {
    auto* row = reinterpret_cast<std::uint32_t*>(data + y * stride);
    for (int x = 0; x < kTagW; ++x) {
      std::uint32_t v =
          (std::uint32_t{kMagic[0]} << 16) | (std::uint32_t{kMagic[1]} << 8) | kMagic[2];
      if (y == 0 && x == kTagW - 1) v = (0x11u << 16) | static_cast<std::uint32_t>(index & 0xffff);
      row[x] = v;
    }
  }
  cairo_surface_mark_dirty(s.get());
  return s;
}

// The strip index a placeholder's decoded pixels carry, or -1 when they are not a placeholder.
long placeholder_index(const std::string& rgb) {
  if (rgb.size() != static_cast<std::size_t>(kTagW * kTagH * 3)) return -1;
  long index = -1;
  for (int i = 0; i < kTagW * kTagH; ++i) {
    const auto* p = reinterpret_cast<const std::uint8_t*>(rgb.data()) + 3 * i;
    if (i == kTagW - 1) {
      if (p[0] != 0x11) return -1;
      index = (long{p[1]} << 8) | p[2];
    } else if (p[0] != kMagic[0] || p[1] != kMagic[1] || p[2] != kMagic[2]) {
      return -1;
    }
  }
  return index;
}

// A strip as a JPEG file in memory, through GDAL's JPEG driver (libjpeg, baseline, 4:2:0).
std::string encode_jpeg(const std::vector<std::uint8_t>& rgb, int width, int rows, int quality,
                        std::size_t index) {
  gdal_init();
  GDALDriverH mem = GDALGetDriverByName("MEM");
  GDALDriverH jpeg = GDALGetDriverByName("JPEG");
  if (!mem || !jpeg) throw_internal_error("GDAL lacks the MEM or JPEG driver");
  GdalErrorScope errors;
  GDALDatasetH src = GDALCreate(mem, "", width, rows, 3, GDT_Byte, nullptr);
  if (!src) throw_internal_error("relief strip: cannot create a MEM dataset");
  DatasetPtr src_owner(GDALDataset::FromHandle(src));
  // Pixel-interleaved RGB straight from our buffer: band stride 1, pixel stride 3.
  int bands[3] = {1, 2, 3};
  if (GDALDatasetRasterIO(src, GF_Write, 0, 0, width, rows, const_cast<std::uint8_t*>(rgb.data()),
                          width, rows, GDT_Byte, 3, bands, 3, 3L * width, 1) != CE_None) {
    throw_internal_error("relief strip: " + errors.last_failure());
  }
  const std::string path = fmt::format("/vsimem/sheetmill-exhibit-strip-{}-{}.jpg",
                                       reinterpret_cast<std::uintptr_t>(&rgb), index);
  const std::string q = fmt::format("QUALITY={}", quality);
  const char* options[] = {q.c_str(), nullptr};
  GDALDatasetH out =
      GDALCreateCopy(jpeg, path.c_str(), src, FALSE, const_cast<char**>(options), nullptr, nullptr);
  if (!out) throw_internal_error("relief strip JPEG: " + errors.last_failure());
  GDALClose(out);
  vsi_l_offset size = 0;
  GByte* bytes = VSIGetMemFileBuffer(path.c_str(), &size, FALSE);
  std::string data(reinterpret_cast<const char*>(bytes), static_cast<std::size_t>(size));
  VSIUnlink(path.c_str());
  return data;
}

class StripProvider : public QPDFObjectHandle::StreamDataProvider {
 public:
  StripProvider(const ReliefPlan& plan, ReliefCompression compression, int quality)
      : plan_(plan), compression_(compression), quality_(quality) {}

  void add(QPDFObjGen og, std::size_t index) { strip_of_[og] = index; }
  long renders() const { return renders_; }

  void provideStreamData(QPDFObjGen const& og, Pipeline* pipeline) override {
    auto it = strip_of_.find(og);
    if (it == strip_of_.end()) throw_internal_error("relief stream without a strip");
    ++renders_;
    const std::size_t index = it->second;
    std::vector<std::uint8_t> rgb = render_strip_rgb(plan_, index);
    if (compression_ == ReliefCompression::jpeg) {
      std::string jpg =
          encode_jpeg(rgb, plan_.grid.width, plan_.strips[index].rows, quality_, index);
      std::vector<std::uint8_t>().swap(rgb);
      pipeline->write(reinterpret_cast<const unsigned char*>(jpg.data()), jpg.size());
    } else {
      pipeline->write(rgb.data(), rgb.size());
    }
    pipeline->finish();
  }

 private:
  const ReliefPlan& plan_;
  ReliefCompression compression_;
  int quality_;
  std::map<QPDFObjGen, std::size_t> strip_of_;
  long renders_ = 0;
};

}  // namespace

void paint_relief_placeholders(cairo_t* cr, const ReliefPlan& plan, const Box& clip_mm) {
  if (plan.strips.size() > 0xffff) throw_internal_error("too many relief strips");
  cairo_save(cr);
  cairo_rectangle(cr, clip_mm.min_x, clip_mm.min_y, clip_mm.width(), clip_mm.height());
  cairo_clip(cr);
  for (std::size_t i = 0; i < plan.strips.size(); ++i) {
    const ReliefStrip& s = plan.strips[i];
    CairoSurfacePtr tag = placeholder(i);
    cairo_save(cr);
    // The strip's rectangle on the page; the image fills it whatever its pixel count, so the
    // placeholder's place is exactly where the real strip will be. Strips abut: strip i ends
    // where strip i + 1 begins, both computed from the same row index.
    cairo_translate(cr, plan.origin_mm.x, plan.origin_mm.y + s.row0 * plan.px_mm);
    cairo_scale(cr, plan.grid.width * plan.px_mm / kTagW, s.rows * plan.px_mm / kTagH);
    // No NEAREST filter: replayed from the canvas's recording (page mm), Cairo clips a
    // nearest-filtered image to its extents rounded to whole millimetres, which cuts rows off
    // the strips' edges. The swapped-in strips carry their own /Interpolate.
    cairo_set_source_surface(cr, tag.get(), 0, 0);
    cairo_paint(cr);
    cairo_restore(cr);
  }
  cairo_restore(cr);
}

StreamedReliefReport stream_relief_into_pdf(const std::filesystem::path& cairo_pdf,
                                            const std::filesystem::path& output,
                                            const ReliefPlan& plan, ReliefCompression compression,
                                            int jpeg_quality) {
  StreamedReliefReport report;
  try {
    QPDF pdf;
    pdf.processFile(cairo_pdf.c_str());
    auto provider = std::make_shared<StripProvider>(plan, compression, jpeg_quality);
    std::vector<bool> seen(plan.strips.size(), false);
    for (QPDFObjectHandle obj : pdf.getAllObjects()) {
      if (!obj.isStream()) continue;
      QPDFObjectHandle dict = obj.getDict();
      if (!dict.getKey("/Subtype").isNameAndEquals("/Image")) continue;
      if (!dict.getKey("/Width").isInteger() || dict.getKey("/Width").getIntValue() != kTagW ||
          !dict.getKey("/Height").isInteger() || dict.getKey("/Height").getIntValue() != kTagH) {
        continue;
      }
      auto data = obj.getStreamData(qpdf_dl_generalized);
      long index = placeholder_index(
          std::string(reinterpret_cast<const char*>(data->getBuffer()), data->getSize()));
      if (index < 0 || static_cast<std::size_t>(index) >= plan.strips.size()) continue;
      seen[static_cast<std::size_t>(index)] = true;
      provider->add(obj.getObjGen(), static_cast<std::size_t>(index));
      const bool jpeg = compression == ReliefCompression::jpeg;
      obj.replaceStreamData(
          provider, jpeg ? QPDFObjectHandle::newName("/DCTDecode") : QPDFObjectHandle::newNull(),
          QPDFObjectHandle::newNull());
      dict.replaceKey("/Width", QPDFObjectHandle::newInteger(plan.grid.width));
      dict.replaceKey("/Height", QPDFObjectHandle::newInteger(
                                     plan.strips[static_cast<std::size_t>(index)].rows));
      dict.replaceKey("/ColorSpace", QPDFObjectHandle::newName("/DeviceRGB"));
      dict.replaceKey("/BitsPerComponent", QPDFObjectHandle::newInteger(8));
      // Relief cells are samples of a continuous surface: let viewers interpolate when zoomed.
      dict.replaceKey("/Interpolate", QPDFObjectHandle::newBool(true));
      ++report.strips_replaced;
    }
    for (std::size_t i = 0; i < seen.size(); ++i) {
      if (!seen[i]) throw_internal_error(fmt::format("relief strip {} missing from the PDF", i));
    }
    QPDFWriter writer(pdf, output.c_str());
    writer.setCompressStreams(true);
    writer.setStreamDataMode(qpdf_s_compress);
    writer.write();
    report.strip_renders = provider->renders();
  } catch (const Error&) {
    throw;
  } catch (const std::exception& e) {
    throw_internal_error(std::string("writing the exhibit PDF: ") + e.what());
  }
  return report;
}

}  // namespace sheetmill::exhibit
