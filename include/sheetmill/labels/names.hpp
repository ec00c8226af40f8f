#pragma once
// Name labels for features, as Candidates for labels::place(). Page millimetres throughout.
//
// Points: horizontal text in several positions around the symbol, in order of preference
// (right, upper right, lower right, left, above, below), each a cost step apart.
// Lines: text curved along the line glyph by glyph (text::layout_on_path: each advance a chord
// of the smoothed line, so letters and word spaces keep their shaped spacing), turned to read
// upright, at intervals of LabelStyle::repeat_mm (once, at the middle, when 0), shifted along the
// line to avoid bends sharper than 20 degrees between neighbouring glyphs; never past the line's
// end. Footprints are per-glyph boxes.
// Areas: at the pole of inaccessibility (Garcia-Castellanos and Lombardo 2007, "Poles of
// inaccessibility: a calculation algorithm for the remotest places on Earth", Scottish
// Geographical Journal 123(3)), only where the whole text box stays inside the area; with
// spread_in_area, letter-spaced to span about 60 % of the area's width there.
// Text goes through HarfBuzz with the font's fallbacks, so accents and non-Latin scripts shape.
// A function returns no candidate when the text is empty or cannot fit at all.

#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::labels {

// Field names used in a text template ("{name} {ele} m" -> name, ele), in order, no repeats.
std::vector<std::string> template_fields(const std::string& text_template);

// Fills a template; a field without a value becomes empty. Whitespace is trimmed at both ends.
std::string expand_template(const std::string& text_template,
                            const std::function<const std::string*(const std::string&)>& value,
                            bool upper_case = false);

// A field's value as a label prints it: rounded to `decimals` places when it reads as a number
// (808.65380859375 with 0 gives "809"; -0.2 gives "0", never "-0"), otherwise unchanged.
std::string format_field(const std::string& value, int decimals);

// The label text of a feature: the style's template filled from `value`, numeric fields rounded
// as the style's `decimals` say, in capitals when it asks.
std::string label_text(const style::LabelStyle& style,
                       const std::function<const std::string*(const std::string&)>& value);

std::optional<Candidate> point_name(text::FontCache& fonts, const style::LabelStyle& style,
                                    const std::string& text, Point anchor_mm,
                                    double symbol_radius_mm, const std::string& layer);

// Zero or more candidates (one per repeat) along one polyline.
std::vector<Candidate> line_names(text::FontCache& fonts, const style::LabelStyle& style,
                                  const std::string& text, const Polyline& path_mm,
                                  const std::string& layer);

// `rings_mm`: outer ring(s) and holes of one area, even-odd.
std::optional<Candidate> area_name(text::FontCache& fonts, const style::LabelStyle& style,
                                   const std::string& text, const std::vector<Polyline>& rings_mm,
                                   const std::string& layer);

// The pole of inaccessibility of an area (even-odd rings) to within `precision` (same units),
// and its distance to the nearest edge. Empty rings give {centre of nothing, 0}.
struct InteriorPoint {
  Point at;
  double clearance = 0;
};
InteriorPoint pole_of_inaccessibility(const std::vector<Polyline>& rings, double precision);

}  // namespace sheetmill::labels
