#include "sheetmill/sheet/collar.hpp"

#include <fmt/format.h>

#include <cmath>

#include "sheet/typeset.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/north_diagram.hpp"
#include "sheetmill/sheet/scale_bar.hpp"

namespace sheetmill::sheet {

const char* caution_text() {
  return "CAUTION: This map is not a survey. Positions and elevations are approximate and "
         "features may have changed since the data were collected. Verify boundaries, "
         "hazards and access with the local authorities and a licensed surveyor before relying "
         "on this map for boundaries, construction or safety.";
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
  std::string sheet;
  if (!info.sheet_name.empty()) sheet = info.sheet_name;
  if (!info.sheet_id.empty())
    sheet += (sheet.empty() ? "Sheet " : " \u2014 sheet ") + info.sheet_id;
  if (!sheet.empty()) draw_paragraph(cr, fonts, fur.heading, sheet, {box.min_x, y}, w);
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

  double y = box.min_y;
  for (const auto& n : notes) {
    if (y > box.max_y - 12) break;
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
  draw_title(cr, layout.title_box_mm, project, style, info, fonts);
  draw_legend(cr, layout.legend_box_mm, style, legend_rules, fonts);
  draw_scale_panel(cr, layout.scale_box_mm, layout.frame.scale_denominator, info.scale_bar_units,
                   style, fonts);
  draw_north_diagram(cr, layout.north_box_mm, info.north, style, fonts);
  draw_notes(cr, layout.notes_box_mm, project, style, info, fonts);
  draw_diagrams(cr, layout.diagrams_box_mm, layout, style, info, fonts);
  cairo_restore(cr);
}

}  // namespace sheetmill::sheet
