#pragma once
// Hillshading of a Dem.
//
// The output encoding is the common one (GDAL's): 0 = no data, otherwise
// round(1 + 254 * illumination) with the illumination (cosine of the light's incidence angle on
// the surface) clamped at 0, so bytes are comparable cell by cell with GDAL's hillshade.
// Every cell with data gets a value, including cells next to holes and at the grid's edge:
// a missing neighbour is reflected through the centre cell (z' = 2 z_centre - z_opposite, or
// z_centre when the opposite is missing too), which is exact on planes.

#include <cstdint>
#include <string>
#include <vector>

#include "sheetmill/terrain/dem.hpp"

namespace sheetmill::terrain {

enum class ShadeMethod {
  horn,                // Horn (1981) 3x3 gradient, eight neighbours
  zevenbergen_thorne,  // Zevenbergen and Thorne (1987), four neighbours
  multidirectional,    // Mark (1992) oblique weighting of lights at 225, 270, 315, 360 deg
};

struct ShadeParams {
  ShadeMethod method = ShadeMethod::horn;
  double azimuth_deg = 315;  // direction the light comes from, clockwise from north (grid north)
  double altitude_deg = 45;  // light's elevation above the horizon
  double exaggeration = 1;   // vertical exaggeration applied to elevations
};

// "horn", "zevenbergen-thorne", "multidirectional"; throws Error(input) otherwise.
ShadeMethod parse_shade_method(const std::string& name);
const char* shade_method_name(ShadeMethod method);

// The illumination of level ground: sin(altitude) for every method (the multidirectional
// kernel gives a flat cell sin(altitude) too).
double flat_illumination(const ShadeParams& params);

// One byte per cell, row-major, dem.width() * dem.height(). Uses both cores.
std::vector<std::uint8_t> hillshade(const Dem& dem, const ShadeParams& params);

// Shades rows [row0, row1) of `dem` into `out` (width * (row1 - row0) bytes), reading the rows
// above and below where they exist. Single-threaded; for callers that split work themselves.
void hillshade_rows(const Dem& dem, const ShadeParams& params, int row0, int row1,
                    std::uint8_t* out);

}  // namespace sheetmill::terrain
