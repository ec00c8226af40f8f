#include "sheetmill/sheet/layout.hpp"

#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"

namespace sheetmill::sheet {

namespace {

constexpr double kPanelGapMm = 5;     // between the collar box and the furniture panel
constexpr double kBelowPanelMm = 70;  // height of the panel when it sits under the map

std::string fmt_mm(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", v);
  return buf;
}

struct Region {
  Box map_area;  // where the frame may go (inside margins and collar)
  Box panel;     // the furniture panel
  bool side = true;
};

Region regions(double w, double h, double margin, double collar, double side_panel) {
  Region r;
  Box inner = Box::of(margin, margin, w - margin, h - margin);
  if (side_panel > 0) {
    r.side = true;
    r.panel = Box::of(inner.max_x - side_panel, inner.min_y, inner.max_x, inner.max_y);
    r.map_area = Box::of(inner.min_x + collar, inner.min_y + collar,
                         r.panel.min_x - kPanelGapMm - collar, inner.max_y - collar);
  } else {
    r.side = false;
    r.panel = Box::of(inner.min_x, inner.max_y - kBelowPanelMm, inner.max_x, inner.max_y);
    r.map_area = Box::of(inner.min_x + collar, inner.min_y + collar, inner.max_x - collar,
                         r.panel.min_y - kPanelGapMm - collar);
  }
  if (r.map_area.empty() || r.map_area.width() < 20 || r.map_area.height() < 20) {
    throw_input_error(SourceLocation{"", 0, 0, "paper"},
                      "the paper (" + fmt_mm(w) + " x " + fmt_mm(h) +
                          " mm) leaves no room for a map inside the margins, collar and panel");
  }
  return r;
}

// Splits the furniture panel into its boxes, top to bottom (side panel) or left to right (below).
void place_panels(Layout& L, const Region& r) {
  const Box& p = r.panel;
  if (r.side) {
    double y = p.min_y;
    auto take = [&](double hgt) {
      Box b = Box::of(p.min_x, y, p.max_x, y + hgt);
      y += hgt;
      return b;
    };
    double fixed = 26 + 26 + 50 + 80 + 42;
    double shrink = std::min(1.0, (p.height() - 20) / fixed);  // small paper: squeeze
    L.title_box_mm = take(26 * shrink);
    L.legend_box_mm = take(std::max(20.0, p.height() - fixed * shrink));
    L.scale_box_mm = take(26 * shrink);
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
    Box sn = take(0.18);
    L.scale_box_mm = Box::of(sn.min_x, sn.min_y, sn.max_x, sn.min_y + sn.height() * 0.45);
    L.north_box_mm = Box::of(sn.min_x, L.scale_box_mm.max_y, sn.max_x, sn.max_y);
    L.notes_box_mm = take(0.22);
    L.diagrams_box_mm = Box::of(x, p.min_y, p.max_x, p.max_y);
  }
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
  L.page_w_mm = project.paper.width_mm;
  L.page_h_mm = project.paper.height_mm;
  L.crs_definition = project.crs;
  const auto& fur = style.furniture;
  double margin = project.margin_mm.value_or(fur.margin_mm);
  Region r = regions(L.page_w_mm, L.page_h_mm, margin, fur.collar_mm, fur.side_panel_mm);

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
  } else if (project.extent.centre) {
    // The frame fills the map area, in whole millimetres on paper.
    double w_mm = std::floor(r.map_area.width());
    double h_mm = std::floor(r.map_area.height());
    Point c = *project.extent.centre;
    double hw = w_mm / 2 / mm_per_m, hh = h_mm / 2 / mm_per_m;
    f.ground = Box::of(c.x - hw, c.y - hh, c.x + hw, c.y + hh);
  } else {
    throw_input_error(SourceLocation{project.file.string(), 0, 0, "extent"},
                      "expected one of extent.centre, extent.box or extent.sheet");
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
  // Centred in the map area; page coordinates rounded to 0.01 mm keep the PDF tidy without
  // touching the scale (the origin moves, the size does not).
  Point c = r.map_area.centre();
  f.page_origin_mm = {std::round((c.x - w_mm / 2) * 100) / 100,
                      std::round((c.y - h_mm / 2) * 100) / 100};
  L.map_box_mm = f.page_box_mm();
  L.collar_box_mm = L.map_box_mm.expanded(fur.collar_mm);
  place_panels(L, r);
  return L;
}

}  // namespace sheetmill::sheet
