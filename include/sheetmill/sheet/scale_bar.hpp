#pragma once
// Scale bars: alternating segments at nice lengths (Heckbert 1990) right of zero, one segment
// subdivided left of zero, and the representative fraction as text.
//
// Lengths are exact: a segment of L units is L x unit_m x 1000 / N mm on paper.

#include <cairo.h>

#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::sheet {

struct ScaleUnit {
  std::string name;   // "m", "ft", "mi"
  double metres = 1;  // one unit in metres
  std::string label;  // "Metres", "Feet", "Miles" (as printed after the bar)
};
// "m" (shown in kilometres when segments reach 1 km), "ft" (international foot), "mi"
// (international mile, 1609.344 m). Throws Error(input) for anything else.
ScaleUnit scale_unit(const std::string& name);

struct ScaleBarPlan {
  ScaleUnit unit;
  double display_factor = 1;  // value shown = units / display_factor (1000 for m -> km)
  std::string display_unit;   // "km", "m", "ft", "mi"
  double segment_units = 0;   // one main segment, in units
  int segments = 0;           // right of zero
  int subdivisions = 0;       // of the extension left of zero
  double segment_mm = 0;
  double total_mm() const { return segment_mm * (segments + 1); }
};

// The bar that fits in `max_length_mm` (extension included) at 1:N with 2 to 5 main segments.
ScaleBarPlan plan_scale_bar(double scale_denominator, double max_length_mm, const ScaleUnit& unit);

// "1:25 000": digits grouped by three with a space (common practice).
std::string representative_fraction(double scale_denominator);

// Draws one bar with its zero at `zero_mm` (the bar's top at zero_mm.y), values above, unit name
// to the right. Returns the box it occupies.
Box draw_scale_bar(cairo_t* cr, const ScaleBarPlan& plan, Point zero_mm, const style::Style& style,
                   text::FontCache& fonts);

// The imperial bar that suits 1:N in `max_length_mm`: miles when two whole miles fit, else feet.
std::string imperial_unit(double scale_denominator, double max_length_mm);

// The bars a sheet carries: the project's `stated` list when not empty; otherwise metres, and
// an imperial bar too when heights are not in metres (`height_unit_m` != 1).
std::vector<std::string> scale_bar_units(const std::vector<std::string>& stated,
                                         double height_unit_m, double scale_denominator,
                                         double max_length_mm);

// The bar length the scale panel allows in a box `width_mm` wide (room for the extension's and
// the unit's labels), at most 160 mm.
double scale_bar_room_mm(double width_mm);

// The scale box: the representative fraction, then one bar per unit, all with one zero.
void draw_scale_panel(cairo_t* cr, const Box& box, double scale_denominator,
                      const std::vector<std::string>& units, const style::Style& style,
                      text::FontCache& fonts);

}  // namespace sheetmill::sheet
