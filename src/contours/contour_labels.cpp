#include "sheetmill/contours/contour_labels.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <memory>

#include "contours/dem_sampling.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/draw/point.hpp"
#include "sheetmill/text/shaping.hpp"

namespace sheetmill::contours {

namespace {

// A line on the page with its arclength; a closed line is stored twice round so that a window
// may run over the seam.
struct PagePath {
  Polyline pts;
  std::vector<double> arc;
  double length = 0;  // of the line itself (once round)
  bool closed = false;

  Point at(double s) const {
    auto it = std::upper_bound(arc.begin(), arc.end(), s);
    std::size_t i = it == arc.begin() ? 0 : static_cast<std::size_t>(it - arc.begin()) - 1;
    if (i + 1 >= pts.size()) return pts.back();
    double seg = arc[i + 1] - arc[i];
    double t = seg > 0 ? (s - arc[i]) / seg : 0;
    return pts[i] + (pts[i + 1] - pts[i]) * t;
  }
};

PagePath page_path(const ContourLine& l, const MapFrame& frame) {
  PagePath p;
  p.closed = l.closed;
  for (const auto& g : l.ground) p.pts.push_back(frame.to_page(g));
  if (l.closed) {
    Polyline ring = p.pts;
    p.pts.insert(p.pts.end(), ring.begin(), ring.end());
    p.pts.push_back(ring.front());
  }
  p.arc.assign(p.pts.size(), 0);
  for (std::size_t i = 1; i < p.pts.size(); ++i)
    p.arc[i] = p.arc[i - 1] + distance(p.pts[i - 1], p.pts[i]);
  p.length = l.closed ? p.arc.back() / 2 : p.arc.back();
  return p;
}

// How far the line strays from the straight chord over [s0, s1] (page mm).
double deviation(const PagePath& p, double s0, double s1, Point a, Point b) {
  Point d = b - a;
  double len = length(d);
  if (len <= 0) return 1e9;
  double worst = 0;
  auto it = std::upper_bound(p.arc.begin(), p.arc.end(), s0);
  for (std::size_t i = static_cast<std::size_t>(it - p.arc.begin());
       i < p.pts.size() && p.arc[i] < s1; ++i)
    worst = std::max(worst, std::abs(cross(d, p.pts[i] - a)) / len);
  return worst;
}

// Arclength positions of the slots on one line: the ladder points it passes within half a
// spacing of (the nearest point of the line to each), thinned to the spacing, then gaps longer
// than one and a half spacings filled evenly.
std::vector<std::pair<double, bool>> slots_on(const PagePath& p, const std::vector<Point>& ladder,
                                              double spacing, double label_len) {
  std::vector<std::pair<double, bool>> slots;  // (s, from the ladder)
  Box b;
  for (std::size_t i = 0; i < p.pts.size(); ++i) b.add(p.pts[i]);
  Box near = b.expanded(spacing / 2);
  std::size_t n = p.closed ? p.pts.size() / 2 + 1 : p.pts.size();
  for (const auto& q : ladder) {
    if (!near.contains(q)) continue;
    double best = spacing / 2, best_s = -1;
    for (std::size_t i = 0; i + 1 < n; ++i) {
      Point a = p.pts[i], d = p.pts[i + 1] - a;
      double len2 = dot(d, d);
      double t = len2 > 0 ? std::clamp(dot(q - a, d) / len2, 0.0, 1.0) : 0.0;
      double dist = distance(q, a + d * t);
      if (dist < best) best = dist, best_s = p.arc[i] + t * std::sqrt(len2);
    }
    if (best_s >= 0) slots.push_back({best_s, true});
  }
  std::sort(slots.begin(), slots.end());
  std::vector<std::pair<double, bool>> kept;
  for (const auto& s : slots)
    if (kept.empty() || s.first - kept.back().first >= 0.6 * spacing) kept.push_back(s);
  if (p.closed && kept.size() > 1 &&
      kept.front().first + p.length - kept.back().first < 0.6 * spacing)
    kept.pop_back();
  // Fill long stretches without a slot (and lines the ladder missed).
  double usable0 = p.closed ? 0 : label_len, usable1 = p.closed ? p.length : p.length - label_len;
  if (usable1 <= usable0) return kept;
  std::vector<double> marks;
  for (const auto& k : kept) marks.push_back(k.first);
  std::vector<std::pair<double, bool>> filled = kept;
  if (marks.empty()) {
    int count = std::max(1, static_cast<int>(std::floor((usable1 - usable0) / spacing)));
    for (int k = 0; k < count; ++k)
      filled.push_back({usable0 + (usable1 - usable0) * (k + 0.5) / count, false});
  } else {
    std::vector<double> ends = marks;
    if (p.closed) {
      ends.push_back(marks.front() + p.length);
    } else {
      ends.insert(ends.begin(), usable0 - spacing / 2);
      ends.push_back(usable1 + spacing / 2);
    }
    for (std::size_t k = 0; k + 1 < ends.size(); ++k) {
      double gap = ends[k + 1] - ends[k];
      int extra = static_cast<int>(std::floor(gap / spacing - 0.5));
      for (int e = 1; e <= extra; ++e) {
        double s = ends[k] + gap * e / (extra + 1);
        if (p.closed) s = std::fmod(s, p.length);
        if (s >= usable0 && s <= usable1) filled.push_back({s, false});
      }
    }
  }
  std::sort(filled.begin(), filled.end());
  return filled;
}

struct Shaped {
  std::shared_ptr<text::ShapedText> text;
};

text::TextPaint paint_of(const style::LabelStyle& ls) {
  text::TextPaint paint;
  paint.colour = ls.colour;
  if (ls.halo) {
    paint.halo = true;
    paint.halo_colour = ls.halo->colour;
    paint.halo_width_mm = ls.halo->width_mm;
  }
  return paint;
}

}  // namespace

std::string contour_label_text(const ContourLine& line, const style::ContourStyle& style,
                               double unit_m) {
  const style::LabelStyle& ls = style.label;
  // Depth lines read as depths below the sea level unless the style wants negative heights.
  const double shown =
      line.depth && style.depths.figures_as_depth ? line.depth_m : line.elevation_m;
  std::string value = elevation_text(shown / unit_m, 0.01, ls.text_template);
  if (ls.upper_case) std::transform(value.begin(), value.end(), value.begin(), ::toupper);
  return value;
}

ContourLabels contour_label_candidates(const std::vector<ContourLine>& lines,
                                       const terrain::Dem& dem, const MapFrame& frame,
                                       const style::ContourStyle& style, text::FontCache& fonts,
                                       double unit_m) {
  ContourLabels out;
  const style::LabelStyle& ls = style.label;
  const double spacing = std::max(style.label_spacing_mm, 5.0);
  const Box page = frame.page_box_mm();
  std::vector<Point> ladder;
  for (double y = page.min_y + spacing / 2; y < page.max_y; y += spacing)
    for (double x = page.min_x + spacing / 2; x < page.max_x; x += spacing)
      ladder.push_back({x, y});
  detail::DemSampler sampler(dem);
  const text::TextPaint land_paint = paint_of(ls);
  text::TextPaint depth_paint = land_paint;  // depth figures in the depth lines' colour
  if (!style.depths.line.strokes.empty()) depth_paint.colour = style.depths.line.strokes[0].colour;
  std::map<std::string, std::shared_ptr<text::ShapedText>> shaped;

  for (std::size_t li = 0; li < lines.size(); ++li) {
    const ContourLine& line = lines[li];
    // The coastline is its own symbol, not a figure "0".
    if (!line.index || line.supplementary || line.coastline || line.ground.size() < 2) continue;
    const text::TextPaint& paint = line.depth ? depth_paint : land_paint;
    std::string value = contour_label_text(line, style, unit_m);
    auto& st = shaped[value];
    if (!st) {
      st = std::make_shared<text::ShapedText>(
          text::shape(fonts, ls.font, ls.size_pt, value, ls.letter_spacing_em));
    }
    if (st->empty()) continue;
    const double w = st->width_mm, h = st->height_mm();
    const double gap = 0.2 + 0.25 * h;  // clear line each side of the figures
    const double span = w + 2 * gap;
    PagePath path = page_path(line, frame);
    if (path.length < 1.5 * span) continue;
    for (const auto& [slot, on_ladder] : slots_on(path, ladder, spacing, span / 2)) {
      labels::Candidate cand;
      cand.layer = kContourLabelLayer;
      cand.text = value;
      cand.anchor_mm = path.at(slot);
      cand.priority = ls.priority;
      cand.may_drop = true;
      std::vector<LabelGeometry> geom;
      const double step = span / 3;
      const int reach = std::max(1, static_cast<int>(spacing / 4 / step));
      for (int k = -reach; k <= reach; ++k) {
        double s = slot + k * step;
        if (path.closed) {
          s = std::fmod(s + 2 * path.length, path.length) + path.length;  // second lap
        } else if (s - span / 2 < 0 || s + span / 2 > path.length) {
          continue;
        }
        Point a = path.at(s - span / 2), b = path.at(s + span / 2), centre = path.at(s);
        Point d = b - a;
        double chord = length(d);
        if (chord < 0.9 * span) continue;  // a hairpin under the figures
        double dev = deviation(path, s - span / 2, s + span / 2, a, b);
        if (dev > 0.35 * h) continue;  // too curved for straight figures
        Point along = d * (1 / chord);
        double angle = std::atan2(along.y, along.x);
        Point up{std::sin(angle), -std::cos(angle)};
        // Uphill on the page: the DEM's gradient, or the line's orientation (higher ground on
        // its left) where the DEM has no data.
        Point uphill{along.y, -along.x};
        if (auto g = sampler.gradient(frame.to_ground(centre)); g && length(*g) > 0)
          uphill = Point{g->x, -g->y};
        bool flip = style.labels_upright ? along.x < 0 || (along.x == 0 && along.y > 0)
                                         : dot(up, uphill) < 0;
        if (flip) {
          angle += kPi;
          along = along * -1;
          up = up * -1;
        }
        Point box_origin = centre - along * (span / 2) - up * (h / 2);
        text::Quad fp = text::rotated_box(box_origin, span, h, angle);
        bool inside = std::all_of(fp.begin(), fp.end(), [&](Point q) { return page.contains(q); });
        if (!inside) continue;
        Point origin = centre - along * (w / 2) - up * ((st->ascent_mm - st->descent_mm) / 2);
        labels::Placement pl;
        // Also the upright box round the figures and their halo: a reader of the PDF (search,
        // text selection, poppler) boxes rotated words upright, and two figures whose upright
        // boxes overlap read as touching once printed on steep ground.
        const double halo = paint.halo ? paint.halo_width_mm : 0;
        Box upright;
        for (double x : {-halo, w + halo})
          for (double y : {-st->descent_mm - halo, st->ascent_mm + halo})
            upright.add(origin + along * x + up * y);
        pl.footprint = {fp, text::box_quad(upright)};
        pl.cost = dev / h + 0.5 * std::abs(k) * step / spacing + (on_ladder ? 0 : 0.25);
        auto text_ptr = st;
        pl.draw = [text_ptr, origin, angle, paint](cairo_t* cr) {
          text::draw_text(cr, *text_ptr, origin, angle, paint);
        };
        cand.placements.push_back(std::move(pl));
        geom.push_back({li, centre, angle, up});
      }
      if (cand.placements.empty()) continue;
      out.candidates.push_back(std::move(cand));
      out.geometry.push_back(std::move(geom));
    }
  }
  return out;
}

std::vector<labels::Candidate> label_candidates(const std::vector<ContourLine>& lines,
                                                const terrain::Dem& dem, const MapFrame& frame,
                                                const style::ContourStyle& style,
                                                text::FontCache& fonts, double unit_m) {
  return contour_label_candidates(lines, dem, frame, style, fonts, unit_m).candidates;
}

std::vector<labels::Candidate> spot_label_candidates(const std::vector<SpotHeight>& spots,
                                                     const MapFrame& frame,
                                                     const style::ContourStyle& style,
                                                     text::FontCache& fonts, double unit_m) {
  std::vector<labels::Candidate> out;
  const style::LabelStyle& ls = style.spot_label;
  text::TextPaint paint = paint_of(ls);
  const double r = draw::point_symbol_radius_mm(style.spot_symbol);
  const Box page = frame.page_box_mm();
  for (const auto& spot : spots) {
    Point at = frame.to_page(spot.ground);
    if (!page.contains(at)) continue;
    double round_m = spot.kind == SpotHeight::Kind::control ? std::min(style.spot_round_m, 0.1)
                                                            : style.spot_round_m;
    std::string value = elevation_text(spot.elevation_m / unit_m, round_m, ls.text_template);
    if (!spot.label.empty()) value = spot.label + " " + value;
    auto st = std::make_shared<text::ShapedText>(
        text::shape(fonts, ls.font, ls.size_pt, value, ls.letter_spacing_em));
    if (st->empty()) continue;
    const double w = st->width_mm, h = st->height_mm(), off = r + ls.offset_mm;
    text::Quad dot = text::box_quad(Box::of(at.x - r, at.y - r, at.x + r, at.y + r));
    // Baseline origins: right, left, above, below the dot (figures centred vertically or
    // horizontally on it).
    double mid = (st->ascent_mm - st->descent_mm) / 2;
    Point origins[4] = {{at.x + off, at.y + mid},
                        {at.x - off - w, at.y + mid},
                        {at.x - w / 2, at.y - off - st->descent_mm},
                        {at.x - w / 2, at.y + off + st->ascent_mm}};
    labels::Candidate cand;
    cand.layer = kSpotHeightLayer;
    cand.text = value;
    cand.anchor_mm = at;
    cand.priority = ls.priority;
    cand.may_drop = ls.may_drop;
    for (int k = 0; k < 4; ++k) {
      Point o = origins[k];
      text::Quad box =
          text::box_quad(Box::of(o.x, o.y - st->ascent_mm, o.x + w, o.y + st->descent_mm));
      if (!std::all_of(box.begin(), box.end(), [&](Point q) { return page.contains(q); })) continue;
      labels::Placement pl;
      pl.footprint = {box, dot};
      pl.cost = k;
      pl.draw = [st, o, paint](cairo_t* cr) { text::draw_text(cr, *st, o, 0, paint); };
      cand.placements.push_back(std::move(pl));
    }
    (void)h;
    if (!cand.placements.empty()) out.push_back(std::move(cand));
  }
  return out;
}

}  // namespace sheetmill::contours
