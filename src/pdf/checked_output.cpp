#include "sheetmill/pdf/checked_output.hpp"

#include <cstring>
#include <fstream>
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFPageDocumentHelper.hh>

namespace sheetmill::pdf {

cairo_status_t CairoSink::write(void* closure, const unsigned char* data, unsigned int length) {
  auto* self = static_cast<CairoSink*>(closure);
  if (self->failure) return CAIRO_STATUS_WRITE_ERROR;
  try {
    self->writer.write(data, length);
    return CAIRO_STATUS_SUCCESS;
  } catch (const Error& e) {
    self->failure = e;
    return CAIRO_STATUS_WRITE_ERROR;
  }
}

void CairoSink::rethrow_if_failed() const {
  if (failure) throw *failure;
}

void QpdfSink::write(unsigned char const* data, size_t len) {
  if (buffer_.size() + len > kBlock) flush();
  if (len >= kBlock) {
    writer_.write(data, len);
    return;
  }
  buffer_.insert(buffer_.end(), data, data + len);
}

void QpdfSink::flush() {
  if (buffer_.empty()) return;
  writer_.write(buffer_.data(), buffer_.size());
  buffer_.clear();
}

void verify_pdf(const std::filesystem::path& path, std::size_t pages, const std::string& shown_as) {
  std::size_t found = 0;
  try {
    QPDF pdf;
    pdf.setSuppressWarnings(true);
    // A truncated file loses its cross-reference table; recovery would hide that.
    pdf.setAttemptRecovery(false);
    pdf.processFile(path.c_str());
    found = QPDFPageDocumentHelper(pdf).getAllPages().size();
    if (pdf.anyWarnings()) found = 0;
  } catch (const std::exception& e) {
    throw_input_error(shown_as, std::string("the written PDF does not read back: ") + e.what());
  }
  if (found != pages) {
    throw_input_error(shown_as, "the written PDF does not read back whole (" +
                                    std::to_string(found) + " pages, expected " +
                                    std::to_string(pages) + ")");
  }
}

void verify_png(const std::filesystem::path& path, std::size_t bytes, const std::string& shown_as) {
  // The last chunk of every PNG: length 0, "IEND", its CRC (ISO/IEC 15948 section 11.2.5).
  static const unsigned char kIend[12] = {0, 0, 0, 0, 'I', 'E', 'N', 'D', 0xAE, 0x42, 0x60, 0x82};
  std::error_code ec;
  std::uintmax_t size = std::filesystem::file_size(path, ec);
  unsigned char tail[12] = {};
  if (!ec && size == bytes && size >= sizeof tail) {
    std::ifstream in(path, std::ios::binary);
    in.seekg(static_cast<std::streamoff>(size - sizeof tail));
    in.read(reinterpret_cast<char*>(tail), sizeof tail);
    if (in && std::memcmp(tail, kIend, sizeof tail) == 0) return;
  }
  throw_input_error(shown_as, "the written PNG does not read back whole (" +
                                  std::to_string(ec ? 0 : size) + " bytes of " +
                                  std::to_string(bytes) + ")");
}

namespace {
// CRC-32 as the PNG specification's Annex D computes it.
uint32_t png_crc(const unsigned char* p, std::size_t n) {
  uint32_t c = 0xffffffffu;
  for (std::size_t i = 0; i < n; ++i) {
    c ^= p[i];
    for (int k = 0; k < 8; ++k) c = (c & 1) ? 0xedb88320u ^ (c >> 1) : c >> 1;
  }
  return c ^ 0xffffffffu;
}
void put32(std::string& s, uint32_t v) {
  for (int shift = 24; shift >= 0; shift -= 8) s += static_cast<char>((v >> shift) & 0xff);
}
}  // namespace

cairo_status_t PngResolutionSink::write(void* closure, const unsigned char* data,
                                        unsigned int length) {
  auto* self = static_cast<PngResolutionSink*>(closure);
  if (self->done) return CairoSink::write(&self->sink, data, length);
  constexpr std::size_t kHead = 8 + 4 + 4 + 13 + 4;  // signature, IHDR length, type, data, CRC
  self->head.append(reinterpret_cast<const char*>(data), length);
  if (self->head.size() < kHead) return CAIRO_STATUS_SUCCESS;
  std::string out = self->head.substr(0, kHead);
  const auto ppm = static_cast<uint32_t>(self->dpi / 0.0254 + 0.5);
  std::string chunk = "pHYs";
  put32(chunk, ppm);
  put32(chunk, ppm);
  chunk += '\x01';  // the unit is the metre
  put32(out, 9);
  out += chunk;
  put32(out, png_crc(reinterpret_cast<const unsigned char*>(chunk.data()), chunk.size()));
  out += self->head.substr(kHead);
  self->done = true;
  self->head.clear();
  return CairoSink::write(&self->sink, reinterpret_cast<const unsigned char*>(out.data()),
                          static_cast<unsigned int>(out.size()));
}

}  // namespace sheetmill::pdf
