#include "sheetmill/pdf/streamed_raster.hpp"

#include <zlib.h>

#include <algorithm>
#include <thread>

#include "sheetmill/core/error.hpp"

namespace sheetmill::pdf {

namespace {

int cores() {
  const unsigned n = std::thread::hardware_concurrency();
  return n == 0 ? 2 : static_cast<int>(std::min(n, 16u));
}

struct Run {
  std::vector<std::uint8_t> bytes;
  uLong adler = 1;  // Adler-32 of the predicted rows of the run
  z_off_t length = 0;
};

// Raw deflate (no zlib header) of rows [r0, r1) with the Up predictor; ends with a sync flush
// (byte-aligned, not final) unless `last`.
Run deflate_run(const std::uint8_t* data, std::size_t r0, std::size_t r1, std::size_t row_bytes,
                int level, bool last) {
  z_stream z{};
  if (deflateInit2(&z, level, Z_DEFLATED, -15, 8, Z_DEFAULT_STRATEGY) != Z_OK) {
    throw_internal_error("deflate: cannot initialise zlib");
  }
  Run run;
  run.adler = adler32(0, nullptr, 0);
  run.length = static_cast<z_off_t>((r1 - r0) * (row_bytes + 1));
  std::vector<std::uint8_t>& out = run.bytes;
  out.resize(deflateBound(&z, (r1 - r0) * (row_bytes + 1)) + 64);
  std::vector<std::uint8_t> row(row_bytes + 1);
  z.next_out = out.data();
  z.avail_out = static_cast<uInt>(out.size());
  for (std::size_t r = r0; r < r1; ++r) {
    const std::uint8_t* cur = data + r * row_bytes;
    row[0] = 2;  // PNG filter type 2, Up: each byte minus the byte above (0 above row 0)
    if (r == 0) {
      std::copy(cur, cur + row_bytes, row.begin() + 1);
    } else {
      const std::uint8_t* up = cur - row_bytes;
      for (std::size_t i = 0; i < row_bytes; ++i)
        row[i + 1] = static_cast<std::uint8_t>(cur[i] - up[i]);
    }
    run.adler = adler32(run.adler, row.data(), static_cast<uInt>(row.size()));
    z.next_in = row.data();
    z.avail_in = static_cast<uInt>(row.size());
    const int flush = r + 1 < r1 ? Z_NO_FLUSH : (last ? Z_FINISH : Z_SYNC_FLUSH);
    const int rc = deflate(&z, flush);
    if (rc == Z_STREAM_ERROR || z.avail_in != 0) {
      deflateEnd(&z);
      throw_internal_error("deflate: zlib failed");
    }
  }
  if (r0 == r1 && last) deflate(&z, Z_FINISH);
  out.resize(out.size() - z.avail_out);
  deflateEnd(&z);
  return run;
}

}  // namespace

std::vector<std::uint8_t> deflate_rows_parallel(const std::uint8_t* data, std::size_t rows,
                                                std::size_t row_bytes, int level) {
  const std::size_t runs = std::max<std::size_t>(1, std::min<std::size_t>(cores(), rows / 8));
  std::vector<Run> parts(runs);
  std::vector<std::exception_ptr> errors(runs);
  {
    std::vector<std::thread> threads;
    auto work = [&](std::size_t k) {
      try {
        parts[k] = deflate_run(data, rows * k / runs, rows * (k + 1) / runs, row_bytes, level,
                               k + 1 == runs);
      } catch (...) {
        errors[k] = std::current_exception();
      }
    };
    for (std::size_t k = 1; k < runs; ++k) threads.emplace_back(work, k);
    work(0);
    for (auto& t : threads) t.join();
  }
  for (auto& e : errors)
    if (e) std::rethrow_exception(e);
  // The zlib checksum covers the predicted bytes (what the stream inflates to).
  uLong adler = parts[0].adler;
  std::size_t total = 2 + 4 + parts[0].bytes.size();
  for (std::size_t k = 1; k < runs; ++k) {
    adler = adler32_combine(adler, parts[k].adler, parts[k].length);
    total += parts[k].bytes.size();
  }
  std::vector<std::uint8_t> out;
  out.reserve(total);
  // zlib header (RFC 1950): deflate, 32 K window, no dictionary; FCHECK makes it a multiple of 31.
  out.push_back(0x78);
  out.push_back(0x5e);
  for (const auto& p : parts) out.insert(out.end(), p.bytes.begin(), p.bytes.end());
  for (int shift = 24; shift >= 0; shift -= 8)
    out.push_back(static_cast<std::uint8_t>(adler >> shift));
  return out;
}

}  // namespace sheetmill::pdf
