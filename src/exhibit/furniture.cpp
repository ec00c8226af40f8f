#include "sheetmill/exhibit/furniture.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>
#include <sstream>

#include "exhibit/text_helpers.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::exhibit {

using detail::Align;
using detail::put_text;

namespace {
constexpr Colour kInk{0.1, 0.1, 0.1, 1};
constexpr Colour kAccent{0.62, 0.09, 0.09, 1};

double mm(double pt) {
  return pt * kMmPerPt;
}

std::string elevation_label(double z) {
  return std::abs(z - std::round(z)) < 1e-6 ? fmt::format("{:.0f}", z) : fmt::format("{:g}", z);
}
}  // namespace

std::vector<std::string> wrap_text(text::FontCache& fonts, const text::FontKey& key, double size_pt,
                                   const std::string& s, double width_mm) {
  std::vector<std::string> lines;
  std::istringstream words(s);
  std::string word, line;
  while (words >> word) {
    std::string candidate = line.empty() ? word : line + " " + word;
    if (!line.empty() && text::shape(fonts, key, size_pt, candidate).width_mm > width_mm) {
      lines.push_back(line);
      line = word;
    } else {
      line = candidate;
    }
  }
  if (!line.empty()) lines.push_back(line);
  return lines;
}

const std::vector<std::string>& caution_lines() {
  static const std::vector<std::string> lines = {
      "For illustration only. This exhibit is not a survey.",
      "Positions, elevations and boundaries are approximate.",
      "Verify boundaries and hazards with the responsible authority and a licensed surveyor "
      "before relying on them."};
  return lines;
}

void draw_title(cairo_t* cr, const ExhibitLayout& layout, const ExhibitProject& project,
                text::FontCache& fonts) {
  const Box& b = layout.title_box_mm;
  const double title_base = b.min_y + mm(layout.type.title_pt) * 0.95;
  put_text(cr, fonts, detail::bold(), layout.type.title_pt, project.title, {b.min_x, title_base},
           Align::left, kInk);
  if (!project.subtitle.empty()) {
    put_text(cr, fonts, detail::regular(), layout.type.subtitle_pt, project.subtitle,
             {b.min_x, title_base + mm(layout.type.subtitle_pt) * 1.3}, Align::left,
             {0.25, 0.25, 0.25, 1});
  }
}

ColourBarReport draw_colour_bar(cairo_t* cr, const Box& box, const terrain::TintRamp& ramp,
                                double exaggeration, const TypeScale& type,
                                text::FontCache& fonts) {
  ColourBarReport rep;
  double y = box.min_y + mm(type.heading_pt);
  put_text(cr, fonts, detail::bold(), type.heading_pt, "Elevation (metres)", {box.min_x, y},
           Align::left, kInk);
  const double z0 = ramp.stops.front().first, z1 = ramp.stops.back().first;
  // Half a label's width of room at each end so the end labels stay inside the box.
  const double pad =
      text::shape(fonts, detail::regular(), type.body_pt, elevation_label(z1)).width_mm / 2 + 1;
  const double x0 = box.min_x + pad, x1 = box.max_x - pad;
  rep.bar_top_mm = y + mm(type.heading_pt) * 0.6;
  rep.bar_bottom_mm = rep.bar_top_mm + mm(type.body_pt) * 2.5;
  auto x_of = [&](double z) { return z1 > z0 ? x0 + (z - z0) / (z1 - z0) * (x1 - x0) : x0; };

  // The bar: one linear gradient, so it rasterises without seams. Smooth ramps are linear in
  // sRGB between stops, as the gradient is, so its stops at the ramp's stops reproduce
  // terrain::tint_colour exactly; stepped ramps get two gradient stops per band (hard edges),
  // each band in the colour tint_colour gives its middle.
  CairoPatternPtr gradient(cairo_pattern_create_linear(x0, 0, x1, 0));
  auto add = [&](double z, const Colour& c) {
    const double t = z1 > z0 ? std::clamp((z - z0) / (z1 - z0), 0.0, 1.0) : 0.0;
    cairo_pattern_add_color_stop_rgb(gradient.get(), t, c.r, c.g, c.b);
  };
  if (!ramp.stepped) {
    for (const auto& [z, c] : ramp.stops) add(z, terrain::tint_colour(ramp, z));
  } else {
    std::vector<double> edges;
    for (const auto& s : ramp.stops) edges.push_back(s.first);
    if (ramp.step_m > 0) {
      edges.clear();
      for (double z = std::floor(z0 / ramp.step_m) * ramp.step_m; z < z1; z += ramp.step_m) {
        edges.push_back(std::max(z, z0));
      }
      edges.push_back(z1);
    }
    for (std::size_t i = 0; i + 1 < edges.size(); ++i) {
      const Colour c = terrain::tint_colour(ramp, (edges[i] + edges[i + 1]) / 2);
      add(edges[i], c);
      add(edges[i + 1], c);
    }
  }
  cairo_set_source(cr, gradient.get());
  cairo_rectangle(cr, x0, rep.bar_top_mm, x1 - x0, rep.bar_bottom_mm - rep.bar_top_mm);
  cairo_fill(cr);
  cairo_set_source_rgb(cr, kInk.r, kInk.g, kInk.b);
  cairo_set_line_width(cr, 0.35 * type.factor);
  cairo_rectangle(cr, x0, rep.bar_top_mm, x1 - x0, rep.bar_bottom_mm - rep.bar_top_mm);
  cairo_stroke(cr);

  // A tick and a label at every stop; a label that would touch its neighbour is left out.
  const double tick = mm(type.body_pt) * 0.5;
  const double label_base = rep.bar_bottom_mm + tick + mm(type.body_pt) * 1.0;
  double last_right = -1e9;
  for (const auto& [z, colour] : ramp.stops) {
    const double x = x_of(z);
    const std::string label = elevation_label(z);
    const double w = text::shape(fonts, detail::regular(), type.body_pt, label).width_mm;
    cairo_move_to(cr, x, rep.bar_bottom_mm);
    cairo_line_to(cr, x, rep.bar_bottom_mm + tick);
    cairo_stroke(cr);
    if (x - w / 2 < last_right + mm(type.body_pt) * 0.5) continue;
    put_text(cr, fonts, detail::regular(), type.body_pt, label, {x, label_base}, Align::centre,
             kInk);
    last_right = x + w / 2;
    rep.values_m.push_back(z);
    rep.x_mm.push_back(x);
  }
  if (std::abs(exaggeration - 1) > 1e-9) {
    put_text(cr, fonts, detail::regular(), type.body_pt,
             fmt::format("Vertical exaggeration {:g}x", exaggeration),
             {box.min_x, label_base + mm(type.body_pt) * 1.6}, Align::left, kInk);
  }
  return rep;
}

