#include "render/line_chains.hpp"

#include <cmath>
#include <map>
#include <utility>

namespace sheetmill::render {

std::vector<Polyline> chain_lines(std::vector<Polyline> pieces, double snap) {
  using Key = std::pair<long long, long long>;
  auto key = [snap](Point p) { return Key{std::llround(p.x / snap), std::llround(p.y / snap)}; };
  std::multimap<Key, std::size_t> ends;
  for (std::size_t i = 0; i < pieces.size(); ++i) {
    if (pieces[i].size() < 2) continue;
    ends.emplace(key(pieces[i].front()), i);
    ends.emplace(key(pieces[i].back()), i);
  }
  std::vector<char> used(pieces.size(), 0);
  // An unused piece touching `p`, or pieces.size().
  auto take_at = [&](Point p) {
    auto [b, e] = ends.equal_range(key(p));
    for (auto it = b; it != e; ++it)
      if (!used[it->second]) {
        used[it->second] = 1;
        return it->second;
      }
    return pieces.size();
  };
  std::vector<Polyline> out;
  for (std::size_t i = 0; i < pieces.size(); ++i) {
    if (used[i] || pieces[i].size() < 2) continue;
    used[i] = 1;
    Polyline chain = std::move(pieces[i]);
    for (bool forward : {true, false}) {
      if (!forward) std::reverse(chain.begin(), chain.end());
      for (std::size_t j; (j = take_at(chain.back())) != pieces.size();) {
        Polyline& next = pieces[j];
        if (key(next.front()) != key(chain.back())) std::reverse(next.begin(), next.end());
        chain.insert(chain.end(), next.begin() + 1, next.end());
        next.clear();
      }
    }
    out.push_back(std::move(chain));
  }
  return out;
}

}  // namespace sheetmill::render
