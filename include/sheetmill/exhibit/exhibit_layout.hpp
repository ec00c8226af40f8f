#pragma once
// The exhibit template: a title band across the top, the map beneath it, and a furniture band
// along the bottom holding, left to right, the elevation colour bar, the scale bar and north
// arrow, the inset location map, and the notes (legend of areas, credits, caution).
//
// All boxes are page millimetres from the top-left corner, y down, inside the paper margins.
// The map frame holds the project's extent at exactly 1:scale (the project's, or the largest
// tidy scale at which the extent fits: a two-significant-figure denominator), centred in the
// space between the title band and the furniture band, and grown to fill that space where the
// DEM has terrain to show. The furniture band is as tall as its notes need.
// Throws Error(input) when a stated scale cannot fit the extent on the paper.

#include <vector>

#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/type_scale.hpp"

namespace sheetmill::exhibit {

struct ExhibitLayout {
  double page_w_mm = 0;
  double page_h_mm = 0;
  std::string paper_name;
  double margin_mm = 0;
  TypeScale type;
  MapFrame frame;  // map_box is frame.page_box_mm()
  Box map_box_mm;
  Box title_box_mm;
  Box colour_bar_box_mm;
  Box scale_box_mm;  // scale bar (left part) and north arrow (right part)
  Box inset_box_mm;
  Box notes_box_mm;
};

ExhibitLayout compute_exhibit_layout(const ExhibitProject& project);
// The same, with the frame grown around the extent to fill the space for the map, as far as
// `terrain_ground` (the DEM's footprint in the sheet CRS, sheet/dem_footprint.hpp) reaches.
ExhibitLayout compute_exhibit_layout(const ExhibitProject& project,
                                     const std::vector<Point>& terrain_ground);

// The scale denominator: the smallest two-significant-figure number (1.0, 1.1 ... 9.9 x 10^k)
// not below `exact`.
double tidy_scale(double exact);

}  // namespace sheetmill::exhibit
