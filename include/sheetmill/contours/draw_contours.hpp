#pragma once
// Drawing prepared contours on a sheet surface (Cairo user space = page millimetres, y down).
//
// Ordinary, index, half-interval and depression lines each take their symbol from the style;
// depression lines get ticks on their downhill side (the right of each line's direction, which
// the orientation guarantee of ContourLine makes the lower side) at the style's tick spacing
// and length. Lines are broken behind the chosen placements of candidates on the contour-label
// layer (contours/contour_labels.hpp), so place() must have run first; candidates of other
// layers are ignored. Labels themselves are drawn by labels::draw_placed().

#include <cairo.h>

#include <vector>

#include "sheetmill/contours/contour_line.hpp"
#include "sheetmill/contours/spot_heights.hpp"
#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::contours {

void draw_contours(cairo_t* cr, const std::vector<ContourLine>& lines,
                   const std::vector<labels::Candidate>& candidates, const MapFrame& frame,
                   const style::ContourStyle& style);

// The spot symbol of every spot height (their figures are label candidates).
void draw_spot_heights(cairo_t* cr, const std::vector<SpotHeight>& spots, const MapFrame& frame,
                       const style::ContourStyle& style);

// The gaps the chosen contour labels cut, as footprints (page mm): what draw_contours removes.
std::vector<text::Quad> label_gaps(const std::vector<labels::Candidate>& candidates);

}  // namespace sheetmill::contours
