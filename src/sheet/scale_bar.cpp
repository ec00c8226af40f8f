#include "sheetmill/sheet/scale_bar.hpp"

#include <cmath>

#include "sheet/typeset.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/nice_numbers.hpp"

namespace sheetmill::sheet {

namespace {

constexpr double kBarHeightMm = 1.6;
// Longest bar: 160 mm is 4 km at 1:25 000 (several kilometres, common practice on field sheets).
constexpr double kMaxBarMm = 160;

void set_ink(cairo_t* cr, const Colour& c) {
  cairo_set_source_rgba(cr, c.r, c.g, c.b, c.a);
}

std::string number_text(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", std::round(v * 1000) / 1000);
  return buf;
}

}  // namespace

ScaleUnit scale_unit(const std::string& name) {
  if (name == "m" || name == "km") return {"m", 1.0, "Kilometres"};
  if (name == "ft") return {"ft", kMetresPerFoot, "Feet"};
  if (name == "mi") return {"mi", 1609.344, "Miles"};  // international mile = 5280 ft
  throw_input_error(SourceLocation{"", 0, 0, "scale_bars"},
                    "unknown scale-bar unit '" + name + "' (expected m, ft or mi)");
}

ScaleBarPlan plan_scale_bar(double N, double max_length_mm, const ScaleUnit& unit) {
  if (!(N > 0) || !(max_length_mm > 0)) throw_internal_error("plan_scale_bar: bad arguments");
  ScaleBarPlan p;
  p.unit = unit;
  double mm_per_unit = unit.metres * 1000.0 / N;
  double avail_units = max_length_mm / mm_per_unit;
  // Heckbert 1990: about five segments in all (four right of zero, one extension), each a nice
  // number; the largest nice segment that still fits at least two right of zero.
  double seg = nice_number(avail_units / 5, true);
  while ((std::floor(avail_units / seg + 1e-9) - 1) < 2) seg = nice_number(seg / 2.1, true);
  p.segment_units = seg;
  p.segments = std::min(5, static_cast<int>(std::floor(avail_units / seg + 1e-9)) - 1);
  p.segment_mm = seg * mm_per_unit;
  // The extension is split into tenths of 1 and 10 x 10^n, fifths of 5 and quarters of 2
  // (common practice: every division a round value).
  double f = seg / std::pow(10.0, std::floor(std::log10(seg) + 1e-9));
  p.subdivisions = std::abs(f - 2) < 1e-6 ? 4 : std::abs(f - 5) < 1e-6 ? 5 : 10;
  if (unit.name == "m") {
    bool km = seg >= 1000 - 1e-9 || (seg * p.segments) >= 2000;
    p.display_factor = km ? 1000 : 1;
    p.display_unit = km ? "km" : "m";
    p.unit.label = km ? "Kilometres" : "Metres";
  } else {
    p.display_unit = unit.name;
  }
  return p;
}

std::string representative_fraction(double N) {
  std::string digits = std::to_string(std::llround(N));
  std::string out;
  int n = static_cast<int>(digits.size());
  for (int i = 0; i < n; ++i) {
    out += digits[i];
    int left = n - 1 - i;
    if (left > 0 && left % 3 == 0 && n > 4) out += ' ';
  }
  return "1:" + out;
}

Box draw_scale_bar(cairo_t* cr, const ScaleBarPlan& p, Point zero, const style::Style& style,
                   text::FontCache& fonts) {
  const auto& ink = style.furniture.ink;
  const auto& ls = style.furniture.small;
  double h = kBarHeightMm;
  double ext = p.segment_mm, sub = ext / p.subdivisions;
  cairo_save(cr);
  cairo_set_line_width(cr, 0.15);
  set_ink(cr, ink);
  // Alternating filled segments right of zero; the extension alternates by subdivision.
  for (int i = 0; i < p.segments; ++i) {
    cairo_rectangle(cr, zero.x + i * p.segment_mm, zero.y, p.segment_mm, h);
    if (i % 2 == 0) cairo_fill_preserve(cr);
    cairo_stroke(cr);
  }
  // The subdivision next to zero is open where the first main segment is filled, so zero shows
  // as the edge between ink and paper (common practice).
  for (int i = 0; i < p.subdivisions; ++i) {
    double x = zero.x - ext + i * sub;
    cairo_rectangle(cr, x, zero.y, sub, h);
    if ((p.subdivisions - i) % 2 == 0) cairo_fill_preserve(cr);
    cairo_stroke(cr);
  }
  cairo_restore(cr);
  Box used = Box::of(zero.x - ext, zero.y, zero.x + p.segments * p.segment_mm, zero.y + h);
  double ty = zero.y - 0.6;
  auto value = [&](double units) { return number_text(units / p.display_factor); };
  used.add(draw_label(cr, fonts, ls, value(p.segment_units), {zero.x - ext, ty}, HAlign::centre,
                      VAlign::bottom)
               .centre());
  for (int i = 0; i <= p.segments; ++i) {
    Box b = draw_label(cr, fonts, ls, value(i * p.segment_units), {zero.x + i * p.segment_mm, ty},
                       HAlign::centre, VAlign::bottom);
    used.add({b.min_x, b.min_y});
  }
  Box b = draw_label(cr, fonts, ls, p.unit.label, {used.max_x + 2.5, zero.y + h}, HAlign::left,
                     VAlign::bottom);
  used.add({b.max_x, b.max_y});
  return used;
}

std::string imperial_unit(double N, double max_length_mm) {
  double miles = max_length_mm / 1000.0 * N / 1609.344;
  return miles >= 2 ? "mi" : "ft";
}

std::vector<std::string> scale_bar_units(const std::vector<std::string>& stated,
                                         double height_unit_m, double N, double max_length_mm) {
  if (!stated.empty()) return stated;
  std::vector<std::string> units{"m"};
  if (std::abs(height_unit_m - 1) > 1e-9) units.push_back(imperial_unit(N, max_length_mm));
  return units;
}

double scale_bar_room_mm(double width_mm) {
  return std::min(kMaxBarMm, width_mm - 40);
}

void draw_scale_panel(cairo_t* cr, const Box& box, double N, const std::vector<std::string>& units,
                      const style::Style& style, text::FontCache& fonts) {
  const auto& fur = style.furniture;
  Box rf = draw_label(cr, fonts, fur.heading, "Scale " + representative_fraction(N),
                      {box.centre().x, box.min_y + 1}, HAlign::centre, VAlign::top);
  double y = rf.max_y + 5.5;
  // One zero for every bar (common practice), the longest bar centred under the fraction.
  double room = scale_bar_room_mm(box.width());
  if (room <= 0) return;
  std::vector<ScaleBarPlan> plans;
  double ext = 0, right = 0;
  for (const auto& u : units) {
    plans.push_back(plan_scale_bar(N, room, scale_unit(u)));
    ext = std::max(ext, plans.back().segment_mm);
    right = std::max(right, plans.back().segment_mm * plans.back().segments);
  }
  double zero_x = box.centre().x - (right - ext) / 2;
  for (const auto& p : plans) {
    if (y + kBarHeightMm > box.max_y) break;
    draw_scale_bar(cr, p, {zero_x, y}, style, fonts);
    y += kBarHeightMm + 6.5;
  }
}

}  // namespace sheetmill::sheet
