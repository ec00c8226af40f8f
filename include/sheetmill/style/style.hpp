#pragma once
// The team's symbol scheme, as loaded from a style file (docs/style.md). An immutable value once
// loaded: every colour resolved from the palette, every length in millimetres on paper, every type
// size in points. Nothing here knows about data sources: a layer names a logical source
// ("roads") that the project file maps to a real dataset.

#include <cstdint>
#include <filesystem>
#include <map>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/colour.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/geometry.hpp"
#include "sheetmill/colour/colour_engine.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::style {

using Colour = sheetmill::Colour;

enum class LineCap { butt, round, square };
enum class LineJoin { miter, round, bevel };

// One pass of ink along a line. Strokes with a lower `pass` are drawn for every feature of the
// layer before strokes of a higher pass, so road casings (pass 0) merge under fills (pass 1)
// across all road classes.
struct Stroke {
  Colour colour;
  double width_mm = 0.25;
  LineCap cap = LineCap::butt;
  LineJoin join = LineJoin::round;
  std::vector<double> dash_mm;  // on, off, on, off ...; empty for solid
  double dash_offset_mm = 0;
  double offset_mm = 0;  // parallel offset, + to the left of the line's direction
  int pass = 0;
};

// A point shape built from primitives, in millimetres around the symbol's anchor (y down).
struct ShapePart {
  enum class Kind { circle, square, triangle, cross, path };
  Kind kind = Kind::circle;
  double size_mm = 1.0;   // diameter, side, or cross arm length
  std::string path_data;  // Kind::path: "M x y L x y ... Z" in mm, relative to the anchor
  Point offset_mm;
  std::optional<Colour> fill;
  std::optional<Stroke> outline;
};

struct PointSymbol {
  std::vector<ShapePart> parts;
  double scale = 1.0;          // multiplies every size of the parts
  std::string rotation_field;  // degrees clockwise from north (sheet up); empty = none
  double rotation_deg = 0;     // fixed rotation when no field
};

// Marks repeated along a line: ticks (railway sleepers, embankment hachures) or small symbols.
struct LineMarks {
  double spacing_mm = 2.0;
  double start_mm = 1.0;   // distance of the first mark from the line's start
  double length_mm = 0.8;  // tick length
  enum class Side { left, right, both } side = Side::both;
  Stroke stroke;                      // the tick's ink
  std::optional<PointSymbol> symbol;  // instead of a tick, a symbol rotated with the line
};

struct LineSymbol {
  std::vector<Stroke> strokes;  // drawn in order within a pass
  std::vector<LineMarks> marks;
};

struct Hatch {
  double spacing_mm = 1.0;
  double angle_deg = 45;  // counter-clockwise from the page's x axis
  Stroke stroke;
};

// Point pattern fill, anchored to the page origin so adjacent areas line up.
struct PatternFill {
  PointSymbol symbol;
  double spacing_x_mm = 3.0;
  double spacing_y_mm = 3.0;
  bool staggered = true;  // every other row shifted by half a spacing
};

struct AreaSymbol {
  std::optional<Colour> fill;
  std::vector<Hatch> hatches;
  std::optional<PatternFill> pattern;
  std::optional<Stroke> outline;
};

// Which features a rule applies to. An empty filter matches everything.
struct Filter {
  enum class Kind { always, equals, one_of, range };
  Kind kind = Kind::always;
  std::string field;
  std::vector<std::string> values;  // equals (one value) and one_of
  std::optional<double> min;        // range: min <= v < max; either end may be open
  std::optional<double> max;
};

using FontSpec = text::FontKey;

struct Halo {
  Colour colour{1, 1, 1, 1};
  double width_mm = 0.3;
};

enum class LabelPlacement { point, line, area };

struct LabelStyle {
  std::string text_template;  // "{name}" or "{name} {ele} m": fields in braces
  FontSpec font;
  double size_pt = 8;
  Colour colour;
  std::optional<Halo> halo;
  double letter_spacing_em = 0;  // extra space between letters, in ems
  LabelPlacement placement = LabelPlacement::point;
  int priority = 50;            // higher is placed first
  double repeat_mm = 0;         // along lines: distance between repeats; 0 = once
  double offset_mm = 1.0;       // points: gap between symbol and text
  bool may_drop = true;         // false: placed even when it collides (and reported)
  bool spread_in_area = false;  // areas: letter-space to fill the area (lakes, regions)
  bool upper_case = false;
  // Numeric fields rounded to a number of decimals in the text ("decimals: {elevation_m: 0}");
  // a field not named, or a value that is not a number, is printed as the data has it.
  std::map<std::string, int> decimals;
};

