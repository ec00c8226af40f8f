#pragma once
// Where everything goes on the paper: the map frame at the exact scale, the collar around it and
// the panels of sheet furniture. All boxes are page millimetres from the top-left corner, y down.
//
// compute_layout() guarantees: 1 m on the ground is exactly 1000/N mm on the page (N of 1:N);
// map_box_mm is the frame's page box; every furniture box lies inside the paper margins and
// outside the collar box. It reads the tile index when the extent names an index sheet (the only
// data it opens) and throws Error(input) when the extent does not fit on the paper.

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/map_frame.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/sheet/tile_index.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::sheet {

struct Layout {
  double page_w_mm = 0;
  double page_h_mm = 0;
  MapFrame frame;
  std::string crs_definition;  // the sheet CRS as the project states it
  Box map_box_mm;              // the frame on the page (bounding box of the neatline)
  Box collar_box_mm;           // map box grown by the collar: grid labels live between the two
  Box title_box_mm;
  Box legend_box_mm;
  Box scale_box_mm;  // scale bars and representative fraction: a band under the collar box
  Box north_box_mm;  // true, grid and magnetic north diagram
  Box notes_box_mm;
  Box diagrams_box_mm;        // adjoining sheets and location diagrams
  Box panel_box_mm;           // the furniture panel (title to diagrams), packed by the collar
  bool panel_at_side = true;  // right of the map; otherwise under it
  Box sheet_frame_mm;         // the outer frame: encloses collar box, scale band and panel
  bool neatline_is_graticule = false;     // the neatline follows meridians and parallels
  std::optional<IndexSheet> index_sheet;  // the tile-index sheet this layout frames, if any
};

// The paper as the layout uses it: the project's (already oriented) paper, or, when the project
// asks for paper that fits (size: fit), the smallest ISO A size (A4 up to A0, either
// orientation) that holds frame, collar, scale band and panel (see fitting_paper).
Layout compute_layout(const project::Project& project, const style::Style& style,
                      const std::optional<std::string>& sheet_id);

// The same, with the tile index already read (batch renders read it once).
Layout compute_layout(const project::Project& project, const style::Style& style,
                      const std::optional<std::string>& sheet_id, const TileIndexContents* index);

// The smallest ISO A paper (A4 to A0, portrait or landscape, smaller area first) on which the
// frame at 1:N fits with its collar, scale band and panel. Throws Error(input) when not even A0
// holds it.
project::Paper fitting_paper(const project::Project& project, const style::Style& style,
                             const Box& ground);

}  // namespace sheetmill::sheet
