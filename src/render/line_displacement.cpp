#include "render/line_displacement.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/log.hpp"
#include "sheetmill/draw/point.hpp"
#include "sheetmill/features/displace.hpp"

namespace sheetmill::render {

double symbol_half_width_mm(const style::LineSymbol& s) {
  double w = 0;
  for (const auto& st : s.strokes) w = std::max(w, std::abs(st.offset_mm) + st.width_mm / 2);
  for (const auto& m : s.marks)
    w = std::max(w, m.symbol ? draw::point_symbol_radius_mm(*m.symbol)
                             : m.length_mm + m.stroke.width_mm / 2);
  return w;
}

void displace_layers(PreparedLayers& out, const std::vector<std::vector<LineRef>>& refs,
                     const MapFrame& frame) {
  std::vector<features::DisplacedLine> lines;
  std::vector<std::pair<std::size_t, LineRef>> where;
  for (std::size_t li = 0; li < out.layers.size(); ++li) {
    const style::Layer& layer = *out.layers[li].layer;
    if (!layer.displacement) continue;
    for (const LineRef& r : refs[li]) {
      PreparedRule& pr = out.layers[li].rules[r.rule];
      lines.push_back({pr.lines[r.line], symbol_half_width_mm(*pr.rule->line),
                       layer.displacement->priority, layer.displacement->max_shift_mm,
                       static_cast<int>(li)});
      where.push_back({li, r});
    }
  }
  if (lines.empty()) return;
  // What displacement could not resolve is ink over ink a reader sees (a shallow crossing, a
  // corridor narrower than the limit allows): a warning, with its place, never only at --verbose.
  for (const auto& c : features::displace_lines(lines)) {
    const Point g = frame.to_ground(c.at_mm);
    log::warn(
        "layers '{}' and '{}' overlap by {:.2f} mm near E {:.0f} N {:.0f}: '{}' is held to "
        "its displacement limit of {:g} mm",
        out.layers[where[c.line].first].layer->id, out.layers[where[c.obstacle].first].layer->id,
        c.overlap_mm, g.x, g.y, out.layers[where[c.line].first].layer->id,
        out.layers[where[c.line].first].layer->displacement->max_shift_mm);
  }
  for (std::size_t i = 0; i < lines.size(); ++i) {
    const auto& [li, r] = where[i];
    out.layers[li].rules[r.rule].lines[r.line] = std::move(lines[i].line_mm);
  }
}

}  // namespace sheetmill::render
