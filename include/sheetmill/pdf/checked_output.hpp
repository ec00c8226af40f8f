#pragma once
// Checked sinks for the libraries that write our files (the pdf stage and the batch merge): a Cairo
// write callback and a qpdf pipeline over core's FileWriter, so every byte's write is checked
// and a full disk is named, and the checks that a finished file is whole before it is renamed.

#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif
#include <cairo.h>

#include <filesystem>
#include <optional>
#include <qpdf/Pipeline.hh>
#include <string>
#include <vector>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"

namespace sheetmill::pdf {

// Cairo cannot carry an exception through its C callback: the first failure is kept here and
// rethrown by rethrow_if_failed() once Cairo returns (with its errno text, where Cairo's own
// status only says "error while writing to output stream").
struct CairoSink {
  explicit CairoSink(FileWriter& w) : writer(w) {}
  FileWriter& writer;
  std::optional<Error> failure;
  static cairo_status_t write(void* closure, const unsigned char* data, unsigned int length);
  void rethrow_if_failed() const;
};

// A Cairo PNG stream with its resolution: passes the bytes to `sink` and puts a pHYs chunk
// (PNG specification, ISO/IEC 15948 section 11.3.5.3: pixels per metre, unit 1) right after
// the IHDR chunk, so the image opens at its print size.
struct PngResolutionSink {
  PngResolutionSink(CairoSink& s, double dpi) : sink(s), dpi(dpi) {}
  CairoSink& sink;
  double dpi;
  std::string head;  // the signature and IHDR, until the chunk is written
  bool done = false;
  static cairo_status_t write(void* closure, const unsigned char* data, unsigned int length);
};

// qpdf writes a PDF token by token: the sink gathers writes into 1 MiB blocks, so the checked
// writer makes one system call per block, not one per token. The caller calls flush() after
// QPDFWriter::write() for what is left (finish() does nothing: qpdf may call it while it
// unwinds, where a write failure must not throw).
class QpdfSink : public Pipeline {
 public:
  explicit QpdfSink(FileWriter& w) : Pipeline("sheetmill output", nullptr), writer_(w) {
    buffer_.reserve(kBlock);
  }
  void write(unsigned char const* data, size_t len) override;
  void finish() override {}
  void flush();

 private:
  static constexpr std::size_t kBlock = 1 << 20;
  FileWriter& writer_;
  std::vector<unsigned char> buffer_;
};

// Opens `path` with qpdf, without recovery, and checks it has `pages` pages; throws
// Error(input) naming `shown_as` when it is damaged or short.
void verify_pdf(const std::filesystem::path& path, std::size_t pages, const std::string& shown_as);

// Checks that the file on disk has `bytes` bytes and ends with PNG's IEND chunk.
void verify_png(const std::filesystem::path& path, std::size_t bytes, const std::string& shown_as);

}  // namespace sheetmill::pdf