void draw_notes(cairo_t* cr, const Box& box, const ExhibitProject& project, const TypeScale& type,
                text::FontCache& fonts) {
  double y = box.min_y;
  const double w = box.width();
  auto line_at = [&](const text::FontKey& key, double size_pt, const std::string& s,
                     const Colour& colour) {
    for (const std::string& l : wrap_text(fonts, key, size_pt, s, w)) {
      y += mm(size_pt) * 1.25;
      put_text(cr, fonts, key, size_pt, l, {box.min_x, y}, Align::left, colour);
    }
  };
  // Legend of the project areas: a swatch of each outline and its label.
  bool any_label = false;
  for (const AreaOverlay& a : project.areas) {
    if (a.label.empty()) continue;
    any_label = true;
    y += mm(type.body_pt) * 1.4;
    const double sw = mm(type.body_pt) * 3;
    cairo_save(cr);
    cairo_set_source_rgb(cr, a.colour.r, a.colour.g, a.colour.b);
    cairo_set_line_width(cr, a.width_mm);
    if (!a.dash_mm.empty())
      cairo_set_dash(cr, a.dash_mm.data(), static_cast<int>(a.dash_mm.size()), 0);
    cairo_move_to(cr, box.min_x, y - mm(type.body_pt) * 0.35);
    cairo_line_to(cr, box.min_x + sw, y - mm(type.body_pt) * 0.35);
    cairo_stroke(cr);
    cairo_restore(cr);
    put_text(cr, fonts, detail::regular(), type.body_pt, a.label,
             {box.min_x + sw + mm(type.body_pt) * 0.6, y}, Align::left, kInk);
  }
  if (any_label) y += mm(type.body_pt) * 0.6;
  if (!project.credits.empty() || !project.producer.empty()) {
    line_at(detail::bold(), type.fine_pt, "Sources and credits", kInk);
    for (const std::string& c : project.credits) line_at(detail::regular(), type.fine_pt, c, kInk);
    std::string by = project.producer;
    if (!project.date.empty()) by += (by.empty() ? "" : ", ") + project.date;
    if (!by.empty()) line_at(detail::regular(), type.fine_pt, "Prepared by " + by, kInk);
  }
  for (const std::string& n : project.notes) line_at(detail::regular(), type.fine_pt, n, kInk);
  y += mm(type.body_pt) * 0.4;
  line_at(detail::bold(), type.body_pt, "Caution", kAccent);
  for (const std::string& c : caution_lines()) line_at(detail::regular(), type.body_pt, c, kAccent);
  if (y > box.max_y + 0.5) {
    log::warn("exhibit notes run {:.0f} mm past their panel; shorten the credits or notes",
              y - box.max_y);
  }
}

}  // namespace sheetmill::exhibit
