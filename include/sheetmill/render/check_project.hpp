#pragma once
// `sheetmill check`: everything render would read, read and reported, nothing drawn. The report
// says where the sheet lies (paper, frame, ground extent, CRS), which style layers find their
// sources and how many features each has on the sheet, what the DEM covers, and which contour
// interval the sheet would get. Reading errors are the ones render raises, word for word.

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::render {

struct LayerCheck {
  std::string layer;
  std::string source;    // the project source name the layer reads
  bool visible = true;   // drawn at the project's scale
  bool found = true;     // the source and its layer opened
  long features = 0;     // features on the sheet (inside the frame and its clip margin)
  std::string problem;   // why it was not found (the reader's message)
  bool required = true;  // a missing required source stops render
};

struct ProjectCheck {
  std::string title;
  std::string style_name;
  double scale_denominator = 0;
  std::string paper;  // "A2 landscape, 594 x 420 mm"
  double frame_w_mm = 0, frame_h_mm = 0;
  Box ground;  // the frame's bounding box, sheet CRS metres
  std::string crs_name;
  int epsg = 0;
  // Elevation.
  std::string dem;  // empty: no DEM
  double dem_cell_m = 0;
  double dem_coverage = 0;  // share of the frame with data, 0..1
  double min_height = 0, max_height = 0;
  std::string height_unit = "m";
  double interval = 0;        // in height_unit; 0: no contours
  std::string interval_from;  // "the project", "the style" or "proposed from scale and relief"
  std::optional<long> index_sheets;
  std::vector<LayerCheck> layers;

  // The first missing required source, as render would report it; empty when none.
  std::optional<Error> first_error;
};

// Loads nothing itself: takes the loaded project and style. Throws Error(input) exactly where
// render would for the layout and the DEM; missing sources are collected in the result.
ProjectCheck check_project(const project::Project& project, const style::Style& style,
                           const std::optional<std::string>& sheet_id = std::nullopt);

// The report as printed by `sheetmill check`, one fact per line.
std::string describe_check(const ProjectCheck& check);

}  // namespace sheetmill::render
