#pragma once
// A project file (docs/project.md): what to map, where the data is, and on what paper. Kept apart
// from the style (the team's symbol scheme). An immutable value once loaded; every path is
// resolved against the project file's folder.

#include <filesystem>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::project {

// A logical data source that style layers refer to by name.
struct Source {
  std::string name;      // the key the style uses ("roads")
  std::string path;      // file path (resolved) or a GDAL connection string
  std::string layer;     // layer inside the dataset; empty = the first/only one
  std::string where;     // optional attribute filter in OGR SQL, pushed down to GDAL
  bool required = true;  // missing required source = error; optional = warning
};

// The paper name of `paper: {size: fit}`: the layout picks the smallest ISO A size that holds
// the frame (sheet::fitting_paper); width and height stay 0 until then.
inline constexpr const char* kFitPaper = "fit";

struct Paper {
  std::string name;     // "A1", "ARCH E", "custom"
  double width_mm = 0;  // after orientation is applied
  double height_mm = 0;
};

// How the map frame's extent is chosen; exactly one is set.
struct Extent {
  std::optional<Point> centre;          // sheet CRS; frame size from paper and collar
  std::optional<Box> box;               // sheet CRS bounding box
  std::optional<std::string> sheet_id;  // a feature of the tile index
};

struct TileIndex {
  std::string path;
  std::string layer;
  std::string id_field = "sheet_id";
  std::string name_field = "name";
};

struct Elevation {
  std::string dem;                            // raster path; empty = no relief
  std::optional<std::string> vertical_unit;   // "m", "ft", "us-ft"; default from the CRS
  std::optional<std::string> crs;             // when the DEM carries none
  std::optional<std::string> vertical_datum;  // text for the notes, e.g. "EGM2008 height"
  // The sea (or water surface) level as a height on that datum, in metres: below it contours
  // are depths and the relief shows water. Unset: no sea.
  std::optional<double> sea_level_m;
};

struct ContourSettings {
  std::optional<double> interval_m;  // else style, else proposed from scale and relief
  double base_m = 0;
  std::optional<Source> from_layer;  // supplied contours instead of the DEM
  std::string elevation_field = "elevation";
};

struct Magnetic {
  std::optional<std::string> model_file;  // WMM coefficient file
  std::optional<double> declination_deg;  // stated by hand, east positive
  std::optional<double> annual_change_deg;
  std::optional<std::string> date;  // YYYY-MM-DD or decimal year; default: today
};

// Check points that test the DEM (docs/accuracy.md): the sheet's notes print the NSSDA
// statement and warn when the contour interval is finer than the points support.
struct AccuracyCheck {
  std::string points;                  // point source (resolved path or connection string)
  std::string layer;                   // empty: the first point layer
  std::string height_field;            // empty: the usual names
  std::string id_field;                // empty: "id"
  std::optional<std::string> crs;      // when the points state none
  std::string height_unit = "m";       // "m", "ft", "us-ft"
  std::string cover_field;             // land-cover class field; empty: none
  std::vector<std::string> vegetated;  // classes counted as vegetated ground
  std::optional<std::string> date;     // of the test; default: revision, else today
};

struct Output {
  double relief_dpi = 300;
  std::string relief_compression = "lossless";  // "lossless" or "jpeg"
  int jpeg_quality = 85;
  std::string file_template = "{id}.pdf";  // batch output names
};

struct Project {
  std::filesystem::path file;
  std::string title;
  std::string subtitle;
  std::string producer;
  std::string revision_date;
  std::vector<std::string> data_credits;  // "Roads: County survey 2024"
  std::vector<std::string> notes;         // extra collar notes
  std::string crs;                        // sheet CRS as the user wrote it (EPSG:32633)
  double scale = 25000;                   // N of 1:N
  Paper paper;
  std::optional<double> margin_mm;      // override of the style's margins
  std::vector<std::string> scale_bars;  // "m", "ft", "mi", one bar each; empty: automatic
  Extent extent;
  std::filesystem::path style;
  Elevation elevation;
  ContourSettings contours;
  std::map<std::string, Source> sources;  // by logical name
  std::string vector_data;                // default dataset: a source not listed in
                                          // `sources` is its layer of the same name
  std::optional<TileIndex> tile_index;
  Magnetic magnetic;
  std::optional<AccuracyCheck> accuracy;
  Output output;
};

Project load_project(const std::filesystem::path& path);

// The source a style layer names: from `sources`, else the layer of that name in `vector_data`.
// Throws Error(input) when neither provides it.
Source source_for(const Project& project, const std::string& name);

// Paper by name ("A3", "ANSI D", "ARCH E1", ...), portrait; throws Error(input) if unknown.
// Sizes: ISO 216 (A0-A4), ANSI A-E, ARCH A-E and E1.
Paper paper_by_name(const std::string& name);
std::vector<std::string> paper_names();

}  // namespace sheetmill::project
