#pragma once
// An exhibit project file (docs/exhibit.md): one large shaded-relief sheet for a public hearing.
// An immutable value once loaded; every path is resolved against the project file's folder,
// every length is millimetres on paper, every elevation metres. Loading checks keys and values
// and throws Error(input) "FILE:LINE:COL: KEY.PATH: what was expected"; it opens no data.

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/colour.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/terrain/tint.hpp"

namespace sheetmill::exhibit {

// A vector layer: a file (any OGR source) and, optionally, a layer in it and an OGR SQL filter.
struct LayerRef {
  std::string path;
  std::string layer;
  std::string where;
  std::string name_field = "name";    // water: names; places: see PlaceCallouts
  std::string class_field = "class";  // roads: main, secondary, other
  std::string number_field = "ref";   // roads: the road's number
};

// A project boundary or one of several alternatives, drawn with a strong outline.
struct AreaOverlay {
  LayerRef data;      // polygons from a file ...
  Polyline ring;      // ... or one ring stated in the project (sheet CRS); then
                      // data.path is empty
  std::string label;  // legend text, e.g. "Alternative B: upstream basin"
  Colour colour{0.78, 0.12, 0.35, 1};
  double width_mm = 2.5;
  std::vector<double> dash_mm;  // empty: solid
  bool focus = true;            // part of the area of interest (not dimmed)
};

struct PlaceCallouts {
  LayerRef data;
  std::string name_field = "name";
  std::vector<std::string> only;  // names to call out; empty = every feature of the layer
};

struct ContextLayers {
  std::optional<LayerRef> water_areas;
  std::optional<LayerRef> water_lines;
  std::optional<LayerRef> roads;
};

enum class ReliefCompression { lossless, jpeg };

struct ReliefSettings {
  std::string dem;                                   // raster path (resolved)
  std::optional<std::string> dem_crs;                // when the DEM carries none
  std::string ramp_name = "groundlight";             // a shipped ramp (ramps.hpp) ...
  std::optional<terrain::TintRamp> ramp;             // ... or explicit stops / a ramp file
  std::optional<std::pair<double, double>> range_m;  // shipped ramp stretched over this range
  double exaggeration = 1;
  double shade_strength = 0.55;  // 0..1, multiply blend of the hillshade
  double altitude_deg = 45;
  double dpi = 300;  // relief resolution on paper
  ReliefCompression compression = ReliefCompression::jpeg;
  int jpeg_quality = 88;              // 1..100, GDAL JPEG driver QUALITY
  std::optional<Colour> water_shade;  // soft tint over water areas; nullopt = none
};

struct ExhibitProject {
  std::filesystem::path file;
  std::string title;
  std::string subtitle;
  std::string producer;
  std::string date;
  std::vector<std::string> credits;  // data sources, one line each
  std::vector<std::string> notes;    // extra lines for the notes panel
  std::string crs;                   // sheet CRS as written (EPSG:32632)
  std::string paper;                 // paper name or "WxH mm|in" (sheet/paper_sizes.hpp)
  bool landscape = false;
  Box extent;                   // ground box to show (sheet CRS metres)
  std::optional<double> scale;  // N of 1:N; default: the largest tidy scale that fits
  ReliefSettings relief;
  ContextLayers context;
  std::vector<AreaOverlay> areas;
  double dim_outside = 0;  // 0..1 white veil outside the focus areas
  std::optional<PlaceCallouts> places;
};

ExhibitProject load_exhibit_project(const std::filesystem::path& path);
// The same from YAML text; `name` stands for the file (relative paths resolve against its folder).
ExhibitProject parse_exhibit_project(const std::string& yaml_text, const std::string& name);

}  // namespace sheetmill::exhibit
