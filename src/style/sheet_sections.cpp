// The grid and sheet sections: grid lines and their figures, neatline, collar and type.
#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

Colour named_or(const Reader& r, const char* name, const char* hex) {
  auto it = r.palette().find(name);
  return it != r.palette().end() ? it->second : *parse_hex_colour(hex);
}

LabelStyle text_style(const Reader& r, double size_pt, int weight) {
  LabelStyle l;
  l.size_pt = size_pt;
  l.font.weight = weight;
  l.colour = named_or(r, "ink", "#1b1b1b");
  l.may_drop = false;
  return l;
}

double nonneg_length(const ConfigNode& n) {
  double v = n.as_length_mm();
  if (v < 0) n.fail_expected("a length of zero or more such as 10mm");
  return v;
}

}  // namespace

GridStyle default_grid(const Reader& r) {
  GridStyle g;
  Colour ink = named_or(r, "ink", "#1b1b1b");
  g.line = Stroke{ink, 0.1, LineCap::butt, LineJoin::miter, {}, 0, 0, 0};
  g.label = text_style(r, 6.5, 400);
  g.graticule = Stroke{ink, 0.1, LineCap::butt, LineJoin::miter, {1.0, 1.0}, 0, 0, 0};
  g.graticule_label = text_style(r, 6.5, 400);
  g.graticule_label.font.italic = true;
  g.second_grid =
      Stroke{named_or(r, "accent", "#b8321f"), 0.1, LineCap::butt, LineJoin::miter, {}, 0, 0, 0};
  return g;
}

GridStyle read_grid(const ConfigNode& n, Reader& r, GridStyle g) {
  n.expect_keys(
      {"line", "draw", "tick_length", "label", "major_digits_size", "graticule", "second_grid"});
  if (auto l = n.find("line")) g.line = r.stroke(*l, g.line);
  if (auto d = n.find("draw")) g.lines_across = d->as_choice({"lines", "ticks"}) == "lines";
  if (auto t = n.find("tick_length")) g.tick_mm = nonneg_length(*t);
  if (auto l = n.find("label")) g.label = r.label(*l, g.label);
  if (auto m = n.find("major_digits_size")) {
    g.label_major_size_pt = m->as_length_mm() * 72.0 / 25.4;
    if (!(g.label_major_size_pt >= 2)) m->fail_expected("a type size of at least 2pt");
  }
  if (auto gr = n.find("graticule")) {
    gr->expect_keys({"line", "label"});
    if (auto l = gr->find("line")) g.graticule = r.stroke(*l, g.graticule);
    if (auto l = gr->find("label")) g.graticule_label = r.label(*l, g.graticule_label);
  }
  if (auto s = n.find("second_grid")) g.second_grid = r.stroke(*s, g.second_grid);
  return g;
}

FurnitureStyle default_furniture(const Reader& r) {
  FurnitureStyle f;
  Colour ink = named_or(r, "ink", "#1b1b1b");
  f.neatline = Stroke{ink, 0.25, LineCap::square, LineJoin::miter, {}, 0, 0, 0};
  f.frame_outer = Stroke{ink, 0.5, LineCap::square, LineJoin::miter, {}, 0, 0, 0};
  f.collar_fill = named_or(r, "paper", "#ffffff");
  f.title = text_style(r, 16, 700);
  f.subtitle = text_style(r, 10, 400);
  f.heading = text_style(r, 8, 700);
  f.body = text_style(r, 7, 400);
  f.small = text_style(r, 5.5, 400);
  f.ink = ink;
  f.accent = named_or(r, "accent", "#b8321f");
  return f;
}

FurnitureStyle read_furniture(const ConfigNode& n, Reader& r, FurnitureStyle f) {
  n.expect_keys({"neatline", "outer_frame", "collar_fill", "title", "subtitle", "heading", "body",
                 "small", "ink", "accent", "margin", "collar", "side_panel"});
  if (auto s = n.find("neatline")) f.neatline = r.stroke(*s, f.neatline);
  if (auto s = n.find("outer_frame")) f.frame_outer = r.stroke(*s, f.frame_outer);
  if (auto c = n.find("collar_fill")) f.collar_fill = r.colour(*c);
  if (auto l = n.find("title")) f.title = r.label(*l, f.title);
  if (auto l = n.find("subtitle")) f.subtitle = r.label(*l, f.subtitle);
  if (auto l = n.find("heading")) f.heading = r.label(*l, f.heading);
  if (auto l = n.find("body")) f.body = r.label(*l, f.body);
  if (auto l = n.find("small")) f.small = r.label(*l, f.small);
  if (auto c = n.find("ink")) f.ink = r.colour(*c);
  if (auto c = n.find("accent")) f.accent = r.colour(*c);
  if (auto m = n.find("margin")) f.margin_mm = nonneg_length(*m);
  if (auto m = n.find("collar")) f.collar_mm = nonneg_length(*m);
  if (auto m = n.find("side_panel")) f.side_panel_mm = nonneg_length(*m);
  return f;
}

}  // namespace sheetmill::style::detail
