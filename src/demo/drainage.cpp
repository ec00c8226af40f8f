#include "sheetmill/demo/drainage.hpp"

#include <algorithm>
#include <queue>

namespace sheetmill::demo {

namespace {

constexpr int kDc[8] = {1, 1, 0, -1, -1, -1, 0, 1};
constexpr int kDr[8] = {0, -1, -1, -1, 0, 1, 1, 1};

struct Entry {
  float z;
  std::uint32_t seq;  // ties go first-in first-out, so floods spread breadth-first over flats
  std::int32_t cell;
  bool operator>(const Entry& o) const { return z > o.z || (z == o.z && seq > o.seq); }
};
using MinQueue = std::priority_queue<Entry, std::vector<Entry>, std::greater<Entry>>;

// Pushes the edge cells and the extra seeds; marks them visited.
void seed(const GridSpec& g, const std::vector<float>& z, const std::vector<char>& extra,
          std::vector<char>& visited, MinQueue& q, std::uint32_t& seq) {
  auto push = [&](int col, int row) {
    std::size_t i = static_cast<std::size_t>(row) * g.width + col;
    if (visited[i]) return;
    visited[i] = 1;
    q.push({z[i], seq++, static_cast<std::int32_t>(i)});
  };
  for (int col = 0; col < g.width; ++col) {
    push(col, 0);
    push(col, g.height - 1);
  }
  for (int row = 0; row < g.height; ++row) {
    push(0, row);
    push(g.width - 1, row);
  }
  for (std::size_t i = 0; i < extra.size(); ++i) {
    if (extra[i]) push(static_cast<int>(i % g.width), static_cast<int>(i / g.width));
  }
}

}  // namespace

FloatGrid downsample(const FloatGrid& dem, int factor) {
  GridSpec s = dem.spec;
  s.width = (dem.spec.width + factor - 1) / factor;
  s.height = (dem.spec.height + factor - 1) / factor;
  s.cell_m = dem.spec.cell_m * factor;
  FloatGrid out(s, 0.0f);
  for (int row = 0; row < s.height; ++row) {
    for (int col = 0; col < s.width; ++col) {
      double sum = 0;
      int n = 0;
      for (int r = row * factor; r < std::min((row + 1) * factor, dem.spec.height); ++r) {
        for (int c = col * factor; c < std::min((col + 1) * factor, dem.spec.width); ++c) {
          sum += dem.at(c, r);
          ++n;
        }
      }
      out.at(col, row) = static_cast<float>(sum / n);
    }
  }
  return out;
}

FlowRouting route_flow(const FloatGrid& dem, const std::vector<char>& sinks) {
  const GridSpec& g = dem.spec;
  FlowRouting f;
  f.spec = g;
  f.filled = dem.values;
  f.receiver.assign(g.size(), -1);
  f.order.reserve(g.size());
  std::vector<char> visited(g.size(), 0);
  MinQueue q;
  std::uint32_t seq = 0;
  seed(g, f.filled, sinks, visited, q, seq);
  while (!q.empty()) {
    Entry e = q.top();
    q.pop();
    f.order.push_back(e.cell);
    int col = e.cell % g.width;
    int row = e.cell / g.width;
    for (int k = 0; k < 8; ++k) {
      int c = col + kDc[k];
      int r = row + kDr[k];
      if (!g.inside(c, r)) continue;
      std::size_t n = static_cast<std::size_t>(r) * g.width + c;
      if (visited[n]) continue;
      visited[n] = 1;
      f.receiver[n] = e.cell;
      f.filled[n] = std::max(f.filled[n], e.z);
      q.push({f.filled[n], seq++, static_cast<std::int32_t>(n)});
    }
  }
  // Where a cell has a strictly lower neighbour on the filled surface it drains to the
  // steepest one (D8, O'Callaghan & Mark 1984): the flood's own choice breaks ties in favour of
  // diagonals and draws streams as 45-degree lines. Flat cells keep the flood's receiver.
  // Strictly lower cells were popped earlier, so `order` stays valid.
  for (std::size_t i = 0; i < g.size(); ++i) {
    if (f.receiver[i] < 0) continue;
    int col = static_cast<int>(i % g.width), row = static_cast<int>(i / g.width);
    double best = 0;
    for (int k = 0; k < 8; ++k) {
      int c = col + kDc[k], r = row + kDr[k];
      if (!g.inside(c, r)) continue;
      std::size_t n = static_cast<std::size_t>(r) * g.width + c;
      double drop = (f.filled[i] - f.filled[n]) / ((k & 1) ? 1.41421356237 : 1.0);
      if (drop > best) {
        best = drop;
        f.receiver[i] = static_cast<std::int32_t>(n);
      }
    }
  }
  float cell_area = static_cast<float>(g.cell_m * g.cell_m);
  f.area_m2.assign(g.size(), cell_area);
  for (auto it = f.order.rbegin(); it != f.order.rend(); ++it) {
    std::int32_t r = f.receiver[*it];
    if (r >= 0) f.area_m2[r] += f.area_m2[*it];
  }
  return f;
}

void fill_depressions(FloatGrid& dem, const std::vector<char>& keep) {
  // Barnes et al. (2014), Algorithm 2: cells below the current spill level go through a plain
  // FIFO queue instead of the heap.
  const GridSpec& g = dem.spec;
  std::vector<char> visited(g.size(), 0);
  MinQueue q;
  std::queue<std::int32_t> pit;
  std::uint32_t seq = 0;
  seed(g, dem.values, keep, visited, q, seq);
  while (!q.empty() || !pit.empty()) {
    std::int32_t cell;
    if (!pit.empty()) {
      cell = pit.front();
      pit.pop();
    } else {
      cell = q.top().cell;
      q.pop();
    }
    float z = dem.values[cell];
    int col = cell % g.width;
    int row = cell / g.width;
    for (int k = 0; k < 8; ++k) {
      int c = col + kDc[k];
      int r = row + kDr[k];
      if (!g.inside(c, r)) continue;
      std::size_t n = static_cast<std::size_t>(r) * g.width + c;
      if (visited[n]) continue;
      visited[n] = 1;
      if (dem.values[n] <= z) {
        dem.values[n] = z;
        pit.push(static_cast<std::int32_t>(n));
      } else {
        q.push({dem.values[n], seq++, static_cast<std::int32_t>(n)});
      }
    }
  }
}

}  // namespace sheetmill::demo
