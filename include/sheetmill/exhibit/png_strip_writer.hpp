#pragma once
// A PNG written row by row with libpng: 8-bit RGB, the resolution stored in the pHYs chunk.
// Rows go straight to the file, so memory does not grow with the image. finish() must be
// called; it throws Error(internal) on a write fault. Not copyable.

#include <cstdint>
#include <cstdio>
#include <filesystem>

namespace sheetmill::exhibit {

class PngStripWriter {
 public:
  PngStripWriter(const std::filesystem::path& path, int width, int height, double dpi);
  ~PngStripWriter();
  PngStripWriter(const PngStripWriter&) = delete;
  PngStripWriter& operator=(const PngStripWriter&) = delete;

  // One row of width * 3 bytes (R, G, B). Rows arrive top to bottom.
  void write_row(const std::uint8_t* rgb);
  void finish();
  int rows_written() const { return rows_; }

 private:
  struct Impl;
  Impl* impl_;
  int width_, height_, rows_ = 0;
};

}  // namespace sheetmill::exhibit