struct Rule {
  std::string name;  // for the log and the legend's order
  Filter filter;
  std::string legend;  // legend text; empty = not in the legend
  std::optional<LineSymbol> line;
  std::optional<AreaSymbol> area;
  std::optional<PointSymbol> point;
  std::optional<LabelStyle> label;  // overrides the layer's label
};

// A layer's part in line displacement (see features/displace.hpp): where its lines run closer to
// another taking part than the two symbols' half-widths, the one of lower priority moves sideways
// until they touch, by at most max_shift_mm (0: it never moves, others yield to it).
struct Displacement {
  int priority = 0;
  double max_shift_mm = 0;
};

struct Layer {
  std::string id;        // unique within the style
  std::string source;    // logical source name, mapped by the project file
  std::string group;     // optional-content group in the PDF (water, transport, ...)
  double min_scale = 0;  // visible when min_scale <= N <= max_scale (N of 1:N); 0 = open
  double max_scale = 0;
  int order = 0;               // draw order; lower first; ties keep file order (see ReliefStyle);
                               // none in the style: by kind (style/default_order.hpp)
  bool obstacle = false;       // labels avoid this layer's symbols
  bool water_surface = false;  // its areas are water (lakes, ponds): contours are clipped out
  std::optional<Displacement> displacement;  // its lines take part in displacement
  std::vector<Rule> rules;                   // first matching rule wins
  std::optional<LabelStyle> label;
};

// Relief under the map.
struct TintStop {
  double elevation_m = 0;
  Colour colour;
};

// Where relief and contours are drawn among the layers (Layer::order): after every layer of a
// lower or equal order. The defaults give the usual stack (common practice) with the stock
// styles' numbering: area fills (10), relief (15), water areas (20), contours (22), water lines
// (25), transport, buildings, names.
inline constexpr int kDefaultReliefOrder = 15;
inline constexpr int kDefaultContoursOrder = 22;

struct ReliefStyle {
  int order = kDefaultReliefOrder;  // drawn with a multiply blend: it only darkens what is under it
  bool hillshade = true;
  std::string method = "multidirectional";  // horn | zevenbergen-thorne | multidirectional
  double azimuth_deg = 315;
  double altitude_deg = 45;
  double exaggeration = 1;
  double shade_strength = 0.5;    // 0 = no shading, 1 = full multiply
  bool flat_ground_white = true;  // shading.flat_ground: white (only shadows add tone) | grey
  bool tint = false;
  std::vector<TintStop> tint_stops;
  bool tint_stepped = false;
  bool tint_steps_follow_contours = false;
  double tint_strength = 1.0;
  std::optional<Colour> water_shade;  // optional soft shading of water bodies
  double dpi = 300;                   // relief raster resolution on paper
  std::string resampling = "auto";    // DEM to print grid: auto | cubic | bilinear | average
};

// Below the project's sea level: depth contours, the coastline, and the sea in the relief.
struct DepthStyle {
  LineSymbol line;               // depth contours
  LineSymbol index_line;         // index depth contours
  bool figures_as_depth = true;  // labels as depths below the sea level; false: negative heights
  LineSymbol coastline;          // the line at the sea level (water colour by default)
  Colour sea;                    // the sea's tint in the relief (the style's water colour)
  bool sea_shaded = false;       // hillshade over the sea floor too
};

