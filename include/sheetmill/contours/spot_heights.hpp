#pragma once
// Spot heights: summits (local maxima standing out by a prominence), optionally the lowest
// points of closed depressions, and control points (benchmarks) the caller read from a layer.
// Positions in ground metres of the sheet CRS; elevations in the DEM's unit (metres).

#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::contours {

struct SpotHeight {
  Point ground;
  double elevation_m = 0;
  enum class Kind { summit, depression, control } kind = Kind::summit;
  std::string label;  // control points: the surveyed label ("BM 17"); empty otherwise
};

// Summits whose topographic prominence (height above the highest col linking them to higher
// ground) is at least `min_prominence_m`. The highest cell of the grid counts with prominence
// equal to the whole relief. A summit counts only when its neighbourhood is known data down to
// `min_prominence_m` below it: the ground beyond the grid's edge or in a nodata hole may rise
// higher, so maxima on or near the edge or a nodata border are left out. Sorted by elevation,
// highest first.
std::vector<SpotHeight> find_summits(const terrain::Dem& dem, double min_prominence_m);

// The lowest points of closed depressions at least `min_depth_m` deep (the same measure as
// prominence, on the inverted surface, with the same rule for the edge and nodata). Sorted lowest
// first.
std::vector<SpotHeight> find_depression_bottoms(const terrain::Dem& dem, double min_depth_m);

// The label text of a spot height or contour value: `elevation_m` rounded to `round_m` and
// formatted without a trailing ".0" ("1234", "12.5"), put in `text_template` where it says
// {elevation_m} (or {ele}); the template's other text is kept.
std::string elevation_text(double elevation_m, double round_m, const std::string& text_template);

// The unit heights are shown in on a sheet: metres, or feet when the DEM's values are in feet
// (international or US survey: both are shown as "ft").
struct HeightUnit {
  double metres = 1.0;  // metres per unit
  std::string symbol = "m";
  std::string name = "metres";
};
HeightUnit height_unit(double metres_per_unit);

}  // namespace sheetmill::contours
