#pragma once
// Internal to the terrain stage: split rows [0, rows) into contiguous bands, one per core,
// and run fn(begin, end) on each in its own thread (the calling thread takes the first band).
// Exceptions from a band are rethrown in the caller after all bands finish.

#include <algorithm>
#include <exception>
#include <thread>
#include <vector>

namespace sheetmill::terrain::detail {

inline int worker_count() {
  unsigned n = std::thread::hardware_concurrency();
  return n == 0 ? 2 : static_cast<int>(std::min(n, 64u));
}

template <class Fn>
void parallel_rows(int rows, Fn&& fn, int min_rows_per_band = 16) {
  int bands = std::max(1, std::min(worker_count(), rows / std::max(1, min_rows_per_band)));
  if (bands <= 1) {
    fn(0, rows);
    return;
  }
  std::vector<std::exception_ptr> errors(bands);
  std::vector<std::thread> threads;
  auto run = [&](int b) {
    int begin = static_cast<int>(static_cast<long long>(rows) * b / bands);
    int end = static_cast<int>(static_cast<long long>(rows) * (b + 1) / bands);
    try {
      fn(begin, end);
    } catch (...) {
      errors[b] = std::current_exception();
    }
  };
  for (int b = 1; b < bands; ++b) threads.emplace_back(run, b);
  run(0);
  for (auto& t : threads) t.join();
  for (auto& e : errors) {
    if (e) std::rethrow_exception(e);
  }
}

}  // namespace sheetmill::terrain::detail
