#include "sheetmill/labels/candidate.hpp"

#include <algorithm>
#include <numeric>

#include "sheetmill/core/log.hpp"

namespace sheetmill::labels {

namespace {
std::vector<std::size_t> priority_order(const std::vector<Candidate>& candidates) {
  std::vector<std::size_t> order(candidates.size());
  std::iota(order.begin(), order.end(), 0);
  std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
    return candidates[a].priority > candidates[b].priority;
  });
  return order;
}
}  // namespace

std::map<std::string, LayerCount> place(std::vector<Candidate>& candidates,
                                        text::CollisionIndex& index) {
  std::map<std::string, LayerCount> counts;
  for (std::size_t i : priority_order(candidates)) {
    Candidate& c = candidates[i];
    c.chosen.reset();
    std::vector<std::size_t> by_cost(c.placements.size());
    std::iota(by_cost.begin(), by_cost.end(), 0);
    std::stable_sort(by_cost.begin(), by_cost.end(), [&](std::size_t a, std::size_t b) {
      return c.placements[a].cost < c.placements[b].cost;
    });
    for (std::size_t p : by_cost) {
      if (index.all_free(c.placements[p].footprint)) {
        c.chosen = p;
        break;
      }
    }
    if (!c.chosen && !c.may_drop && !by_cost.empty()) c.chosen = by_cost.front();
    if (c.chosen) {
      index.insert_all(c.placements[*c.chosen].footprint);
      ++counts[c.layer].placed;
    } else {
      ++counts[c.layer].dropped;
      log::debug("label dropped: layer {}, \"{}\" at {:.1f}, {:.1f} mm from the page's top left",
                 c.layer, c.text, c.anchor_mm.x, c.anchor_mm.y);
    }
  }
  return counts;
}

void draw_placed(cairo_t* cr, const std::vector<Candidate>& candidates) {
  // Lowest priority first, so the most important labels end up on top.
  auto order = priority_order(candidates);
  std::reverse(order.begin(), order.end());
  for (std::size_t i : order) {
    const Candidate& c = candidates[i];
    if (c.chosen && c.placements[*c.chosen].draw) c.placements[*c.chosen].draw(cr);
  }
}

}  // namespace sheetmill::labels
