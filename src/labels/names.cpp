// Name candidates for points, lines and areas (see names.hpp for the placement rules).
#include "sheetmill/labels/names.hpp"

#include <cmath>
#include <memory>

#include "sheetmill/core/units.hpp"
#include "sheetmill/text/collision_index.hpp"
#include "sheetmill/text/shaping.hpp"

namespace sheetmill::labels {

namespace {

text::TextPaint paint_of(const style::LabelStyle& s) {
  text::TextPaint p;
  p.colour = s.colour;
  if (s.halo) {
    p.halo = true;
    p.halo_colour = s.halo->colour;
    p.halo_width_mm = s.halo->width_mm;
  }
  return p;
}

std::shared_ptr<const text::ShapedText> shaped(text::FontCache& fonts, const style::LabelStyle& s,
                                               const std::string& t, double extra_em = 0) {
  return std::make_shared<const text::ShapedText>(
      text::shape(fonts, s.font, s.size_pt, t, s.letter_spacing_em + extra_em));
}

Candidate base(const style::LabelStyle& s, const std::string& layer, const std::string& text,
               Point anchor_mm) {
  Candidate c;
  c.layer = layer;
  c.text = text;
  c.anchor_mm = anchor_mm;
  c.priority = s.priority;
  c.may_drop = s.may_drop;
  return c;
}

// A horizontal label with its baseline starting at `origin`.
Placement horizontal(std::shared_ptr<const text::ShapedText> t, const text::TextPaint& paint,
                     Point origin, double cost) {
  Placement p;
  p.footprint.push_back(text::box_quad(Box::of(origin.x, origin.y - t->ascent_mm,
                                               origin.x + t->width_mm, origin.y + t->descent_mm)));
  p.cost = cost;
  p.draw = [t, paint, origin](cairo_t* cr) { text::draw_text(cr, *t, origin, 0, paint); };
  return p;
}

double path_length(const Polyline& l) {
  double s = 0;
  for (std::size_t i = 1; i < l.size(); ++i) s += distance(l[i - 1], l[i]);
  return s;
}

Point point_along(const Polyline& l, double at) {
  double walked = 0;
  for (std::size_t i = 1; i < l.size(); ++i) {
    double seg = distance(l[i - 1], l[i]);
    if (walked + seg >= at && seg > 0) return l[i - 1] + (l[i] - l[i - 1]) * ((at - walked) / seg);
    walked += seg;
  }
  return l.back();
}

bool inside(Point p, const std::vector<Polyline>& rings) {
  bool in = false;
  for (const Polyline& r : rings)
    for (std::size_t i = 0, j = r.size() - 1; i < r.size(); j = i++)
      if ((r[i].y > p.y) != (r[j].y > p.y) &&
          p.x < (r[j].x - r[i].x) * (p.y - r[i].y) / (r[j].y - r[i].y) + r[i].x)
        in = !in;
  return in;
}

// The text box (page mm) lies inside the area: its corners and edge midpoints are inside and no
// ring vertex falls within it.
bool box_inside(const Box& b, const std::vector<Polyline>& rings) {
  const Point c = b.centre();
  for (Point p : {Point{b.min_x, b.min_y}, Point{b.max_x, b.min_y}, Point{b.max_x, b.max_y},
                  Point{b.min_x, b.max_y}, Point{c.x, b.min_y}, Point{c.x, b.max_y},
                  Point{b.min_x, c.y}, Point{b.max_x, c.y}})
    if (!inside(p, rings)) return false;
  for (const Polyline& r : rings)
    for (const Point& p : r)
      if (b.contains(p)) return false;
  return true;
}

// Width of the area along the horizontal line through p (the inside span containing p).
double span_at(Point p, const std::vector<Polyline>& rings) {
  double left = -INFINITY, right = INFINITY;
  for (const Polyline& r : rings)
    for (std::size_t i = 0, j = r.size() - 1; i < r.size(); j = i++) {
      Point a = r[i], b = r[j];
      if ((a.y > p.y) == (b.y > p.y)) continue;
      double x = a.x + (b.x - a.x) * (p.y - a.y) / (b.y - a.y);
      if (x <= p.x)
        left = std::max(left, x);
      else
        right = std::min(right, x);
    }
  return std::isfinite(left) && std::isfinite(right) ? right - left : 0;
}

std::size_t glyph_count(const text::ShapedText& t) {
  std::size_t n = 0;
  for (const auto& r : t.runs) n += r.glyphs.size();
  return n;
}

}  // namespace

std::optional<Candidate> point_name(text::FontCache& fonts, const style::LabelStyle& s,
                                    const std::string& text, Point a, double symbol_radius_mm,
                                    const std::string& layer) {
  if (text.empty()) return std::nullopt;
  auto t = shaped(fonts, s, text);
  if (t->empty()) return std::nullopt;
  const text::TextPaint paint = paint_of(s);
  const double r = symbol_radius_mm + s.offset_mm;
  const double d = r * std::sqrt(0.5);
  const double w = t->width_mm, asc = t->ascent_mm, des = t->descent_mm;
  const double mid = (asc - des) / 2;  // baseline below the anchor so the text centres on it
  // Preference: right, upper right, lower right, left, above, below (common practice).
  const Point origins[] = {{a.x + r, a.y + mid},         {a.x + d, a.y - d - des},
                           {a.x + d, a.y + d + asc},     {a.x - r - w, a.y + mid},
                           {a.x - w / 2, a.y - r - des}, {a.x - w / 2, a.y + r + asc}};
  Candidate c = base(s, layer, text, a);
  double cost = 0;
  for (const Point& o : origins) c.placements.push_back(horizontal(t, paint, o, cost++));
  return c;
}

std::vector<Candidate> line_names(text::FontCache& fonts, const style::LabelStyle& s,
                                  const std::string& text, const Polyline& path,
                                  const std::string& layer) {
  std::vector<Candidate> out;
  if (text.empty() || path.size() < 2) return out;
  auto t = shaped(fonts, s, text);
  const double len = path_length(path);
  const double w = t->width_mm;
  if (t->empty() || w + 1.0 > len) return out;
  Polyline reversed(path.rbegin(), path.rend());
  const text::TextPaint paint = paint_of(s);
  // offset 0: centred on the line; otherwise the text sits that far above it.
  const double shift =
      s.offset_mm == 0 ? -(t->ascent_mm - t->descent_mm) / 2 : s.offset_mm + t->descent_mm;
  // The sharpest turn allowed between the baselines of two neighbouring glyphs (our limit): more
  // fans the letters apart on the outside of the bend and crowds them on the inside.
  const double max_bend_deg = 20;

  std::vector<double> centres;
  if (s.repeat_mm > 0) {
    const int n = std::max(1, static_cast<int>(std::floor(len / s.repeat_mm)));
    for (int i = 0; i < n; ++i) centres.push_back((i + 0.5) * len / n);
  } else {
    centres.push_back(len / 2);
  }
  const double slide = s.repeat_mm > 0 ? std::min(s.repeat_mm, len) / 2 : len / 2;
  for (double centre : centres) {
    Candidate c = base(s, layer, text, point_along(path, centre));
    // Alternatives slide along the line from the preferred centre, alternately ahead and behind.
    const double step = std::max(1.0, w / 4);
    for (int k = 0; k <= 2 * static_cast<int>(slide / step); ++k) {
      const double off = (k % 2 ? 1 : -1) * ((k + 1) / 2) * step;
      const double start = centre + off - w / 2;
      if (start < 0 || start + w > len) continue;
      // Upright: read left to right on the page.
      const Point p0 = point_along(path, start), p1 = point_along(path, start + w);
      const bool flip = p1.x < p0.x;
      const Polyline& use = flip ? reversed : path;
      const double s0 = flip ? len - start - w : start;
      auto glyphs = text::layout_on_path(*t, use, s0, max_bend_deg, shift);
      if (glyphs.empty()) continue;
      Placement pl;
      pl.cost = std::abs(off);
      for (const auto& g : glyphs) {
        const auto& sg = t->runs[g.run].glyphs[g.index];
        // Box from the descender to the ascender; origin is its bottom-left corner.
        Point down{-std::sin(g.angle_rad), std::cos(g.angle_rad)};
        pl.footprint.push_back(text::rotated_box(g.origin_mm + down * t->descent_mm, sg.advance_mm,
                                                 t->height_mm(), g.angle_rad));
      }
      pl.draw = [t, glyphs, paint](cairo_t* cr) {
        text::draw_placed_glyphs(cr, *t, glyphs, paint);
      };
      c.placements.push_back(std::move(pl));
    }
    if (!c.placements.empty()) out.push_back(std::move(c));
  }
  return out;
}

std::optional<Candidate> area_name(text::FontCache& fonts, const style::LabelStyle& s,
                                   const std::string& text, const std::vector<Polyline>& rings,
                                   const std::string& layer) {
  if (text.empty() || rings.empty()) return std::nullopt;
  auto t = shaped(fonts, s, text);
  if (t->empty()) return std::nullopt;
  const InteriorPoint pole = pole_of_inaccessibility(rings, 0.2);
  if (pole.clearance <= 0) return std::nullopt;
  if (s.spread_in_area) {
    const std::size_t n = glyph_count(*t);
    const double target = 0.6 * span_at(pole.at, rings);
    const double size_mm = s.size_pt * kMmPerPt;
    if (n > 1 && target > t->width_mm) {
      // Common practice caps letter spacing so the name still reads as one word.
      const double extra_em = std::min(2.0, (target - t->width_mm) / (n - 1) / size_mm);
      t = shaped(fonts, s, text, extra_em);
    }
  }
  const text::TextPaint paint = paint_of(s);
  const double w = t->width_mm, asc = t->ascent_mm, des = t->descent_mm;
  Candidate c = base(s, layer, text, pole.at);
  // Centred on the pole; then nudged up and down by a line height.
  double cost = 0;
  for (double dy : {0.0, -t->height_mm(), t->height_mm()}) {
    const Point o{pole.at.x - w / 2, pole.at.y + (asc - des) / 2 + dy};
    const Box b = Box::of(o.x, o.y - asc, o.x + w, o.y + des);
    if (box_inside(b, rings)) c.placements.push_back(horizontal(t, paint, o, cost));
    ++cost;
  }
  if (c.placements.empty()) return std::nullopt;
  return c;
}

}  // namespace sheetmill::labels
