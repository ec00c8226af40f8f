#include "sheet/graticule.hpp"

#include <array>
#include <cmath>

#include "sheet/typeset.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/draw/line.hpp"
#include "sheetmill/sheet/dms.hpp"
#include "sheetmill/sheet/grid.hpp"
#include "sheetmill/sheet/nice_numbers.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"

namespace sheetmill::sheet {

namespace {

constexpr double kCrossArmMm = 1.5;

// Steps (arc-seconds) that tick intervals may take; each divides the next larger step that is
// used for crosses, so ticks always fall on the crosses' meridians and parallels.
double tick_step_for(double cross_step, double mm_per_arcsec, double min_mm) {
  static constexpr std::array<double, 14> kSteps{1,  2,   5,   10,  15,  20,   30,
                                                 60, 120, 300, 600, 900, 1800, 3600};
  double best = cross_step;
  for (double s : kSteps) {
    if (s >= cross_step) break;
    double q = cross_step / s;
    if (std::abs(q - std::round(q)) < 1e-9 && s * mm_per_arcsec >= min_mm) {
      best = s;
      break;
    }
  }
  return best;
}

struct Crossing {
  Point page;
  double value_deg;
};

}  // namespace

std::vector<Point> dense_neatline(const Layout& L, double max_mm) {
  std::vector<Point> out;
  const auto& ring = L.frame.neatline;
  double max_m = max_mm * L.frame.metres_per_mm();
  for (std::size_t i = 0; i < ring.size(); ++i) {
    Point a = ring[i], b = ring[(i + 1) % ring.size()];
    int n = std::max(1, static_cast<int>(std::ceil(distance(a, b) / max_m)));
    for (int k = 0; k < n; ++k) out.push_back(a + (b - a) * (double(k) / n));
  }
  return out;
}

bool inside_ring(const std::vector<Point>& ring, Point p) {
  bool in = false;
  for (std::size_t i = 0, j = ring.size() - 1; i < ring.size(); j = i++) {
    const Point &a = ring[i], &b = ring[j];
    if ((a.y > p.y) != (b.y > p.y) && p.x < (b.x - a.x) * (p.y - a.y) / (b.y - a.y) + a.x) {
      in = !in;
    }
  }
  return in;
}

void draw_graticule(cairo_t* cr, const Layout& L, const style::Style& style, text::FontCache& fonts,
                    std::vector<Box>* label_boxes) {
  auto keep = [&](const Box& b) {
    if (label_boxes) label_boxes->push_back(b);
  };
  const auto& gs = style.grid;
  SheetCrs crs = SheetCrs::resolve(L.crs_definition.empty() ? L.frame.crs_wkt : L.crs_definition);
  std::vector<Point> ground = dense_neatline(L);
  std::vector<Point> page, geo;
  Box geo_box;
  for (Point g : ground) {
    page.push_back(L.frame.to_page(g));
    geo.push_back(crs.to_lonlat(g));
    geo_box.add(geo.back());
  }
  Point centre_geo = crs.to_lonlat(L.frame.ground.centre());
  // Paper length of one arc-second along the parallel and the meridian at the centre.
  auto page_at = [&](Point lonlat) { return L.frame.to_page(crs.to_ground(lonlat)); };
  double d = 30.0 / 3600;
  double mm_lon =
      distance(page_at(centre_geo + Point{d, 0}), page_at(centre_geo - Point{d, 0})) / 60;
  double mm_lat =
      distance(page_at(centre_geo + Point{0, d}), page_at(centre_geo - Point{0, d})) / 60;
  double mm_per_arcsec = std::min(mm_lon, mm_lat);
  double cross = graticule_step_arcsec(mm_per_arcsec, 50) / 3600.0;
  double tick = tick_step_for(cross * 3600, mm_per_arcsec, 10) / 3600.0;

  cairo_save(cr);
  draw::apply_stroke(cr, gs.graticule);
  Point mid = L.map_box_mm.centre();
  std::vector<std::pair<Crossing, Side>> labelled;
  for (int axis = 0; axis < 2; ++axis) {  // 0: meridians (lon), 1: parallels (lat)
    double lo = axis == 0 ? geo_box.min_x : geo_box.min_y;
    double hi = axis == 0 ? geo_box.max_x : geo_box.max_y;
    for (long k = static_cast<long>(std::ceil(lo / tick)); k * tick <= hi; ++k) {
      double v = k * tick;
      bool major = std::abs(v / cross - std::round(v / cross)) < 1e-6;
      for (std::size_t i = 0; i < geo.size(); ++i) {
        std::size_t j = (i + 1) % geo.size();
        double a = axis == 0 ? geo[i].x : geo[i].y, b = axis == 0 ? geo[j].x : geo[j].y;
        if ((a - v) * (b - v) > 0 || a == b || b == v) continue;
        double t = (v - a) / (b - a);
        Point p = page[i] + (page[j] - page[i]) * t;
        Point lonlat = geo[i] + (geo[j] - geo[i]) * t;
        // The tick runs along the meridian or parallel, into the map.
        Point step = axis == 0 ? Point{0, 1.0 / 3600} : Point{1.0 / 3600, 0};
        Point dir = page_at(lonlat + step) - page_at(lonlat - step);
        dir = dir * (1.0 / length(dir));
        if (dot(dir, mid - p) < 0) dir = dir * -1.0;
        double len = major ? gs.tick_mm * 1.5 : gs.tick_mm;
        Point e = p + dir * len;
        cairo_move_to(cr, p.x, p.y);
        cairo_line_to(cr, e.x, e.y);
        if (major) {
          Side side;
          if (axis == 0)
            side = p.y < mid.y ? Side::top : Side::bottom;
          else
            side = p.x < mid.x ? Side::left : Side::right;
          labelled.push_back({{e, v}, side});
        }
      }
    }
  }
  // Crosses where major meridians and parallels meet inside the map.
  for (long i = static_cast<long>(std::ceil(geo_box.min_x / cross)); i * cross <= geo_box.max_x;
       ++i) {
    for (long j = static_cast<long>(std::ceil(geo_box.min_y / cross)); j * cross <= geo_box.max_y;
         ++j) {
      Point p = page_at({i * cross, j * cross});
      if (!inside_ring(page, p)) continue;
      bool near_edge = false;
      for (Point q : page) near_edge = near_edge || distance(p, q) < 4;
      if (near_edge) continue;
      cairo_move_to(cr, p.x - kCrossArmMm, p.y);
      cairo_line_to(cr, p.x + kCrossArmMm, p.y);
      cairo_move_to(cr, p.x, p.y - kCrossArmMm);
      cairo_line_to(cr, p.x, p.y + kCrossArmMm);
    }
  }
  cairo_stroke(cr);

  // The neatline's corners (the ring vertices nearest the frame box's corners).
  const Box& mb = L.map_box_mm;
  const std::array<Point, 4> corners{Point{mb.min_x, mb.min_y}, Point{mb.max_x, mb.min_y},
                                     Point{mb.max_x, mb.max_y}, Point{mb.min_x, mb.max_y}};
  std::array<std::size_t, 4> corner_index{};
  for (std::size_t k = 0; k < corners.size(); ++k) {
    for (std::size_t i = 0; i < page.size(); ++i) {
      if (distance(page[i], corners[k]) < distance(page[corner_index[k]], corners[k])) {
        corner_index[k] = i;
      }
    }
  }
  const auto& ls = gs.graticule_label;
  double res = cross * 3600;
  const double corner_room_mm = 22;  // the corner values' place
  for (const auto& [c, side] : labelled) {
    bool near_corner = false;
    for (std::size_t k = 0; k < corners.size(); ++k) {
      near_corner = near_corner || distance(c.page, page[corner_index[k]]) < corner_room_mm;
    }
    if (near_corner) continue;
    AngleKind kind =
        (side == Side::top || side == Side::bottom) ? AngleKind::longitude : AngleKind::latitude;
    std::string txt = format_dms(c.value_deg, kind, res);
    switch (side) {
      case Side::top:
        keep(draw_label(cr, fonts, ls, txt, c.page + Point{0, 0.4}, HAlign::centre, VAlign::top));
        break;
      case Side::bottom:
        keep(
            draw_label(cr, fonts, ls, txt, c.page - Point{0, 0.4}, HAlign::centre, VAlign::bottom));
        break;
      case Side::left:
        keep(draw_label(cr, fonts, ls, txt, c.page + Point{0.5, 0}, HAlign::left, VAlign::middle));
        break;
      case Side::right:
        keep(draw_label(cr, fonts, ls, txt, c.page - Point{0.5, 0}, HAlign::right, VAlign::middle));
        break;
    }
  }
  // The geographic position of each corner, just inside the neatline at the corner (the
  // collar's corner square is too narrow for a full latitude), with a halo over the map.
  style::LabelStyle corner_style = ls;
  if (!corner_style.halo) corner_style.halo = style::Halo{};
  double gap = 1.0;
  for (std::size_t k = 0; k < corners.size(); ++k) {
    Point nearest = page[corner_index[k]];
    Point g = geo[corner_index[k]];
    bool left = corners[k].x < mid.x, top = corners[k].y < mid.y;
    HAlign h = left ? HAlign::left : HAlign::right;
    double x = left ? nearest.x + gap : nearest.x - gap;
    double line_h = ls.size_pt * kMmPerPt * 1.2;
    double y0 = top ? nearest.y + gap + line_h * 0.8 : nearest.y - gap - line_h * 1.25;
    keep(draw_label(cr, fonts, corner_style, format_dms(g.y, AngleKind::latitude, 1), {x, y0}, h,
                    VAlign::baseline));
    keep(draw_label(cr, fonts, corner_style, format_dms(g.x, AngleKind::longitude, 1),
                    {x, y0 + line_h}, h, VAlign::baseline));
  }
  cairo_restore(cr);
}

void draw_second_grid(cairo_t* cr, const Layout& L, const style::Style& style,
                      text::FontCache& fonts, const std::string& crs_def, double interval_m,
                      std::vector<Box>* label_boxes) {
  auto keep = [&](const Box& b) {
    if (label_boxes) label_boxes->push_back(b);
  };
  const auto& stroke = style.grid.second_grid;
  Reprojector to2(L.crs_definition.empty() ? L.frame.crs_wkt : L.crs_definition, crs_def);
  std::vector<Point> ground = dense_neatline(L);
  std::vector<Point> page;
  Box box2;
  for (Point g : ground) {
    page.push_back(L.frame.to_page(g));
    box2.add(to2.forward(g));
  }
  double iv = interval_m > 0 ? interval_m : grid_interval_m(L.frame.scale_denominator);
  style::LabelStyle ls = style.grid.label;
  ls.colour = stroke.colour;
  ls.size_pt = style.grid.label.size_pt * 0.85;
  cairo_save(cr);
  // Clip to the neatline: the second grid's lines are curves and are cut by the frame.
  for (std::size_t i = 0; i < page.size(); ++i) {
    if (i == 0)
      cairo_move_to(cr, page[i].x, page[i].y);
    else
      cairo_line_to(cr, page[i].x, page[i].y);
  }
  cairo_close_path(cr);
  cairo_clip(cr);
  draw::apply_stroke(cr, stroke);
  const int samples = 64;
  struct Label {
    Point at;
    std::string text;
    bool vertical;
  };
  std::vector<Label> labels;
  for (int axis = 0; axis < 2; ++axis) {
    double lo = axis == 0 ? box2.min_x : box2.min_y, hi = axis == 0 ? box2.max_x : box2.max_y;
    double olo = axis == 0 ? box2.min_y : box2.min_x, ohi = axis == 0 ? box2.max_y : box2.max_x;
    for (long k = static_cast<long>(std::ceil(lo / iv)); k * iv <= hi; ++k) {
      double v = k * iv;
      Polyline line;
      for (int s = 0; s <= samples; ++s) {
        double o = olo + (ohi - olo) * s / samples;
        Point p2 = axis == 0 ? Point{v, o} : Point{o, v};
        line.push_back(L.frame.to_page(to2.inverse(p2)));
      }
      cairo_move_to(cr, line[0].x, line[0].y);
      for (Point p : line) cairo_line_to(cr, p.x, p.y);
      // Label where the line first enters the map: the top for eastings, the left for northings.
      const Point* best = nullptr;
      for (const Point& p : line) {
        if (!inside_ring(page, p)) continue;
        if (!best || (axis == 0 ? p.y < best->y : p.x < best->x)) best = &p;
      }
      if (best) {
        char buf[32];
        std::snprintf(buf, sizeof buf, "%g", v / 1000.0);
        labels.push_back({*best, buf, axis == 0});
      }
    }
  }
  cairo_stroke(cr);
  for (const auto& l : labels) {
    if (l.vertical)
      keep(draw_label(cr, fonts, ls, l.text, l.at + Point{0.6, 3}, HAlign::left, VAlign::top));
    else
      keep(draw_label(cr, fonts, ls, l.text, l.at + Point{3, -0.6}, HAlign::left, VAlign::bottom));
  }
  cairo_restore(cr);
}

}  // namespace sheetmill::sheet
