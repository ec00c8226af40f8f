#pragma once
// Reading and writing tile indexes. Any polygon layer GDAL can read serves as an index; the ID
// and name fields are named in the project (project::TileIndex). Written indexes are one
// GeoPackage layer with the fields sheet_id, name, row, col and the neighbour IDs n s e w ne nw
// se sw (NULL where no sheet adjoins), replacing the file atomically.

#include <filesystem>
#include <string>
#include <vector>

#include "sheetmill/batch/index_plan.hpp"
#include "sheetmill/batch/sheet_job.hpp"
#include "sheetmill/core/geometry.hpp"

namespace sheetmill::batch {

void write_tile_index(const IndexPlan& plan, const std::filesystem::path& gpkg,
                      const std::string& layer = "sheets");

struct AreaOfInterest {
  Box box;                                // in the requested CRS
  std::vector<std::string> polygons_wkt;  // in the requested CRS
};

// The polygons of a layer (first layer when `layer` is empty), transformed to `crs`.
AreaOfInterest read_area_polygons(const std::string& path, const std::string& layer,
                                  const std::string& crs);

struct TileIndexContent {
  std::string crs_wkt;           // "" when the layer has none
  std::vector<SheetJob> sheets;  // in the layer's order; `output` not yet set
};

// Reads every feature's ID, name, attributes (as text) and footprint. Throws Error(input) for a
// missing layer or field, a feature without an ID or without a polygon. Features are held as
// small values (one envelope and one WKT string each), so memory grows with the index only by
// that, not by the data.
TileIndexContent read_tile_index(const std::string& path, const std::string& layer,
                                 const std::string& id_field, const std::string& name_field);

}  // namespace sheetmill::batch
