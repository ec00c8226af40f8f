#pragma once
// The caution carried by every data product (GeoTIFF relief rasters, contour GeoPackages), as
// the collar carries it on sheets: a user may take them into their own maps, away from ours.

namespace sheetmill {

inline constexpr const char* kProductCaution =
    "Derived from a DEM for mapping; not a survey. Positions and elevations are approximate. "
    "Verify boundaries, hazards and heights that matter with the local authorities and a "
    "licensed surveyor; local codes and licensed practice take precedence.";

}  // namespace sheetmill
