#include "sheetmill/contours/draw_contours.hpp"

#include "sheetmill/contours/contour_labels.hpp"
#include "sheetmill/contours/line_gaps.hpp"
#include "sheetmill/draw/line.hpp"
#include "sheetmill/draw/point.hpp"

namespace sheetmill::contours {

namespace {

enum Group {
  ordinary,
  index_group,
  supplementary_group,
  depression_ordinary,
  depression_index,
  depth_ordinary,
  depth_index,
  coastline_group,
  group_count
};

// The depression symbol: its own strokes (or the index strokes for an index depression line),
// and ticks to the right of the line's direction (downhill by orientation), at the style's
// spacing and length.
style::LineSymbol depression_symbol(const style::ContourStyle& s, bool index) {
  style::LineSymbol sym;
  sym.strokes = index || s.depression_ticks.strokes.empty()
                    ? (index ? s.index_line.strokes : s.line.strokes)
                    : s.depression_ticks.strokes;
  style::LineMarks m;
  if (!s.depression_ticks.marks.empty()) m = s.depression_ticks.marks.front();
  if (m.stroke.width_mm <= 0 && !sym.strokes.empty()) m.stroke = sym.strokes.front();
  m.symbol.reset();
  m.spacing_mm = s.tick_spacing_mm;
  m.start_mm = s.tick_spacing_mm / 2;
  m.length_mm = s.tick_length_mm;
  m.side = style::LineMarks::Side::right;
  sym.marks = {m};
  return sym;
}

}  // namespace

std::vector<text::Quad> label_gaps(const std::vector<labels::Candidate>& candidates) {
  std::vector<text::Quad> gaps;
  for (const auto& c : candidates) {
    if (c.layer != kContourLabelLayer || !c.chosen) continue;
    const auto& fp = c.placements[*c.chosen].footprint;
    gaps.insert(gaps.end(), fp.begin(), fp.end());
  }
  return gaps;
}

void draw_contours(cairo_t* cr, const std::vector<ContourLine>& lines,
                   const std::vector<labels::Candidate>& candidates, const MapFrame& frame,
                   const style::ContourStyle& style) {
  auto gaps = label_gaps(candidates);
  std::vector<Polyline> groups[group_count];
  for (const auto& l : lines) {
    Polyline page;
    page.reserve(l.ground.size());
    for (const auto& g : l.ground) page.push_back(frame.to_page(g));
    // Depth lines and the coastline never carry depression ticks.
    int group = l.coastline       ? coastline_group
                : l.depth         ? (l.index && !l.supplementary ? depth_index : depth_ordinary)
                : l.supplementary ? supplementary_group
                : l.depression    ? (l.index ? depression_index : depression_ordinary)
                : l.index         ? index_group
                                  : ordinary;
    auto pieces = cut_out_quads(page, l.closed, gaps);
    for (auto& p : pieces) groups[group].push_back(std::move(p));
  }
  style::LineSymbol symbols[group_count] = {style.line,
                                            style.index_line,
                                            style.supplementary ? *style.supplementary : style.line,
                                            depression_symbol(style, false),
                                            depression_symbol(style, true),
                                            style.depths.line,
                                            style.depths.index_line,
                                            style.depths.coastline};
  // Ordinary and half-interval lines first, index lines over them, the coastline on top.
  for (int g : {supplementary_group, ordinary, depression_ordinary, depth_ordinary, index_group,
                depression_index, depth_index, coastline_group}) {
    if (groups[g].empty()) continue;
    for (int pass : draw::passes_of(symbols[g]))
      draw::draw_line_pass(cr, groups[g], symbols[g], pass);
  }
}

void draw_spot_heights(cairo_t* cr, const std::vector<SpotHeight>& spots, const MapFrame& frame,
                       const style::ContourStyle& style) {
  for (const auto& s : spots)
    draw::draw_point_symbol(cr, frame.to_page(s.ground), style.spot_symbol);
}

}  // namespace sheetmill::contours