struct ContourStyle {
  int order = kDefaultContoursOrder;  // contours, their figures, spot heights, depression ticks
  int index_every = 5;                // common practice: every fifth line is an index contour
  std::optional<double> interval_m;   // the project may override
  LineSymbol line;
  LineSymbol index_line;
  std::optional<LineSymbol> supplementary;  // half-interval lines in gentle ground
  double supplementary_max_slope_deg = 3;
  LineSymbol depression_ticks;  // marks on the downhill side; strokes for the line itself
  double tick_spacing_mm = 2.5;
  double tick_length_mm = 0.6;
  LabelStyle label;  // index contour values
  double label_spacing_mm = 80;
  bool labels_upright = false;  // false: tops of figures face uphill (common practice)
  double min_loop_mm = 1.5;     // closed loops shorter than this on paper are dropped
  double smoothing_mm = 0.25;   // generalisation tolerance on paper
  PointSymbol spot_symbol;
  LabelStyle spot_label;
  double spot_min_prominence_m = 20;
  bool spot_depressions = false;
  double spot_round_m = 1;  // elevations rounded to this
  DepthStyle depths;
};

struct GridStyle {
  Stroke line;
  bool lines_across = true;  // false: ticks only
  double tick_mm = 2.0;
  LabelStyle label;
  double label_major_size_pt = 9;  // principal digits
  Stroke graticule;
  LabelStyle graticule_label;
  Stroke second_grid;  // optional second grid in its own colour
};

// Sheet furniture: frame, collar text, legend, scale bar, north diagram, notes.
struct FurnitureStyle {
  Stroke neatline;
  Stroke frame_outer;
  Colour collar_fill{1, 1, 1, 1};
  LabelStyle title;
  LabelStyle subtitle;
  LabelStyle heading;
  LabelStyle body;
  LabelStyle small;
  Colour ink;                 // default ink for scale bar and diagrams
  Colour accent;              // magnetic north, caution
  double margin_mm = 10;      // paper edge to collar
  double collar_mm = 12;      // collar width around the map frame (bottom collar may be larger)
  double side_panel_mm = 70;  // legend and notes panel right of the map (0 = below)
};

// The press: the output profile and intent for CMYK output, and the team's inks (docs/style.md,
// `press`). Every palette colour keeps how it was given: sRGB only, exact CMYK, or a tint of
// one ink; `Colour` values elsewhere in the style are its sRGB appearance (what Cairo draws).
struct Ink {
  std::string name;
  print::Cmyk cmyk;   // the ink's solid, as process CMYK (converted from sRGB when given so)
  Colour appearance;  // sRGB of the solid
  // Solid black (black ink only): overprints in the PDF/X file and is left off the other plates.
  bool overprints() const { return cmyk.c == 0 && cmyk.m == 0 && cmyk.y == 0 && cmyk.k >= 1; }
};

struct PressColour {
  Colour appearance;                // sRGB as drawn (alpha included)
  std::optional<print::Cmyk> cmyk;  // exact CMYK to write; nullopt: convert the sRGB
  int ink = -1;                     // index into PressStyle::inks, or -1
  double tint = 1;                  // share of the ink's solid, 0..1
};

struct PressStyle {
  print::ColourSetup colour;  // profile (empty: Debian's default CMYK), intent, compensation
  std::vector<Ink> inks;
  int relief_ink = -1;  // the plate that carries the relief shading; -1: the first ink
  std::map<std::string, PressColour> colours;  // palette name -> how it prints
  // The plate this style was loaded for (load_style's plate_ink), -1 for the full colour sheet.
  int plate = -1;
};

struct Style {
  std::string name;
  std::filesystem::path file;
  std::map<std::string, Colour> palette;
  std::vector<Layer> layers;  // sorted by order (stable)
  ReliefStyle relief;
  ContourStyle contours;
  GridStyle grid;
  FurnitureStyle furniture;
  PressStyle press;
};

// Loads and validates a style file; throws Error(input) with file:line:col and key path.
Style load_style(const std::filesystem::path& path);
// The same style as one ink's plate sees it: every palette colour that is a tint of `plate_ink`
// becomes a grey of its coverage (black = 100 %), colours of other inks paper white (they
// knock out), solid black of another ink transparent (it overprints), the relief only on the
// relief plate. A colour that is neither an ink tint nor paper throws Error(input) at its key.
Style load_style(const std::filesystem::path& path, const std::string& plate_ink);

// Does `rule`'s filter accept a feature whose field values are looked up by `get`?
// `get` returns nullptr when the feature lacks the field.
bool matches(const Filter& filter, const std::string* value);

}  // namespace sheetmill::style
