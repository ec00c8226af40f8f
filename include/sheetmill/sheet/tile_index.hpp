#pragma once
// The sheets of a tile index, read once with GDAL and expressed in the sheet CRS: for the
// extent of an index sheet, its adjoining sheets and the location diagram.
//
// Outlines are closed rings (first point not repeated) in sheet-CRS metres. When the index is in
// a geographic CRS its edges are meridians and parallels: they are densified in longitude and
// latitude before projecting, so the outline is the sheet's true (curved) neatline.

#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/project/project.hpp"

namespace sheetmill::sheet {

struct IndexSheet {
  std::string id;
  std::string name;
  std::vector<Point> outline;  // sheet CRS
  Box bounds;                  // of the outline
};

struct TileIndexContents {
  std::vector<IndexSheet> sheets;
  bool geographic = false;  // the index is in longitude/latitude (graticule sheets)
};

// Throws Error(input) when the index cannot be read, lacks the id field, or has no polygons.
TileIndexContents read_tile_index(const project::TileIndex& index,
                                  const std::string& sheet_crs_definition);

// The sheet with `id`; throws Error(input) naming the index when there is none.
const IndexSheet& find_sheet(const TileIndexContents& index, const std::string& id,
                             const std::string& index_path);

// Sheets sharing an edge or a corner with `sheet` (bounds touching within `tolerance_m`).
std::vector<const IndexSheet*> adjoining_sheets(const TileIndexContents& index,
                                                const IndexSheet& sheet, double tolerance_m = 1.0);

}  // namespace sheetmill::sheet
