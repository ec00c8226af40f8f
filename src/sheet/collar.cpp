#include "sheetmill/sheet/collar.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cctype>
#include <cmath>

#include "sheet/typeset.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/draw/line.hpp"
#include "sheetmill/sheet/legend.hpp"
#include "sheetmill/sheet/north_diagram.hpp"
#include "sheetmill/sheet/scale_bar.hpp"

namespace sheetmill::sheet {

namespace {

constexpr double kPackGapMm = 5;       // between the panel's pieces
constexpr double kNorthHeightMm = 40;  // the north diagram's box
constexpr double kDiagramsHeightMm = 42;

// The lowest y the drawing inks when drawn with its top at y = 0 (page mm), measured on a
// recording surface so the panel can be packed by what each piece really needs.
template <class Draw>
double ink_bottom_mm(Draw draw) {
  CairoSurfacePtr rec(cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, nullptr));
  CairoPtr cr(cairo_create(rec.get()));
  draw(cr.get());
  double x = 0, y = 0, w = 0, h = 0;
  cairo_recording_surface_ink_extents(rec.get(), &x, &y, &w, &h);
  return w > 0 && h > 0 ? y + h : 0;
}

std::string lower(std::string s) {
  for (auto& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

}  // namespace

const char* caution_text() {
  return "CAUTION: This map is not a survey. Positions and elevations are approximate and "
         "features may have changed since the data were collected. Verify boundaries, "
         "hazards and access with the local authorities and a licensed surveyor before relying "
         "on this map for boundaries, construction or safety.";
}

std::string sheet_heading(const std::string& name, const std::string& id) {
  if (id.empty()) return name;
  // A name that already carries the id ("Sheet A01", "A01 Harrowmere") says it once.
  if (name.empty() || lower(name).find(lower(id)) != std::string::npos) {
    return name.empty() ? "Sheet " + id : name;
  }
  return name + " \u2014 sheet " + id;
}

void draw_title(cairo_t* cr, const Box& box, const project::Project& project,
                const style::Style& style, const SheetInfo& info, text::FontCache& fonts) {
  const auto& fur = style.furniture;
  double w = box.width();
  double y = box.min_y;
  std::string title = project.title.empty() ? "Untitled sheet" : project.title;
  if (fur.title.upper_case) {
    for (auto& c : title) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  }
  y = draw_paragraph(cr, fonts, fur.title, title, {box.min_x, y}, w, 0, 1.1) + 1;
  if (!project.subtitle.empty()) {
    y = draw_paragraph(cr, fonts, fur.subtitle, project.subtitle, {box.min_x, y}, w) + 0.5;
  }
  std::string sheet = sheet_heading(info.sheet_name, info.sheet_id);
  if (!sheet.empty()) draw_paragraph(cr, fonts, fur.heading, sheet, {box.min_x, y}, w);
}

std::vector<const style::Rule*> draw_legend(cairo_t* cr, const Box& box, const style::Style& style,
                                            const std::vector<const style::Rule*>& rules,
                                            text::FontCache& fonts) {
  SheetInfo none;
  auto entries = legend_entries(style, rules, none);
  LegendPlan plan = plan_legend(fonts, style, entries, box.width(), box.height());
  draw_legend_plan(cr, plan, entries, {box.min_x, box.min_y}, style, fonts);
  std::vector<const style::Rule*> listed;
  for (const auto* r : rules) {
    bool dup = false;
    for (const auto* l : listed) dup = dup || l == r;
    if (r && !r->legend.empty() && !dup) listed.push_back(r);
  }
  return listed;
}

void draw_notes(cairo_t* cr, const Box& box, const project::Project& project,
                const style::Style& style, const SheetInfo& info, text::FontCache& fonts) {
  const auto& fur = style.furniture;
  std::vector<std::string> notes;
  if (info.contour_interval_m > 0 && info.sea_level_m) {
    // Heights and depths: both references named, the depths' one as a height on the first.
    const double u = info.height_unit_m;
    const std::string on_datum = info.vertical_datum.empty() ? "" : " on " + info.vertical_datum;
    notes.push_back(fmt::format(
        "Contour interval {:g} {}. Heights and depths in {}: heights above {}, depths below the "
        "sea level ({:g} {}{}).",
        std::round(info.contour_interval_m / u * 1e6) / 1e6, info.height_unit_symbol,
        info.height_unit_name,
        info.vertical_datum.empty() ? std::string("the height datum") : info.vertical_datum,
        std::round(*info.sea_level_m / u * 1e6) / 1e6, info.height_unit_symbol, on_datum));
  } else if (info.contour_interval_m > 0) {
    notes.push_back(
        fmt::format("Contour interval {:g} {}. Heights in {}{}.",
                    std::round(info.contour_interval_m / info.height_unit_m * 1e6) / 1e6,
                    info.height_unit_symbol, info.height_unit_name,
                    info.vertical_datum.empty() ? "" : " above " + info.vertical_datum));
  }
  notes.insert(notes.end(), info.accuracy_notes.begin(), info.accuracy_notes.end());
  std::string code = info.epsg ? fmt::format(" (EPSG:{})", info.epsg) : "";
  notes.push_back(fmt::format("Horizontal reference: {}{}; datum {}; {} projection.", info.crs_name,
                              code, info.datum_name, info.projection_name));
  if (info.grid_interval_m > 0) {
    notes.push_back(fmt::format("Grid: {:g} m squares of {}; full values at the corners.",
                                info.grid_interval_m, info.crs_name));
  }
  notes.push_back(fmt::format("Graticule: latitude and longitude on {}.", info.datum_name));
  for (const auto& c : project.data_credits) notes.push_back(c);
  for (const auto& n : project.notes) notes.push_back(n);
  std::string producer;
  if (!project.producer.empty()) producer = "Produced by " + project.producer;
  if (!project.revision_date.empty()) {
    producer += (producer.empty() ? "Revised " : ", revised ") + project.revision_date;
  }
  if (!producer.empty()) notes.push_back(producer + ".");

  // Every note is printed: the panel is packed by what the notes need.
  double y = box.min_y;
  for (const auto& n : notes) {
    y = draw_paragraph(cr, fonts, fur.small, n, {box.min_x, y}, box.width()) + 0.8;
  }
  style::LabelStyle caution = fur.body;
  caution.colour = fur.accent;
  draw_paragraph(cr, fonts, caution, caution_text(), {box.min_x, y + 0.5}, box.width());
}

void draw_collar(cairo_t* cr, const Layout& layout, const project::Project& project,
                 const style::Style& style, const SheetInfo& info,
                 const std::vector<const style::Rule*>& legend_rules, text::FontCache& fonts) {
  cairo_save(cr);
  const auto& fur = style.furniture;
  // The outer frame round collar, scale band and panel, as four sides. (Everything here is
  // plain fills, strokes and text; draw_area keeps clipped-away pattern symbols out, which
  // Cairo 1.16's PDF writer would otherwise turn into a fallback image of the whole collar.)
  draw::apply_stroke(cr, fur.frame_outer);
  const Box& f = layout.sheet_frame_mm;
  const Point corners[] = {{f.min_x, f.min_y},
                           {f.max_x, f.min_y},
                           {f.max_x, f.max_y},
                           {f.min_x, f.max_y},
                           {f.min_x, f.min_y}};
  for (int i = 0; i < 4; ++i) {
    cairo_move_to(cr, corners[i].x, corners[i].y);
    cairo_line_to(cr, corners[i + 1].x, corners[i + 1].y);
    cairo_stroke(cr);
  }
  double N = layout.frame.scale_denominator;
  const Box& sb = layout.scale_box_mm;
  auto units =
      scale_bar_units(info.scale_bar_units, info.height_unit_m, N, scale_bar_room_mm(sb.width()));
  draw_scale_panel(cr, sb, N, units, style, fonts);

  auto entries = legend_entries(style, legend_rules, info);
  if (layout.panel_at_side) {
    // Packed top to bottom by measured heights: title, legend, north, notes, diagrams. The
    // legend takes what the others leave and wraps, adds columns or shrinks to fit it.
    const Box& p = layout.panel_box_mm;
    auto at = [&](double top, double h) { return Box::of(p.min_x, top, p.max_x, top + h); };
    double h_title =
        ink_bottom_mm([&](cairo_t* m) { draw_title(m, at(0, 40), project, style, info, fonts); });
    double h_north = ink_bottom_mm([&](cairo_t* m) {
      draw_north_diagram(m, at(0, kNorthHeightMm), info.north, style, fonts);
    });
    double h_notes =
        ink_bottom_mm([&](cairo_t* m) { draw_notes(m, at(0, 1000), project, style, info, fonts); });
    double others = h_title + h_north + h_notes + 3 * kPackGapMm;
    bool diagrams = true;
    LegendPlan plan =
        plan_legend(fonts, style, entries, p.width(),
                    std::max(20.0, p.height() - others - kDiagramsHeightMm - kPackGapMm));
    if (plan.height_mm + others + kDiagramsHeightMm + kPackGapMm > p.height() + 1e-6) {
      // Every word of the legend, the notes and the caution before the diagrams: on paper too
      // small for all, the diagrams give way.
      diagrams = false;
      plan = plan_legend(fonts, style, entries, p.width(), std::max(20.0, p.height() - others));
      log::warn(
          "no room for the adjoining-sheets and location diagrams on {:.0f} x {:.0f} mm paper",
          layout.page_w_mm, layout.page_h_mm);
    }
    double y = p.min_y;
    draw_title(cr, at(y, h_title), project, style, info, fonts);
    y += h_title + kPackGapMm;
    if (!entries.empty()) {
      draw_legend_plan(cr, plan, entries, {p.min_x, y}, style, fonts);
      y += plan.height_mm + kPackGapMm;
    }
    draw_north_diagram(cr, at(y, kNorthHeightMm), info.north, style, fonts);
    y += h_north + kPackGapMm;
    draw_notes(cr, at(y, h_notes), project, style, info, fonts);
    y += h_notes + kPackGapMm;
    // The diagrams take what is left, up to half as much again as their usual height.
    double h_diagrams = std::clamp(p.max_y - y, kDiagramsHeightMm, 1.5 * kDiagramsHeightMm);
    if (diagrams) draw_diagrams(cr, at(y, h_diagrams), layout, style, info, fonts);
  } else {
    draw_title(cr, layout.title_box_mm, project, style, info, fonts);
    const Box& lb = layout.legend_box_mm;
    LegendPlan plan = plan_legend(fonts, style, entries, lb.width(), lb.height());
    draw_legend_plan(cr, plan, entries, {lb.min_x, lb.min_y}, style, fonts);
    draw_north_diagram(cr, layout.north_box_mm, info.north, style, fonts);
    draw_notes(cr, layout.notes_box_mm, project, style, info, fonts);
    draw_diagrams(cr, layout.diagrams_box_mm, layout, style, info, fonts);
  }
  cairo_restore(cr);
}

}  // namespace sheetmill::sheet
