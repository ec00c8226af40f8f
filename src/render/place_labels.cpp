// Phase 3, place: every label on the sheet against one collision index (render/phases.hpp).

#include "sheetmill/core/log.hpp"
#include "sheetmill/render/phases.hpp"
#include "sheetmill/text/collision_index.hpp"

namespace sheetmill::render {

Placement place(PreparedSheet& sheet) {
  const sheet::Layout& layout = sheet.layout;
  text::CollisionIndex index(Box::of(0, 0, layout.page_w_mm, layout.page_h_mm));
  index.set_bounds(layout.frame.page_box_mm());
  index.insert_all(sheet.features.obstacles);
  for (const Box& b : sheet.grid_labels) index.insert(text::box_quad(b));
  // Names and contour labels compete in one list, by priority; then they are split again, as
  // the contour labels are drawn with the contours and the names above every layer.
  std::vector<labels::Candidate> candidates = std::move(sheet.features.name_candidates);
  sheet.features.name_candidates.clear();
  const std::size_t first_contour_label = candidates.size();
  for (auto& c : sheet.contours.labels) candidates.push_back(std::move(c));
  sheet.contours.labels.clear();
  Placement placement;
  placement.counts = labels::place(candidates, index);
  for (const auto& [layer, count] : placement.counts) {
    log::debug("labels {}: {} placed, {} dropped", layer, count.placed, count.dropped);
  }
  placement.contour_labels.assign(
      std::make_move_iterator(candidates.begin() +
                              static_cast<std::ptrdiff_t>(first_contour_label)),
      std::make_move_iterator(candidates.end()));
  candidates.resize(first_contour_label);
  placement.names = std::move(candidates);
  return placement;
}

}  // namespace sheetmill::render
