#pragma once
// The collar and the furniture panel: title, legend, scale bars, north diagram, notes with the
// caution, adjoining-sheets and location diagrams. Page millimetres; type in points.
//
// draw_collar draws into the boxes of the Layout and nowhere else (a side panel's pieces are
// packed by their measured heights inside panel_box_mm), and the outer frame. `legend_rules` are
// the rules actually drawn on this sheet, in legend order (the render collects them); a rule with
// an empty legend text is skipped. Pointers must stay valid for the call; none is owned.

#include <cairo.h>

#include <string>
#include <vector>

#include "sheetmill/project/project.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::sheet {

void draw_collar(cairo_t* cr, const Layout& layout, const project::Project& project,
                 const style::Style& style, const SheetInfo& info,
                 const std::vector<const style::Rule*>& legend_rules, text::FontCache& fonts);

// The pieces, for tests and for callers that place them elsewhere.
void draw_title(cairo_t* cr, const Box& box, const project::Project& project,
                const style::Style& style, const SheetInfo& info, text::FontCache& fonts);
// Returns the rules it listed, in order (those with legend text).
std::vector<const style::Rule*> draw_legend(cairo_t* cr, const Box& box, const style::Style& style,
                                            const std::vector<const style::Rule*>& rules,
                                            text::FontCache& fonts);
void draw_notes(cairo_t* cr, const Box& box, const project::Project& project,
                const style::Style& style, const SheetInfo& info, text::FontCache& fonts);
void draw_diagrams(cairo_t* cr, const Box& box, const Layout& layout, const style::Style& style,
                   const SheetInfo& info, text::FontCache& fonts);

// The sheet's heading under the title: "NAME — sheet ID", or the name alone when it already
// carries the id ("Sheet A01"), or "Sheet ID" without a name.
std::string sheet_heading(const std::string& name, const std::string& id);

// The caution printed on every sheet.
const char* caution_text();

}  // namespace sheetmill::sheet
