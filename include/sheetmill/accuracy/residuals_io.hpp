#pragma once
// The residuals of an accuracy test as a table: CSV (one header line, then one row per check
// point, refused points included with their reason) or a GeoPackage point layer "residuals" in
// the DEM's CRS, chosen by the output's extension (.csv or .gpkg). Written atomically.

#include <filesystem>

#include "sheetmill/accuracy/assess.hpp"

namespace sheetmill::accuracy {

// Throws Error(input) for another extension or an unwritable folder.
void write_residuals(const Assessment& a, const std::filesystem::path& out);

}  // namespace sheetmill::accuracy
