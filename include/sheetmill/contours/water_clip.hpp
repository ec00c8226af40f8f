#pragma once
// Contours do not cross a lake surface: the parts of lines inside water polygons are removed.
// Streams are not obstacles: a contour crossing a stream stays one continuous line (the stream
// is drawn over it), so only areas are passed here.

#include <vector>

#include "sheetmill/contours/contour_line.hpp"

namespace sheetmill::contours {

// Each polygon is its rings in ground metres of the sheet CRS (outer ring first, then holes,
// closed implicitly; islands inside holes are separate polygons). Inside is by the even-odd
// rule per polygon. Pieces keep their line's flags; a closed line that is cut becomes open
// pieces. Lines of fewer than two points after cutting are dropped.
void clip_out_polygons(std::vector<ContourLine>& lines,
                       const std::vector<std::vector<Polyline>>& polygons);

}  // namespace sheetmill::contours
