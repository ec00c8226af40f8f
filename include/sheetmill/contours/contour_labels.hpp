#pragma once
// Contour values and spot heights as label candidates for labels::place().
//
// Index contours get one candidate per label_spacing_mm of line on paper; each candidate offers
// positions on the straightest stretches nearby, cheapest first. Slots are anchored to a sheet-
// wide ladder (points every label_spacing_mm across the frame): a contour's slot near a ladder
// point is where the contour comes closest to it, so the values of neighbouring contours line
// up across the slope. The figures are centred on the line, the line breaks behind them
// (draw_contours cuts where the chosen footprint lies; the footprint includes a small gap each
// side), and the top of the figures faces uphill unless the style keeps them upright.

#include <string>
#include <vector>

#include "sheetmill/contours/contour_line.hpp"
#include "sheetmill/contours/spot_heights.hpp"
#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/terrain/dem.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::contours {

inline constexpr const char* kContourLabelLayer = "contour-labels";
inline constexpr const char* kSpotHeightLayer = "spot-heights";

// Extra data about each placement, in the same order as the candidates and their placements
// (for tests and for the render log): where the figures sit and which way they read.
struct LabelGeometry {
  std::size_t line = 0;  // index into the lines
  Point centre_mm;       // page position of the figures' centre (on the line)
  double angle_rad = 0;  // baseline direction, clockwise on the page
  Point up_mm;           // unit vector from baseline to the top of the figures (page)
};

struct ContourLabels {
  std::vector<labels::Candidate> candidates;
  std::vector<std::vector<LabelGeometry>> geometry;  // [candidate][placement]
};

// `unit_m` is the metres per unit of the figures (0.3048 for a DEM in feet): values are shown
// in the DEM's own vertical unit.
ContourLabels contour_label_candidates(const std::vector<ContourLine>& lines,
                                       const terrain::Dem& dem, const MapFrame& frame,
                                       const style::ContourStyle& style, text::FontCache& fonts,
                                       double unit_m = 1.0);

// The figures of an index contour's label, in units of `unit_m` metres.
std::string contour_label_text(const ContourLine& line, const style::ContourStyle& style,
                               double unit_m = 1.0);

// The brief's name: the candidates alone.
std::vector<labels::Candidate> label_candidates(const std::vector<ContourLine>& lines,
                                                const terrain::Dem& dem, const MapFrame& frame,
                                                const style::ContourStyle& style,
                                                text::FontCache& fonts, double unit_m = 1.0);

// Spot heights: the figures beside the dot, right of it first, then left, above, below.
// Spot elevations are rounded to style.spot_round_m units of `unit_m` metres.
std::vector<labels::Candidate> spot_label_candidates(const std::vector<SpotHeight>& spots,
                                                     const MapFrame& frame,
                                                     const style::ContourStyle& style,
                                                     text::FontCache& fonts, double unit_m = 1.0);

}  // namespace sheetmill::contours
