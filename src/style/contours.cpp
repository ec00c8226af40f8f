// The contours section: ordinary, index, half-interval and depression lines, their labels,
// and spot heights. Defaults follow common practice (index every fifth line, brown ink).
#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

double positive_length(const ConfigNode& n) {
  double v = n.as_length_mm();
  if (!(v > 0)) n.fail_expected("a positive length such as 2.5mm");
  return v;
}

Colour contour_brown(const Reader& r) {
  auto it = r.palette().find("contour");
  return it != r.palette().end() ? it->second : *parse_hex_colour("#9a5b2e");
}

Colour palette_or(const Reader& r, const char* name, const char* hex) {
  auto it = r.palette().find(name);
  return it != r.palette().end() ? it->second : *parse_hex_colour(hex);
}

void read_depths(const ConfigNode& n, Reader& r, DepthStyle& d) {
  n.expect_keys({"line", "index_line", "figures", "coastline", "sea"});
  if (auto l = n.find("line")) d.line = r.line(*l);
  if (auto l = n.find("index_line")) d.index_line = r.line(*l);
  if (auto f = n.find("figures")) d.figures_as_depth = f->as_choice({"depth", "height"}) == "depth";
  if (auto c = n.find("coastline")) d.coastline = r.line(*c);
  if (auto s = n.find("sea")) {
    s->expect_keys({"colour", "shaded"});
    if (auto c = s->find("colour")) d.sea = r.colour(*c);
    if (auto sh = s->find("shaded")) d.sea_shaded = sh->as_bool();
  }
}

}  // namespace

ContourStyle default_contours(const Reader& r) {
  ContourStyle c;
  Colour brown = contour_brown(r);
  c.line.strokes = {Stroke{brown, 0.13, LineCap::butt, LineJoin::round, {}, 0, 0, 0}};
  c.index_line.strokes = {Stroke{brown, 0.3, LineCap::butt, LineJoin::round, {}, 0, 0, 0}};
  c.depression_ticks.strokes = c.line.strokes;
  c.depression_ticks.marks = {
      LineMarks{2.5, 1.25, 0.6, LineMarks::Side::right, c.line.strokes[0], {}}};
  c.label.text_template = "{elevation_m}";
  c.label.size_pt = 6.5;
  c.label.colour = brown;
  c.label.placement = LabelPlacement::line;
  c.label.halo = Halo{{1, 1, 1, 1}, 0.25};
  c.spot_symbol.parts = {ShapePart{ShapePart::Kind::circle, 0.5, "", {}, Colour{}, std::nullopt}};
  c.spot_label.text_template = "{elevation_m}";
  c.spot_label.size_pt = 6.5;
  c.spot_label.font.italic = true;
  // Depths in the water's colour family (common practice: blue depth contours and coastline).
  const Colour depth = palette_or(r, "depth", "#3f7fb5"), water = palette_or(r, "water", "#4a90c8");
  c.depths.line.strokes = {Stroke{depth, 0.13, LineCap::butt, LineJoin::round, {}, 0, 0, 0}};
  c.depths.index_line.strokes = {Stroke{depth, 0.3, LineCap::butt, LineJoin::round, {}, 0, 0, 0}};
  c.depths.coastline.strokes = {Stroke{water, 0.3, LineCap::round, LineJoin::round, {}, 0, 0, 0}};
  c.depths.sea = palette_or(r, "water_fill", "#cfe6f5");
  return c;
}

ContourStyle read_contours(const ConfigNode& n, Reader& r, ContourStyle c) {
  n.expect_keys({"interval", "index_every", "line", "index_line", "half_interval", "depression",
                 "labels", "min_loop", "smoothing", "spot_heights", "depths", "order"});
  if (auto o = n.find("order")) c.order = o->as_int();
  if (auto i = n.find("interval")) {
    c.interval_m = i->as_ground_length_m();
    if (!(*c.interval_m > 0)) i->fail_expected("a positive interval such as 10m");
  }
  if (auto i = n.find("index_every")) {
    c.index_every = i->as_int();
    if (c.index_every < 2 || c.index_every > 20) i->fail_expected("a whole number from 2 to 20");
  }
  if (auto l = n.find("line")) c.line = r.line(*l);
  if (auto l = n.find("index_line")) c.index_line = r.line(*l);
  if (auto h = n.find("half_interval")) {
    if (h->is_scalar() && (h->as_string() == "off" || h->as_string() == "false")) {
      c.supplementary.reset();
    } else {
      h->expect_keys({"line", "max_slope"});
      c.supplementary = r.line(h->at("line"));
      if (auto m = h->find("max_slope")) {
        c.supplementary_max_slope_deg = m->as_angle_deg();
        if (!(c.supplementary_max_slope_deg > 0 && c.supplementary_max_slope_deg < 90)) {
          m->fail_expected("a slope above 0 and below 90 degrees");
        }
      }
    }
  }
  if (auto d = n.find("depression")) {
    d->expect_keys({"line", "tick_every", "tick_length"});
    if (auto l = d->find("line")) c.depression_ticks = r.line(*l);
    if (auto t = d->find("tick_every")) c.tick_spacing_mm = t->as_spacing_mm();
    if (auto t = d->find("tick_length")) c.tick_length_mm = positive_length(*t);
  }
  if (auto l = n.find("labels")) {
    c.label = r.label(*l, c.label, {"every", "upright"});
    if (auto e = l->find("every")) c.label_spacing_mm = positive_length(*e);
    if (auto u = l->find("upright")) c.labels_upright = u->as_bool();
  }
  if (auto m = n.find("min_loop")) c.min_loop_mm = m->as_length_mm();
  if (auto s = n.find("smoothing")) c.smoothing_mm = s->as_length_mm();
  if (auto d = n.find("depths")) read_depths(*d, r, c.depths);
  if (auto sp = n.find("spot_heights")) {
    sp->expect_keys({"symbol", "label", "min_prominence", "depressions", "round_to"});
    if (auto s = sp->find("symbol")) c.spot_symbol = r.point(*s);
    if (auto l = sp->find("label")) c.spot_label = r.label(*l, c.spot_label);
    if (auto p = sp->find("min_prominence")) c.spot_min_prominence_m = p->as_ground_length_m();
    if (auto d = sp->find("depressions")) c.spot_depressions = d->as_bool();
    if (auto rt = sp->find("round_to")) {
      c.spot_round_m = rt->as_ground_length_m();
      if (!(c.spot_round_m > 0)) rt->fail_expected("a positive rounding such as 1m");
    }
  }
  return c;
}

}  // namespace sheetmill::style::detail
