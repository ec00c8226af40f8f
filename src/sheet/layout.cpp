#include "sheetmill/sheet/layout.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/paper_sizes.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"

namespace sheetmill::sheet {

namespace {

constexpr double kPanelGapMm = 5;          // between the collar box and the furniture panel
constexpr double kBelowPanelMm = 70;       // height of the panel when it sits under the map
constexpr double kFrameGapMm = 4;          // outer frame to what it encloses
constexpr double kScaleBandMm = 26;        // under the collar box: the fraction and two bars
constexpr double kMinPanelHeightMm = 150;  // a side panel shorter than this cannot hold it all

std::string fmt_mm(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", v);
  return buf;
}

// The room inside the outer frame, split into where the collar box (with the scale band under
// it) may go and where the panel goes.
struct Region {
  Box inner;     // inside the outer frame
  Box map_area;  // where the frame may go (inside margins, collar and scale band)
  bool side = true;
};

Region regions(double w, double h, double margin, double collar, double side_panel) {
  // (side_panel: the panel's width, after side_panel_width_mm)
  Region r;
  r.inner = Box::of(margin + kFrameGapMm, margin + kFrameGapMm, w - margin - kFrameGapMm,
                    h - margin - kFrameGapMm);
  const Box& in = r.inner;
  r.side = side_panel > 0;
  if (r.side) {
    r.map_area =
        Box::of(in.min_x + collar, in.min_y + collar, in.max_x - side_panel - kPanelGapMm - collar,
                in.max_y - kScaleBandMm - collar);
  } else {
    r.map_area = Box::of(in.min_x + collar, in.min_y + collar, in.max_x - collar,
                         in.max_y - kBelowPanelMm - kPanelGapMm - kScaleBandMm - collar);
  }
  if (r.map_area.empty() || r.map_area.width() < 20 || r.map_area.height() < 20 ||
      (r.side && in.height() < kMinPanelHeightMm)) {
    throw_input_error(SourceLocation{"", 0, 0, "paper"},
                      "the paper (" + fmt_mm(w) + " x " + fmt_mm(h) +
                          " mm) leaves no room for a map inside the margins, collar and panel");
  }
  return r;
}

// The panel and scale band around a placed collar box, with the whole composition (collar box,
// band, panel) centred in the room so that a frame smaller than the paper allows does not float
// beside a panel at the paper's edge.
void place_furniture(Layout& L, const Region& r, double side_panel) {
  const Box& c = L.collar_box_mm;
  if (r.side) {
    double bottom = std::max(c.max_y + kScaleBandMm, c.min_y + kMinPanelHeightMm);
    L.panel_box_mm = Box::of(c.max_x + kPanelGapMm, c.min_y, c.max_x + kPanelGapMm + side_panel,
                             std::min(r.inner.max_y, bottom));
  } else {
    double top = c.max_y + kScaleBandMm + kPanelGapMm;
    L.panel_box_mm = Box::of(r.inner.min_x, top, r.inner.max_x, top + kBelowPanelMm);
  }
  L.panel_at_side = r.side;
  L.scale_box_mm = Box::of(c.min_x, c.max_y + 2, c.max_x, c.max_y + kScaleBandMm);
  const Box& p = L.panel_box_mm;
  if (r.side) {
    // An initial share of the panel; draw_collar packs the pieces by their measured heights.
    double y = p.min_y;
    auto take = [&](double hgt) {
      Box b = Box::of(p.min_x, y, p.max_x, std::min(p.max_y, y + hgt));
      y = b.max_y;
      return b;
    };
    double fixed = 26 + 50 + 80 + 42;
    double shrink = std::min(1.0, (p.height() - 20) / fixed);
    L.title_box_mm = take(26 * shrink);
    L.legend_box_mm = take(std::max(20.0, p.height() - fixed * shrink));
    L.north_box_mm = take(50 * shrink);
    L.notes_box_mm = take(80 * shrink);
    L.diagrams_box_mm = Box::of(p.min_x, y, p.max_x, p.max_y);
  } else {
    double x = p.min_x;
    auto take = [&](double frac) {
      Box b = Box::of(x, p.min_y, x + p.width() * frac, p.max_y);
      x += p.width() * frac;
      return b;
    };
    L.title_box_mm = take(0.22);
    L.legend_box_mm = take(0.26);
    L.north_box_mm = take(0.18);
    L.notes_box_mm = take(0.22);
    L.diagrams_box_mm = Box::of(x, p.min_y, p.max_x, p.max_y);
  }
  Box all = c;
  for (const Box* b : {&L.panel_box_mm, &L.scale_box_mm}) {
    all.add({b->min_x, b->min_y});
    all.add({b->max_x, b->max_y});
  }
  L.sheet_frame_mm = all.expanded(kFrameGapMm);
}

// The height a one-column side panel needs, estimated from the style before the sheet's rules
// are known: every rule with legend text plus the furniture's own entries at three quarters of
// the body size (the legend's smallest), and the title, north diagram, notes and diagrams at
// their usual heights (measured on the demo sheet).
double panel_height_estimate_mm(const style::Style& style) {
  std::size_t entries = 8;  // contour kinds, spot heights, benchmarks, grid, graticule
  for (const auto& layer : style.layers)
    for (const auto& rule : layer.rules) entries += rule.legend.empty() ? 0 : 1;
  double row_mm = std::max(4.5, style.furniture.body.size_pt * 0.75 * kMmPerPt * 1.2) + 1.6;
  return 20 + static_cast<double>(entries) * row_mm + 35 + 60 + 42 + 4 * 5;
}

// A side panel twice as wide when one column cannot hold the furniture and the map keeps most of
// the width: the legend then runs in columns and the notes in longer lines.
double side_panel_width_mm(const style::Style& style, double inner_w, double inner_h) {
  double one = style.furniture.side_panel_mm;
  if (one <= 0 || panel_height_estimate_mm(style) <= inner_h) return one;
  double two = 2 * one + kPanelGapMm;
  return inner_w - two >= 0.45 * inner_w ? two : one;
}

}  // namespace

Layout compute_layout(const project::Project& project, const style::Style& style,
                      const std::optional<std::string>& sheet_id) {
  std::optional<TileIndexContents> index;
  bool wants_index = (sheet_id || project.extent.sheet_id) && project.tile_index;
  if (wants_index) index = read_tile_index(*project.tile_index, project.crs);
  return compute_layout(project, style, sheet_id, index ? &*index : nullptr);
}

Layout compute_layout(const project::Project& project, const style::Style& style,
                      const std::optional<std::string>& sheet_id, const TileIndexContents* index) {
  if (!(project.scale > 0)) {
    throw_input_error(SourceLocation{project.file.string(), 0, 0, "scale"},
                      "the scale denominator must be positive");
  }
  const double N = project.scale;
  const double mm_per_m = 1000.0 / N;
  Layout L;
  L.crs_definition = project.crs;
  const auto& fur = style.furniture;
  double margin = project.margin_mm.value_or(fur.margin_mm);

  SheetCrs crs = SheetCrs::resolve(project.crs, "crs");
  MapFrame& f = L.frame;
  f.crs_wkt = crs.wkt2();
  f.crs_name = crs.name();
  f.epsg = crs.epsg();
  f.scale_denominator = N;

  std::optional<std::string> id = sheet_id ? sheet_id : project.extent.sheet_id;
  if (id) {
    if (!index || !project.tile_index) {
      throw_input_error(SourceLocation{project.file.string(), 0, 0, "extent.sheet"},
                        "a sheet id needs a tile_index");
    }
    const IndexSheet& s = find_sheet(*index, *id, project.tile_index->path);
    L.index_sheet = s;
    L.neatline_is_graticule = index->geographic;
    f.ground = s.bounds;
    f.neatline = s.outline;
  } else if (project.extent.box) {
    f.ground = *project.extent.box;
  }
  project::Paper paper = project.paper;
  if (paper.name == project::kFitPaper) {
    if (!id && !project.extent.box) {
      throw_input_error(SourceLocation{project.file.string(), 0, 0, "paper.size"},
                        "paper that fits needs a frame of known size (extent.box or extent.sheet)");
    }
    paper = fitting_paper(project, style, f.ground);
  }
  L.page_w_mm = paper.width_mm;
  L.page_h_mm = paper.height_mm;
  double inner_w = L.page_w_mm - 2 * (margin + kFrameGapMm);
  double inner_h = L.page_h_mm - 2 * (margin + kFrameGapMm);
  double panel_w = side_panel_width_mm(style, inner_w, inner_h);
  Region r = regions(L.page_w_mm, L.page_h_mm, margin, fur.collar_mm, panel_w);

  if (!id && !project.extent.box) {
    if (!project.extent.centre) {
      throw_input_error(SourceLocation{project.file.string(), 0, 0, "extent"},
                        "expected one of extent.centre, extent.box or extent.sheet");
    }
    // The frame fills the map area, in whole millimetres on paper.
    double w_mm = std::floor(r.map_area.width());
    double h_mm = std::floor(r.map_area.height());
    Point c = *project.extent.centre;
    double hw = w_mm / 2 / mm_per_m, hh = h_mm / 2 / mm_per_m;
    f.ground = Box::of(c.x - hw, c.y - hh, c.x + hw, c.y + hh);
  }
  if (f.neatline.empty()) {
    const Box& g = f.ground;
    f.neatline = {{g.min_x, g.max_y}, {g.max_x, g.max_y}, {g.max_x, g.min_y}, {g.min_x, g.min_y}};
  }

  double w_mm = f.ground.width() * mm_per_m, h_mm = f.ground.height() * mm_per_m;
  if (w_mm > r.map_area.width() + 1e-6 || h_mm > r.map_area.height() + 1e-6) {
    throw_input_error(SourceLocation{project.file.string(), 0, 0, "extent"},
                      "at 1:" + fmt_mm(N) + " the map frame needs " + fmt_mm(w_mm) + " x " +
                          fmt_mm(h_mm) + " mm but the paper leaves " + fmt_mm(r.map_area.width()) +
                          " x " + fmt_mm(r.map_area.height()) +
                          " mm inside margins, collar and panel (choose larger paper, a "
                          "smaller scale or a smaller extent)");
  }
  // The composition (collar box, scale band, panel) centred in the room inside the outer frame;
  // page coordinates rounded to 0.01 mm keep the PDF tidy without touching the scale (the
  // origin moves, the size does not).
  double collar = fur.collar_mm;
  double comp_w = w_mm + 2 * collar + (r.side ? kPanelGapMm + panel_w : 0);
  double comp_h = h_mm + 2 * collar + kScaleBandMm;
  if (r.side) comp_h = std::max(comp_h, std::min(r.inner.height(), kMinPanelHeightMm));
  if (!r.side) comp_h += kPanelGapMm + kBelowPanelMm;
  double left = r.inner.min_x + (r.inner.width() - comp_w) / 2;
  double top = r.inner.min_y + (r.inner.height() - comp_h) / 2;
  if (!r.side) left = r.inner.min_x + (r.inner.width() - w_mm - 2 * collar) / 2;
  f.page_origin_mm = {std::round((left + collar) * 100) / 100,
                      std::round((top + collar) * 100) / 100};
  L.map_box_mm = f.page_box_mm();
  L.collar_box_mm = L.map_box_mm.expanded(collar);
  place_furniture(L, r, panel_w);
  return L;
}

project::Paper fitting_paper(const project::Project& project, const style::Style& style,
                             const Box& ground) {
  const double mm_per_m = 1000.0 / project.scale;
  const double w_mm = ground.width() * mm_per_m, h_mm = ground.height() * mm_per_m;
  const auto& fur = style.furniture;
  double margin = project.margin_mm.value_or(fur.margin_mm);
  for (const char* name : {"A4", "A3", "A2", "A1", "A0"}) {
    PaperSize size = paper_size(name);
    for (bool landscape : {false, true}) {
      PaperSize o = oriented(size, landscape);
      try {
        double in_w = o.width_mm - 2 * (margin + kFrameGapMm);
        double in_h = o.height_mm - 2 * (margin + kFrameGapMm);
        Region r = regions(o.width_mm, o.height_mm, margin, fur.collar_mm,
                           side_panel_width_mm(style, in_w, in_h));
        if (w_mm <= r.map_area.width() + 1e-6 && h_mm <= r.map_area.height() + 1e-6) {
          return {o.name, o.width_mm, o.height_mm};
        }
      } catch (const Error&) {
        // This paper leaves no map area at all: try the next.
      }
    }
  }
  throw_input_error(SourceLocation{project.file.string(), 0, 0, "paper.size"},
                    "at 1:" + fmt_mm(project.scale) + " the map frame needs " + fmt_mm(w_mm) +
                        " x " + fmt_mm(h_mm) + " mm, more than A0 holds with its collar and panel");
}

}  // namespace sheetmill::sheet
