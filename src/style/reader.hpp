#pragma once
// Private to the style stage: the state shared while one style file is read. It holds the
// resolved palette and the named symbols (parsed on first use, so a symbol may refer to one
// defined further down; a reference cycle is an error). Every function either returns a fully
// resolved value or throws Error(input) located at the offending node.

#include <map>
#include <memory>
#include <set>
#include <string>
#include <variant>

#include "sheetmill/config/node.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::style::detail {

using config::ConfigNode;

// A plain decimal number (no unit); nullopt otherwise.
std::optional<double> parse_number(const std::string& text);

// 0..1, or a percentage "35%"; `what` names the quantity in the message ("an opacity").
double read_share(const ConfigNode& n, const char* what);
inline double read_opacity(const ConfigNode& n) {
  return read_share(n, "an opacity");
}

// "#rrggbb" or "#rrggbbaa" (case-insensitive); nullopt when the text is not of that form.
std::optional<Colour> parse_hex_colour(const std::string& text);

class Reader {
 public:
  // Reads the `press` section and the `colours` map (either may be absent) and remembers the
  // `symbols` map (may be absent). A non-empty `plate_ink` reads every colour as that ink's
  // plate sees it (load_style).
  Reader(const std::optional<ConfigNode>& colours, const std::optional<ConfigNode>& symbols,
         const std::optional<ConfigNode>& press = std::nullopt,
         const std::optional<ConfigNode>& plate_ink = std::nullopt);
  ~Reader();

  // A palette name, a hex colour, or a mapping (opacity, CMYK, ink tint); as the plate sees it
  // when reading for one.
  Colour colour(const ConfigNode& n) const;
  // The press section and every palette colour's print definition.
  const PressStyle& press() const { return press_; }

  // A stroke's keys read into `base` (which supplies the defaults).
  Stroke stroke(const ConfigNode& n, Stroke base = {}) const;
  // The stroke keys, for maps that mix them with their own keys (hatching, ticks).
  static const std::vector<std::string>& stroke_keys();
  Stroke stroke_fields(const ConfigNode& n, Stroke base) const;

  // A symbol given inline (a mapping) or by the name of an entry in `symbols`.
  LineSymbol line(const ConfigNode& n);
  AreaSymbol area(const ConfigNode& n);
  PointSymbol point(const ConfigNode& n);

  // `extra_keys`: keys the caller reads from the same mapping (contour label spacing, ...).
  LabelStyle label(const ConfigNode& n, LabelStyle base = {},
                   const std::vector<std::string>& extra_keys = {}) const;
  FontSpec font(const ConfigNode& n, FontSpec base) const;

  // Reads the `label_styles` map: named label styles a label can start from (`based_on`).
  // In document order, so one may be based on another defined above it.
  void read_label_styles(const ConfigNode& n);

  // Parses every named symbol, so an unused one with a mistake is still reported.
  void check_all_symbols();

  const std::map<std::string, Colour>& palette() const { return palette_; }

 private:
  using Named = std::variant<LineSymbol, AreaSymbol, PointSymbol>;
  const Named& named(const ConfigNode& ref, const char* wanted_kind);
  const Named& named_entry(const std::string& name, const ConfigNode& def);

  LineSymbol line_inline(const ConfigNode& n);
  AreaSymbol area_inline(const ConfigNode& n);
  PointSymbol point_inline(const ConfigNode& n);
  ShapePart shape(const ConfigNode& n) const;
  LineMarks marks(const ConfigNode& n);

  // Print colours (press.cpp).
  void read_press(const ConfigNode& n);
  Ink read_ink(const std::string& name, const ConfigNode& n) const;
  PressColour press_colour(const ConfigNode& n) const;
  PressColour print_colour(const ConfigNode& n) const;  // { cmyk: [...] } or { ink: NAME }
  Colour plate_view(const PressColour& c, const ConfigNode& at) const;
  const print::ColourEngine& engine() const;

  std::map<std::string, Colour> palette_;
  PressStyle press_;
  mutable std::unique_ptr<print::ColourEngine> engine_;  // built on first use (CMYK colours)
  std::map<std::string, LabelStyle> label_styles_;
  std::optional<ConfigNode> symbols_;
  std::map<std::string, Named> parsed_;
  std::set<std::string> in_progress_;
};

// Throws at the second occurrence of a key repeated within one mapping, anywhere in the tree.
void reject_duplicate_keys(const ConfigNode& root);

Filter read_filter(const ConfigNode& n);
// Each section is read over `base`, the defaults (sections.cpp: default_*), so a file may be short.
ReliefStyle read_relief(const ConfigNode& n, Reader& r, ReliefStyle base);
ContourStyle read_contours(const ConfigNode& n, Reader& r, ContourStyle base);
GridStyle read_grid(const ConfigNode& n, Reader& r, GridStyle base);
FurnitureStyle read_furniture(const ConfigNode& n, Reader& r, FurnitureStyle base);

// A built-in tint ramp (ramps.cpp) spread over [low_m, high_m]; nullopt for an unknown name.
std::optional<std::vector<TintStop>> builtin_ramp(const std::string& name, double low_m,
                                                  double high_m);
std::vector<std::string> builtin_ramp_names();

// The defaults for a file that leaves a section out, drawn from the palette's `ink`, `paper`
// and `accent` entries when the file defines them.
ReliefStyle default_relief();
ContourStyle default_contours(const Reader& r);
GridStyle default_grid(const Reader& r);
FurnitureStyle default_furniture(const Reader& r);

}  // namespace sheetmill::style::detail
