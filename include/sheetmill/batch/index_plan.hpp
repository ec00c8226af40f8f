#pragma once
// Planning a tile index: the sheets that cover an area of interest at a scale, either as a grid
// of frames with corners on round ground values, or as cells of the graticule (for example
// 7.5' x 7.5'). Sheets are numbered in rows from the north and columns from the west; each
// knows its eight neighbours for the adjoining-sheets diagram. A pure computation: reading the
// area polygons and writing the GeoPackage are in tile_index_io.hpp.

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::batch {

enum class IndexAlignment { grid, graticule };

struct IndexSpec {
  std::string crs;  // sheet CRS as GDAL/PROJ accepts it ("EPSG:32633")
  double scale_denominator = 25000;
  // Grid alignment: the frame on paper. Its ground size is rounded DOWN to whole snap_m, and
  // the overlap to the nearest whole snap_m, so every corner falls on a multiple of snap_m.
  double frame_width_mm = 0;
  double frame_height_mm = 0;
  double overlap_mm = 0;
  double snap_m = 1000;
  IndexAlignment alignment = IndexAlignment::grid;
  // Graticule alignment: cell size in minutes of arc, on the CRS's own geographic datum.
  double cell_width_min = 7.5;
  double cell_height_min = 7.5;
  // The area of interest, in `crs`: a box, and optionally polygons (sheets must meet them).
  Box area;
  std::vector<std::string> area_polygons_wkt;
  // ID and name templates: {row} {col} (1-based, {row:3} pads with zeros), {row_a} {col_a}
  // (A..Z, AA, AB, ...), {e_km} {n_km} (south-west corner, grid), {lon} {lat} (south-west
  // corner in degrees, graticule); the name template may also use {id}.
  std::string id_template = "{row_a}{col:2}";
  std::string name_template = "Sheet {id}";
};

// Neighbour order in IndexSheet::neighbours and the index's field names.
inline constexpr std::array<const char*, 8> kNeighbourFields = {"n",  "s",  "e",  "w",
                                                                "ne", "nw", "se", "sw"};

struct IndexSheet {
  std::string id;
  std::string name;
  int row = 0;  // 1 = northernmost
  int col = 0;  // 1 = westernmost
  // Footprint in IndexPlan::crs_wkt, counter-clockwise, not closed: sheet-CRS metres (grid) or
  // the four lon/lat corners (graticule).
  std::vector<Point> ring;
  std::array<std::string, 8> neighbours;  // "" where no sheet adjoins
};

struct IndexPlan {
  std::string crs_wkt;       // the sheet CRS (grid), its geographic CRS (graticule)
  double frame_width_m = 0;  // grid: ground size actually used
  double frame_height_m = 0;
  double overlap_m = 0;
  std::vector<IndexSheet> sheets;  // row-major from the north-west
};

// Throws Error(input) for an impossible spec (frame smaller than the snap, empty area, a
// geographic CRS with grid alignment, more than a million sheets, duplicate IDs).
IndexPlan plan_tile_index(const IndexSpec& spec);

// "A".."Z", "AA".. for 1, 2, ...
std::string letters_for(int n);

}  // namespace sheetmill::batch
