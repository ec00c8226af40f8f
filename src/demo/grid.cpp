#include "sheetmill/demo/grid.hpp"

#include <algorithm>
#include <atomic>
#include <thread>

namespace sheetmill::demo {

void parallel_rows(int height, const std::function<void(int)>& body) {
  unsigned n = std::clamp(std::thread::hardware_concurrency(), 1u, 8u);
  std::atomic<int> next{0};
  auto worker = [&] {
    for (int row = next++; row < height; row = next++) body(row);
  };
  std::vector<std::thread> threads;
  for (unsigned i = 1; i < n; ++i) threads.emplace_back(worker);
  worker();
  for (auto& t : threads) t.join();
}

}  // namespace sheetmill::demo
