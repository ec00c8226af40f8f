#pragma once
// Contours from a DEM with GDAL's contour generator (GDALContourGenerateEx, into an in-memory
// OGR layer), classified (index, supplementary, depression), oriented (higher ground on the
// left) and, in generate(), prepared for print (contours/prepare.hpp).

#include <utility>
#include <vector>

#include "sheetmill/contours/contour_line.hpp"
#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::contours {

// Raw lines exactly as GDAL traces them (only reversed where needed for the orientation and
// closed loops stored without their repeated point), with flags set. Supplementary lines, when
// asked for, are the half-interval levels cut to the stretches where the slope is gentle.
// Throws Error(input) for bad parameters, a DEM without data or relief, or far too many levels
// (without a file name: the caller knows which DEM it read). The Dem must outlive the call only.
std::vector<ContourLine> generate_raw(const terrain::Dem& dem, const ContourParams& params);

// generate_raw() followed by prepare_for_print().
std::vector<ContourLine> generate(const terrain::Dem& dem, const ContourParams& params);

// A contour interval for a sheet, by our documented rule of thumb (docs/contours.md): aim at
// about 40 levels across the relief, kept within [N/5000, N/2500] metres for a scale 1:N (so
// 5-10 m at 1:25 000 and 10-20 m at 1:50 000, common practice), rounded to 1, 2, 2.5 or 5 x 10^k
// of the unit heights are shown in (`unit_m` metres), or for feet (international or US survey)
// to the usual foot intervals 1, 2, 5, 10, 20, 25, 40, 50, 80, 100, 200, 250, 500, 1000 ft.
// Returns metres.
double propose_interval_m(double scale_denominator, double relief_m, double unit_m = 1.0);

// Elevation range of the finite cells; {NaN, NaN} when there are none.
std::pair<double, double> elevation_range(const terrain::Dem& dem);

}  // namespace sheetmill::contours
