#pragma once
// A sheet's contours as values: built by the render stage's contour layer from the DEM (or a
// supplied layer), held by PreparedSheet, drawn by the draw phase.

#include <vector>

#include "sheetmill/contours/contour_line.hpp"
#include "sheetmill/contours/spot_heights.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::render {

struct SheetContours {
  double interval_m = 0;
  contours::HeightUnit unit;  // heights are shown in the DEM's vertical unit
  std::vector<contours::ContourLine> lines;
  terrain::Dem dem;                         // the grid they came from (for uphill labels)
  std::vector<contours::SpotHeight> spots;  // summits from the DEM
  std::vector<labels::Candidate> labels;    // index values and spot heights
};

}  // namespace sheetmill::render
