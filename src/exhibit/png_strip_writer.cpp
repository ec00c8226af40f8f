#include "sheetmill/exhibit/png_strip_writer.hpp"

#include <png.h>

#include <cmath>
#include <csetjmp>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::exhibit {

struct PngStripWriter::Impl {
  std::FILE* file = nullptr;
  png_structp png = nullptr;
  png_infop info = nullptr;
  bool finished = false;
};

// libpng reports errors by longjmp; every call into it below sits behind a setjmp and turns the
// jump into one Error.
#define SHEETMILL_PNG_GUARD(what)                              \
  if (setjmp(png_jmpbuf(impl_->png))) {                        \
    throw_internal_error(std::string("writing PNG: ") + what); \
  }

PngStripWriter::PngStripWriter(const std::filesystem::path& path, int width, int height, double dpi)
    : impl_(new Impl), width_(width), height_(height) {
  impl_->file = std::fopen(path.c_str(), "wb");
  if (!impl_->file) {
    delete impl_;
    throw_input_error(path.string(), "cannot create the PNG file");
  }
  impl_->png = png_create_write_struct(PNG_LIBPNG_VER_STRING, nullptr, nullptr, nullptr);
  impl_->info = impl_->png ? png_create_info_struct(impl_->png) : nullptr;
  if (!impl_->info) {
    std::fclose(impl_->file);
    png_destroy_write_struct(&impl_->png, nullptr);
    delete impl_;
    throw_internal_error("libpng: out of memory");
  }
  SHEETMILL_PNG_GUARD("header");
  png_init_io(impl_->png, impl_->file);
  png_set_IHDR(impl_->png, impl_->info, static_cast<png_uint_32>(width),
               static_cast<png_uint_32>(height), 8, PNG_COLOR_TYPE_RGB, PNG_INTERLACE_NONE,
               PNG_COMPRESSION_TYPE_DEFAULT, PNG_FILTER_TYPE_DEFAULT);
  const auto ppm = static_cast<png_uint_32>(std::lround(dpi / kMmPerInch * 1000.0));
  png_set_pHYs(impl_->png, impl_->info, ppm, ppm, PNG_RESOLUTION_METER);
  png_write_info(impl_->png, impl_->info);
}

PngStripWriter::~PngStripWriter() {
  png_destroy_write_struct(&impl_->png, &impl_->info);
  if (impl_->file) std::fclose(impl_->file);
  delete impl_;
}

void PngStripWriter::write_row(const std::uint8_t* rgb) {
  if (rows_ >= height_) throw_internal_error("PNG: more rows than the image has");
  SHEETMILL_PNG_GUARD("row");
  png_write_row(impl_->png, rgb);
  ++rows_;
}

void PngStripWriter::finish() {
  if (rows_ != height_) throw_internal_error("PNG: image finished before its last row");
  SHEETMILL_PNG_GUARD("end");
  png_write_end(impl_->png, impl_->info);
  if (std::fflush(impl_->file) != 0 || std::fclose(impl_->file) != 0) {
    impl_->file = nullptr;
    throw_internal_error("writing PNG: the file could not be closed");
  }
  impl_->file = nullptr;
  (void)width_;
}

#undef SHEETMILL_PNG_GUARD

}  // namespace sheetmill::exhibit
