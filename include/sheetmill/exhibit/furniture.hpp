#pragma once
// The furniture of an exhibit, drawn on a cairo_t in page millimetres: title band, elevation
// colour bar, scale bar, north arrow, inset location map and notes. Text is real, shaped text
// (text/shaping.hpp). Each function draws inside the box it is given.

#include <cairo.h>

#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/exhibit/exhibit_layout.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/terrain/tint.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::exhibit {

// Where the colour bar put each labelled value: the bar is drawn between bar_top_mm and
// bar_bottom_mm; value k's tick is at x_mm[k].
struct ColourBarReport {
  std::vector<double> values_m;
  std::vector<double> x_mm;
  double bar_top_mm = 0;
  double bar_bottom_mm = 0;
};

void draw_title(cairo_t* cr, const ExhibitLayout& layout, const ExhibitProject& project,
                text::FontCache& fonts);

// A horizontal bar (one gradient) with the ramp's colours placed linearly in elevation, a tick and
// a label at every stop, the heading "Elevation (metres)" and, when the exaggeration is not 1, the
// line "Vertical exaggeration Nx".
ColourBarReport draw_colour_bar(cairo_t* cr, const Box& box, const terrain::TintRamp& ramp,
                                double exaggeration, const TypeScale& type, text::FontCache& fonts);

// A scale bar of a Heckbert (1990) nice length with four alternating segments, labelled in m
// or km, and the representative fraction at printed size. Returns the bar's length in metres.
double draw_scale_bar(cairo_t* cr, const Box& box, const MapFrame& frame, const TypeScale& type,
                      text::FontCache& fonts);

// A north arrow pointing to true north at the frame centre (grid convergence from PROJ), in
// the box; returns the angle of true north clockwise from grid north, degrees: the negative of
// sheet::PointFactors::grid_convergence_deg (grid north clockwise from true north).
double draw_north_arrow(cairo_t* cr, const Box& box, const MapFrame& frame, const TypeScale& type,
                        text::FontCache& fonts);

// Area legend, credits, the exhibit's notes and the caution.
void draw_notes(cairo_t* cr, const Box& box, const ExhibitProject& project, const TypeScale& type,
                text::FontCache& fonts);

// The caution printed on every exhibit.
const std::vector<std::string>& caution_lines();

// Lines of `text` no wider than width_mm at size_pt (greedy, by shaped word widths).
std::vector<std::string> wrap_text(text::FontCache& fonts, const text::FontKey& key, double size_pt,
                                   const std::string& text, double width_mm);

}  // namespace sheetmill::exhibit
