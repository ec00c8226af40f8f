#include "sheetmill/render/draw_order.hpp"

#include <algorithm>

namespace sheetmill::render {

std::vector<DrawStep> draw_sequence(const std::vector<const style::Layer*>& layers,
                                    int relief_order, int contours_order) {
  // Each step's sort key: its order number, then a rank that puts the layers of one number
  // first, then the relief, then the contours; a stable sort keeps the layers' own sequence.
  struct Keyed {
    int order;
    int rank;
    DrawStep step;
  };
  std::vector<Keyed> keyed;
  keyed.reserve(layers.size() + 2);
  for (std::size_t i = 0; i < layers.size(); ++i)
    keyed.push_back({layers[i]->order, 0, {DrawStep::Kind::layer, i}});
  keyed.push_back({relief_order, 1, {DrawStep::Kind::relief, 0}});
  keyed.push_back({contours_order, 2, {DrawStep::Kind::contours, 0}});
  std::stable_sort(keyed.begin(), keyed.end(), [](const Keyed& a, const Keyed& b) {
    return a.order != b.order ? a.order < b.order : a.rank < b.rank;
  });
  std::vector<DrawStep> steps;
  steps.reserve(keyed.size());
  for (const Keyed& k : keyed) steps.push_back(k.step);
  return steps;
}

}  // namespace sheetmill::render
