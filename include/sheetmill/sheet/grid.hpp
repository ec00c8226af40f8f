#pragma once
// The projected grid of the sheet CRS, the graticule and an optional second grid, drawn in and
// around the neatline; and the neatline itself.
//
// Grid lines are straight on the page (the sheet CRS is the page's own grid). Labels stand in the
// collar: eastings above and below the frame, northings left and right reading up the page (so
// full values fit a narrow collar). The two principal digits
// (tens and units of kilometres) are set large, the leading digits small, and the two labels
// nearest each corner carry the full value with its unit (common practice). Positions are page
// millimetres; a label's principal digits are centred on their line.

#include <cairo.h>

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::sheet {

struct GridOptions {
  double interval_m = 0;                       // 0: grid_interval_m(scale)
  bool graticule = true;                       // ticks and crosses of latitude and longitude
  std::optional<std::string> second_grid_crs;  // another projected CRS, drawn in its own colour
  double second_interval_m = 0;                // 0: same rule as the main grid
};

enum class Side { top, bottom, left, right };

struct GridLabel {
  double value_m = 0;  // easting (top/bottom) or northing (left/right)
  Side side = Side::top;
  Point line_end_mm;  // where the grid line meets the neatline
  bool full = false;  // corner label: the full value and unit
};

struct GridPlan {
  double interval_m = 0;
  std::vector<Polyline> lines;  // page mm, neatline to neatline
  std::vector<GridLabel> labels;
};

// Pure geometry: the grid lines inside the neatline and where their labels go.
GridPlan plan_projected_grid(const Layout& layout, double interval_m);

// The three parts of a grid label: small leading digits, large principal digits, small rest.
struct GridLabelText {
  std::string prefix;     // "5" of 512 000
  std::string principal;  // "12"
  std::string suffix;     // "000m E" on full labels, "" (or "500") otherwise
};
GridLabelText grid_label_text(double value_m, double interval_m, bool full, bool easting);

// Draws the neatline, the outer frame line, the grid (lines or ticks), grid labels, the
// graticule and the second grid. The context is in page millimetres.
void draw_neatline_and_grid(cairo_t* cr, const Layout& layout, const style::Style& style,
                            text::FontCache& fonts, const GridOptions& options = {});

// The boxes (page mm) of the labels draw_neatline_and_grid sets inside the map frame with the
// same arguments: graticule values along the neatline, the corners' positions, second-grid
// values. They go into the sheet's collision index first, so names and spot heights keep clear.
std::vector<Box> grid_labels_in_frame(const Layout& layout, const style::Style& style,
                                      text::FontCache& fonts, const GridOptions& options = {});

}  // namespace sheetmill::sheet
