#pragma once
// The one table of sane bounds for every length, count and scale a user can give, in a project
// or style file or on the command line. Values are checked where they are read, and the message
// names the key path (or option) and the bound, so that a typo such as 1e300mm or a spacing of
// 1e-5mm is an input error in milliseconds, not an hour of work or 20 GB of memory.
//
// The bounds are wide: each is far beyond what a printed sheet can use, and chosen so that the
// work a single value can cause stays within what one sheet needs.

#include <cstddef>

#include "sheetmill/core/scale_text.hpp"

namespace sheetmill::config::bounds {

// Any length on paper: 200 in, the largest page a PDF may have (ISO 32000-1, annex C.2:
// 14,400 units of 1/72 in).
inline constexpr double max_paper_length_mm = 200 * 25.4;
// The finest repeat of marks along a line, hatching lines or pattern symbols. 0.1mm is below
// what a plate or an inkjet resolves (common practice: printed line gaps of 0.15mm and more).
inline constexpr double min_repeat_spacing_mm = 0.1;
// Any ground length (contour interval, elevation, snap): Earth's circumference is 4e7 m.
inline constexpr double max_ground_length_m = 1e8;
// Any coordinate of an extent or box, in the units of its CRS (metres, feet or degrees).
inline constexpr double max_abs_coordinate = 1e9;
// The representative fraction 1:N: from 1:1 to 1:100,000,000 (a world map on a page).
inline constexpr double max_scale_denominator = kMaxScaleDenominator;  // core/scale_text.hpp
// The most digits a sheet-ID template may pad a number to ({row:WIDTH}).
inline constexpr int max_id_pad_digits = 16;
// The most marks, hatching lines or pattern symbols one feature may generate on a sheet.
inline constexpr std::size_t max_symbols_per_feature = 1'000'000;

// The largest DEM the relief raster commands (shade, slope, tint) turn into a raster of its own
// grid: 10^10 cells, a 100,000 x 100,000 DEM, some hours of work and tens of GB of output.
inline constexpr double max_relief_raster_cells = 1e10;

}  // namespace sheetmill::config::bounds
