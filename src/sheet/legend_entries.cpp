// The legend's entries: the style's rules, then the symbols the render draws on its own. The
// contour kinds are a table, so a new kind (depth contours) is one row.
#include <fmt/format.h>

#include <cmath>

#include "sheetmill/sheet/legend.hpp"

namespace sheetmill::sheet {

namespace {

std::string figure(double v) {
  return fmt::format("{:g}", std::round(v * 1e6) / 1e6);
}

style::Rule line_rule(style::LineSymbol symbol) {
  style::Rule r;
  r.line = std::move(symbol);
  return r;
}

// The same symbol the contour stage draws for a depression line: its strokes and ticks on the
// downhill side at the style's spacing and length.
style::LineSymbol depression_symbol(const style::ContourStyle& s) {
  style::LineSymbol sym;
  sym.strokes = s.depression_ticks.strokes.empty() ? s.line.strokes : s.depression_ticks.strokes;
  style::LineMarks m;
  if (!s.depression_ticks.marks.empty()) m = s.depression_ticks.marks.front();
  if (m.stroke.width_mm <= 0 && !sym.strokes.empty()) m.stroke = sym.strokes.front();
  m.symbol.reset();
  m.spacing_mm = s.tick_spacing_mm;
  m.start_mm = s.tick_spacing_mm / 2;
  m.length_mm = s.tick_length_mm;
  m.side = style::LineMarks::Side::right;
  sym.marks = {m};
  return sym;
}

struct ContourRow {
  ContourKind kind;
  std::string (*text)(const SheetInfo& info, const style::ContourStyle& s);
  style::LineSymbol (*symbol)(const style::ContourStyle& s);
};

// In legend order. Depth contours get their row when the style has their symbol.
const ContourRow kContourRows[] = {
    {ContourKind::ordinary,
     [](const SheetInfo& i, const style::ContourStyle&) {
       return i.contour_interval_m > 0
                  ? "Contour, " + figure(i.contour_interval_m / i.height_unit_m) + " " +
                        i.height_unit_symbol + " interval"
                  : std::string("Contour");
     },
     [](const style::ContourStyle& s) { return s.line; }},
    {ContourKind::index,
     [](const SheetInfo& i, const style::ContourStyle& s) {
       return i.contour_interval_m > 0
                  ? "Index contour, every " +
                        figure(i.contour_interval_m * s.index_every / i.height_unit_m) + " " +
                        i.height_unit_symbol
                  : std::string("Index contour");
     },
     [](const style::ContourStyle& s) { return s.index_line; }},
    {ContourKind::supplementary,
     [](const SheetInfo&, const style::ContourStyle&) {
       return std::string("Half-interval contour, in gentle ground");
     },
     [](const style::ContourStyle& s) { return s.supplementary.value_or(s.line); }},
    {ContourKind::depression,
     [](const SheetInfo&, const style::ContourStyle&) {
       return std::string("Depression contour, ticks point downhill");
     },
     depression_symbol},
};

}  // namespace

std::vector<LegendEntry> legend_entries(const style::Style& style,
                                        const std::vector<const style::Rule*>& rules,
                                        const SheetInfo& info) {
  std::vector<LegendEntry> out;
  std::vector<const style::Rule*> seen;
  auto has_text = [&](const std::string& t) {
    for (const auto& e : out)
      if (e.text == t) return true;
    return false;
  };
  for (const auto* r : rules) {
    if (!r || r->legend.empty()) continue;
    bool dup = false;
    for (const auto* s : seen) dup = dup || s == r;
    if (dup) continue;
    seen.push_back(r);
    out.push_back({r->legend, *r});
  }
  auto add = [&](std::string text, style::Rule swatch) {
    if (!has_text(text)) out.push_back({std::move(text), std::move(swatch)});
  };
  const auto& cs = style.contours;
  for (const auto& row : kContourRows) {
    if (info.shown.has(row.kind)) add(row.text(info, cs), line_rule(row.symbol(cs)));
  }
  if (info.shown.spot_heights) {
    style::Rule r;
    r.point = cs.spot_symbol;
    add("Spot height, " + info.height_unit_name, r);
  }
  if (info.shown.benchmarks) {
    style::Rule r;
    r.point = cs.spot_symbol;
    add("Benchmark, surveyed height", r);
  }
  if (info.shown.grid) {
    style::LineSymbol grid;
    grid.strokes = {style.grid.line};
    double g = info.grid_interval_m;
    std::string size = g >= 1000 ? figure(g / 1000) + " km" : figure(g) + " m";
    add(g > 0 ? "Grid line, " + size + " squares" : std::string("Grid line"), line_rule(grid));
  }
  if (info.shown.graticule) {
    style::Rule r;
    style::PointSymbol cross;
    style::ShapePart part;
    part.kind = style::ShapePart::Kind::cross;
    part.size_mm = 3;
    part.outline = style.grid.graticule;
    cross.parts = {part};
    r.point = cross;
    add("Graticule crossing, latitude and longitude", r);
  }
  return out;
}

}  // namespace sheetmill::sheet
