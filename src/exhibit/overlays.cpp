#include "sheetmill/exhibit/overlays.hpp"

#include <ogr_geometry.h>

#include <algorithm>
#include <cmath>
#include <memory>

#include "exhibit/text_helpers.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/features/clip.hpp"
#include "sheetmill/features/reader.hpp"
#include "sheetmill/text/collision_index.hpp"

namespace sheetmill::exhibit {

namespace {

project::Source source_of(const LayerRef& ref, const std::string& name) {
  project::Source s;
  s.name = name;
  s.path = ref.path;
  s.layer = ref.layer;
  s.where = ref.where;
  s.required = true;
  return s;
}

features::ReadRequest request_for(const MapFrame& frame, std::vector<std::string> fields = {}) {
  features::ReadRequest r;
  r.sheet_crs_wkt = frame.crs_wkt;
  // A little beyond the frame so outlines do not end at the neatline with a cap.
  r.clip_ground =
      frame.ground.expanded(0.01 * std::max(frame.ground.width(), frame.ground.height()));
  r.fields = std::move(fields);
  return r;
}

Polyline to_page(const MapFrame& frame, const Polyline& line) {
  Polyline out;
  out.reserve(line.size());
  for (const Point& p : line) out.push_back(frame.to_page(p));
  return out;
}

std::vector<PageArea> read_areas(const LayerRef& ref, const std::string& name,
                                 const MapFrame& frame) {
  std::vector<PageArea> out;
  features::read_features(source_of(ref, name), request_for(frame),
                          [&](const features::Feature& f) {
                            for (const features::Polygon& poly : f.polygons) {
                              PageArea a;
                              a.rings.push_back(to_page(frame, poly.outer));
                              for (const Polyline& h : poly.holes)
                                a.rings.push_back(to_page(frame, h));
                              out.push_back(std::move(a));
                            }
                          });
  return out;
}

std::vector<Polyline> read_lines(const LayerRef& ref, const std::string& name,
                                 const MapFrame& frame) {
  std::vector<Polyline> out;
  features::read_features(
      source_of(ref, name), request_for(frame), [&](const features::Feature& f) {
        for (const Polyline& l : f.lines) out.push_back(to_page(frame, l));
        for (const features::Polygon& poly : f.polygons) {  // an area's outline as a line
          Polyline ring = to_page(frame, poly.outer);
          if (!ring.empty()) ring.push_back(ring.front());
          out.push_back(std::move(ring));
        }
      });
  return out;
}

std::unique_ptr<OGRPolygon> ogr_polygon(const PageArea& a) {
  auto poly = std::make_unique<OGRPolygon>();
  for (const Polyline& ring : a.rings) {
    auto r = std::make_unique<OGRLinearRing>();
    for (const Point& p : ring) r->addPoint(p.x, p.y);
    if (!ring.empty()) r->addPoint(ring.front().x, ring.front().y);
    poly->addRingDirectly(r.release());
  }
  return poly;
}

void rings_of(const OGRGeometry* g, std::vector<PageArea>& out) {
  if (!g) return;
  const auto type = wkbFlatten(g->getGeometryType());
  if (type == wkbPolygon) {
    const auto* poly = g->toPolygon();
    PageArea a;
    for (const OGRLinearRing* r : *poly) {
      Polyline ring;
      for (int i = 0; i + 1 < r->getNumPoints(); ++i) ring.push_back({r->getX(i), r->getY(i)});
      a.rings.push_back(std::move(ring));
    }
    out.push_back(std::move(a));
  } else if (type == wkbMultiPolygon || type == wkbGeometryCollection) {
    for (const OGRGeometry* part : *g->toGeometryCollection()) rings_of(part, out);
  }
}

// The frame minus the union of the focus areas, by GEOS through OGR. Without GEOS the veil is
// the frame with the areas' rings cut out by the even-odd rule (exact unless areas overlap).
std::vector<PageArea> veil_of(const MapFrame& frame,
                              const std::vector<std::vector<PageArea>>& areas,
                              const ExhibitProject& project) {
  const Box b = frame.page_box_mm();
  PageArea frame_area{
      {{{b.min_x, b.min_y}, {b.max_x, b.min_y}, {b.max_x, b.max_y}, {b.min_x, b.max_y}}}};
  std::vector<PageArea> out;
  OGRMultiPolygon focus;
  for (std::size_t i = 0; i < areas.size(); ++i) {
    if (!project.areas[i].focus) continue;
    for (const PageArea& a : areas[i]) focus.addGeometryDirectly(ogr_polygon(a).release());
  }
  if (focus.IsEmpty()) return {frame_area};
  if (OGRGeometryFactory::haveGEOS()) {
    std::unique_ptr<OGRGeometry> fixed(focus.MakeValid());
    std::unique_ptr<OGRGeometry> all(fixed ? fixed->UnionCascaded() : nullptr);
    if (!all && fixed) all.reset(fixed->Buffer(0));
    auto frame_poly = ogr_polygon(frame_area);
    std::unique_ptr<OGRGeometry> veil(all ? frame_poly->Difference(all.get()) : nullptr);
    if (veil) {
      rings_of(veil.get(), out);
      return out;
    }
  }
  PageArea even_odd = frame_area;
  for (const auto& list : areas) {
    for (const PageArea& a : list) {
      for (const Polyline& r : a.rings) even_odd.rings.push_back(r);
    }
  }
  return {even_odd};
}

// Lines with up to two attributes (empty when the source lacks the field).
std::vector<NamedLine> read_named_lines(const LayerRef& ref, const std::string& name,
                                        const MapFrame& frame, const std::string& name_field,
                                        const std::string& kind_field) {
  std::vector<NamedLine> out;
  std::vector<std::string> fields{name_field};
  if (!kind_field.empty()) fields.push_back(kind_field);
  features::read_features(source_of(ref, name), request_for(frame, fields),
                          [&](const features::Feature& f) {
                            const std::string* n = f.value(0);
                            const std::string* k = kind_field.empty() ? nullptr : f.value(1);
                            for (const Polyline& l : f.lines)
                              out.push_back({to_page(frame, l), n ? *n : "", k ? *k : ""});
                          });
  return out;
}

}  // namespace

OverlayData read_overlays(const ExhibitProject& project, const MapFrame& frame) {
  OverlayData d;
  if (const auto& wa = project.context.water_areas) {
    d.water_areas = read_areas(*wa, "water_areas", frame);
    features::read_features(source_of(*wa, "water_areas"), request_for(frame, {wa->name_field}),
                            [&](const features::Feature& f) {
                              const std::string* n = f.value(0);
                              if (!n || n->empty()) return;
                              for (const features::Polygon& poly : f.polygons)
                                d.named_lakes.push_back({{{to_page(frame, poly.outer)}}, *n});
                            });
  }
  if (const auto& wl = project.context.water_lines) {
    d.water_lines = read_lines(*wl, "water_lines", frame);
    for (NamedLine& l : read_named_lines(*wl, "water_lines", frame, wl->name_field, ""))
      if (!l.name.empty()) d.named_waters.push_back(std::move(l));
  }
  if (const auto& r = project.context.roads) {
    d.road_lines = read_named_lines(*r, "roads", frame, r->number_field, r->class_field);
    for (const NamedLine& l : d.road_lines) d.roads.push_back(l.line);
  }
  for (std::size_t i = 0; i < project.areas.size(); ++i) {
    const AreaOverlay& area = project.areas[i];
    if (!area.ring.empty()) {
      PageArea a;
      Polyline clipped = features::clip_ring(area.ring, request_for(frame).clip_ground);
      if (clipped.size() >= 3) a.rings.push_back(to_page(frame, clipped));
      d.areas.push_back({});
      if (!a.rings.empty()) d.areas.back().push_back(std::move(a));
    } else {
      d.areas.push_back(read_areas(area.data, "areas[" + std::to_string(i) + "]", frame));
    }
    if (d.areas.back().empty()) {
      log::warn("{}: area \"{}\" has no polygon inside the exhibit's frame",
                area.data.path.empty() ? project.file.string() : area.data.path, area.label);
    }
  }
  if (project.dim_outside > 0) d.veil = veil_of(frame, d.areas, project);
  if (project.places) {
    const PlaceCallouts& pc = *project.places;
    features::read_features(source_of(pc.data, "places"), request_for(frame, {pc.name_field}),
                            [&](const features::Feature& f) {
                              const std::string* name = f.value(0);
                              if (!name || f.points.empty()) return;
                              if (!pc.only.empty() && std::find(pc.only.begin(), pc.only.end(),
                                                                *name) == pc.only.end()) {
                                return;
                              }
                              const Point at = frame.to_page(f.points.front());
                              if (frame.page_box_mm().contains(at)) d.places.push_back({*name, at});
                            });
    if (!pc.only.empty() && d.places.size() < pc.only.size()) {
      log::warn("{}: {} of the {} places to call out were not found inside the frame", pc.data.path,
                pc.only.size() - d.places.size(), pc.only.size());
    }
  }
  return d;
}

namespace {

void path_rings(cairo_t* cr, const std::vector<Polyline>& rings) {
  for (const Polyline& r : rings) {
    for (std::size_t i = 0; i < r.size(); ++i) {
      if (i == 0) {
        cairo_move_to(cr, r[i].x, r[i].y);
      } else {
        cairo_line_to(cr, r[i].x, r[i].y);
      }
    }
    cairo_close_path(cr);
  }
}

void path_lines(cairo_t* cr, const std::vector<Polyline>& lines) {
  for (const Polyline& l : lines) {
    for (std::size_t i = 0; i < l.size(); ++i) {
      if (i == 0) {
        cairo_move_to(cr, l[i].x, l[i].y);
      } else {
        cairo_line_to(cr, l[i].x, l[i].y);
      }
    }
  }
}

void set_rgba(cairo_t* cr, const Colour& c, double alpha = 1) {
  cairo_set_source_rgba(cr, c.r, c.g, c.b, c.a * alpha);
}

CalloutReport draw_callouts(cairo_t* cr, const std::vector<Place>& places,
                            text::CollisionIndex& index, const TypeScale& type,
                            text::FontCache& fonts) {
  CalloutReport rep;
  const double f = type.factor;
  const double dot_r = 1.6 * f;
  for (const Place& p : places) {
    index.insert(text::box_quad(
        Box::of(p.at_mm.x - dot_r, p.at_mm.y - dot_r, p.at_mm.x + dot_r, p.at_mm.y + dot_r)));
  }
  const double pad = 0.35 * type.body_pt * kMmPerPt;
  for (const Place& p : places) {
    text::ShapedText t = text::shape(fonts, detail::bold(), type.body_pt, p.name);
    const double bw = t.width_mm + 2 * pad, bh = t.height_mm() + 2 * pad;
    const double d = 9 * f;  // leader length
    // Eight directions, preferring up-right then the other diagonals (common practice: names
    // to the upper right of their point).
    static const double dirs[8][2] = {{1, -1}, {-1, -1}, {1, 1},  {-1, 1},
                                      {1, 0},  {-1, 0},  {0, -1}, {0, 1}};
    Box chosen;
    bool free = false;
    for (const auto& dir : dirs) {
      const double ux = dir[0] / std::hypot(dir[0], dir[1]),
                   uy = dir[1] / std::hypot(dir[0], dir[1]);
      const Point end{p.at_mm.x + ux * d, p.at_mm.y + uy * d};
      const double x0 = dir[0] > 0 ? end.x : dir[0] < 0 ? end.x - bw : end.x - bw / 2;
      const double y0 = dir[1] > 0 ? end.y : dir[1] < 0 ? end.y - bh : end.y - bh / 2;
      Box b = Box::of(x0, y0, x0 + bw, y0 + bh);
      if (chosen.empty()) chosen = b;
      if (index.is_free(text::box_quad(b))) {
        chosen = b;
        free = true;
        break;
      }
    }
    (free ? rep.placed_free : rep.placed_forced)++;
    index.insert(text::box_quad(chosen));
    // Leader from the dot to the nearest point of the box.
    const Point near{std::clamp(p.at_mm.x, chosen.min_x, chosen.max_x),
                     std::clamp(p.at_mm.y, chosen.min_y, chosen.max_y)};
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_ROUND);
    cairo_set_source_rgb(cr, 1, 1, 1);
    cairo_set_line_width(cr, 1.4 * f);
    cairo_move_to(cr, p.at_mm.x, p.at_mm.y);
    cairo_line_to(cr, near.x, near.y);
    cairo_stroke(cr);
    cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
    cairo_set_line_width(cr, 0.5 * f);
    cairo_move_to(cr, p.at_mm.x, p.at_mm.y);
    cairo_line_to(cr, near.x, near.y);
    cairo_stroke(cr);
    cairo_arc(cr, p.at_mm.x, p.at_mm.y, dot_r, 0, 2 * kPi);
    cairo_set_source_rgb(cr, 1, 1, 1);
    cairo_fill_preserve(cr);
    cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
    cairo_set_line_width(cr, 0.6 * f);
    cairo_stroke(cr);
    cairo_rectangle(cr, chosen.min_x, chosen.min_y, bw, bh);
    cairo_set_source_rgba(cr, 1, 1, 1, 0.92);
    cairo_fill_preserve(cr);
    cairo_set_source_rgb(cr, 0.1, 0.1, 0.1);
    cairo_set_line_width(cr, 0.35 * f);
    cairo_stroke(cr);
    text::TextPaint paint;
    paint.colour = {0.1, 0.1, 0.1, 1};
    text::draw_text(cr, t, {chosen.min_x + pad, chosen.min_y + pad + t.ascent_mm}, 0, paint);
  }
  if (rep.placed_forced > 0) {
    log::warn("{} callouts could not avoid each other; check the exhibit for overlaps",
              rep.placed_forced);
  }
  return rep;
}

}  // namespace

namespace {

const Colour kWater{0.16, 0.45, 0.70, 1};

void clip_to_map(cairo_t* cr, const Box& map) {
  cairo_rectangle(cr, map.min_x, map.min_y, map.width(), map.height());
  cairo_clip(cr);
  cairo_set_line_join(cr, CAIRO_LINE_JOIN_ROUND);
  cairo_set_line_cap(cr, CAIRO_LINE_CAP_ROUND);
}

void draw_water(cairo_t* cr, const ExhibitProject& project, const OverlayData& data, double f) {
  for (const PageArea& a : data.water_areas) {
    path_rings(cr, a.rings);
    cairo_set_fill_rule(cr, CAIRO_FILL_RULE_EVEN_ODD);
    if (project.relief.water_shade) {
      // Nearly opaque: water keeps its own colour over any tint (a lake on low green ground
      // must not mix into the land's colour); its outline still holds it apart.
      set_rgba(cr, *project.relief.water_shade, 0.9);
      cairo_fill_preserve(cr);
    }
    set_rgba(cr, kWater);
    cairo_set_line_width(cr, 0.45 * f);
    cairo_stroke(cr);
  }
  if (!data.water_lines.empty()) {
    path_lines(cr, data.water_lines);
    set_rgba(cr, kWater);
    cairo_set_line_width(cr, 0.8 * f);
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_ROUND);
    cairo_stroke(cr);
  }
}

// Road classes, strongest last so they lie on top: minor, secondary, main. Widths in mm at
// ARCH E, scaled with the type; each a white casing under its colour.
struct RoadLook {
  const char* kind;
  double width, casing;
  Colour colour;
};
constexpr RoadLook kMinorRoad{"", 0.9, 1.8, {0.33, 0.31, 0.30, 1}};
constexpr RoadLook kRoadLooks[] = {{"secondary", 1.5, 2.6, {0.78, 0.42, 0.12, 1}},
                                   {"main", 2.1, 3.3, {0.66, 0.16, 0.12, 1}}};

const RoadLook& look_of(const std::string& kind) {
  for (const RoadLook& l : kRoadLooks)
    if (kind == l.kind) return l;
  return kMinorRoad;
}

void draw_roads(cairo_t* cr, const OverlayData& data, double f) {
  auto draw_class = [&](const RoadLook& look) {
    std::vector<Polyline> lines;
    for (const NamedLine& r : data.road_lines)
      if (&look_of(r.kind) == &look) lines.push_back(r.line);
    if (lines.empty()) return;
    path_lines(cr, lines);
    cairo_set_source_rgba(cr, 1, 1, 1, 0.9);
    cairo_set_line_width(cr, look.casing * f);
    cairo_set_line_cap(cr, CAIRO_LINE_CAP_ROUND);
    cairo_stroke_preserve(cr);
    set_rgba(cr, look.colour);
    cairo_set_line_width(cr, look.width * f);
    cairo_stroke(cr);
  };
  draw_class(kMinorRoad);
  for (const RoadLook& l : kRoadLooks) draw_class(l);
}

// The longest piece of each name (pieces of one river or road share it), page mm.
std::vector<const NamedLine*> longest_per_name(const std::vector<NamedLine>& lines) {
  std::vector<const NamedLine*> out;
  auto len = [](const Polyline& l) {
    double s = 0;
    for (std::size_t i = 1; i < l.size(); ++i) s += length(l[i] - l[i - 1]);
    return s;
  };
  for (const NamedLine& l : lines) {
    if (l.name.empty()) continue;
    auto it =
        std::find_if(out.begin(), out.end(), [&](const NamedLine* o) { return o->name == l.name; });
    if (it == out.end()) {
      out.push_back(&l);
    } else if (len(l.line) > len((*it)->line)) {
      *it = &l;
    }
  }
  return out;
}

// The point half-way along a line and the direction of its segment there.
std::pair<Point, Point> middle_of(const Polyline& l) {
  double total = 0;
  for (std::size_t i = 1; i < l.size(); ++i) total += length(l[i] - l[i - 1]);
  double run = 0;
  for (std::size_t i = 1; i < l.size(); ++i) {
    const double s = length(l[i] - l[i - 1]);
    if (s > 0 && run + s >= total / 2) {
      const double u = (total / 2 - run) / s;
      return {l[i - 1] + (l[i] - l[i - 1]) * u, (l[i] - l[i - 1]) * (1 / s)};
    }
    run += s;
  }
  return {l.empty() ? Point{} : l.front(), {1, 0}};
}

const Colour kWaterText{0.05, 0.30, 0.58, 1};

// River names along their line (upright), lake names inside the lake, road numbers boxed at
// the middle of their longest piece. Each is placed only where it is free in `index`.
void draw_names(cairo_t* cr, const OverlayData& data, const Box& map, text::CollisionIndex& index,
                const TypeScale& type, text::FontCache& fonts) {
  const double f = type.factor;
  const text::FontKey italic{"DejaVu Sans", 400, true};
  text::TextPaint water_paint;
  water_paint.colour = kWaterText;
  water_paint.halo = true;
  water_paint.halo_width_mm = 0.5 * f;
  for (const NamedLine* w : longest_per_name(data.named_waters)) {
    text::ShapedText t = text::shape(fonts, italic, type.fine_pt, w->name);
    auto [mid, dir] = middle_of(w->line);
    if (dir.x < 0) dir = dir * -1;  // keep the text upright
    const double angle = std::atan2(dir.y, dir.x);
    const Point n{-dir.y, dir.x};
    const double gap = 1.2 * f;  // beside the line, not on it
    const Point origin = mid - dir * (t.width_mm / 2) - n * gap;
    const text::Quad q =
        text::rotated_box(origin - n * t.ascent_mm, t.width_mm, t.height_mm(), angle);
    if (!map.contains(origin) || !index.is_free(q)) continue;
    index.insert(q);
    text::draw_text(cr, t, origin, angle, water_paint);
  }
  for (const NamedArea& lake : data.named_lakes) {
    if (lake.area.rings.empty()) continue;
    Box b;
    for (const Point& p : lake.area.rings.front()) b.add(p);
    text::ShapedText t = text::shape(fonts, italic, type.body_pt, lake.name);
    if (t.width_mm > b.width() * 1.3) continue;  // too small a lake for its name
    const Point c = b.centre();
    const Point origin{c.x - t.width_mm / 2, c.y + t.ascent_mm / 2};
    const Box tb = Box::of(origin.x, origin.y - t.ascent_mm, origin.x + t.width_mm,
                           origin.y - t.ascent_mm + t.height_mm());
    if (!map.contains(c) || !index.is_free(text::box_quad(tb))) continue;
    index.insert(text::box_quad(tb));
    text::draw_text(cr, t, origin, 0, water_paint);
  }
  text::TextPaint number_paint;
  number_paint.colour = {1, 1, 1, 1};
  const double pad = 0.3 * type.fine_pt * kMmPerPt;
  for (const NamedLine* r : longest_per_name(data.road_lines)) {
    text::ShapedText t = text::shape(fonts, detail::bold(), type.fine_pt, r->name);
    const Point mid = middle_of(r->line).first;
    const Box box = Box::of(mid.x - t.width_mm / 2 - pad, mid.y - t.height_mm() / 2 - pad,
                            mid.x + t.width_mm / 2 + pad, mid.y + t.height_mm() / 2 + pad);
    if (!map.contains(mid) || !index.is_free(text::box_quad(box))) continue;
    index.insert(text::box_quad(box));
    cairo_rectangle(cr, box.min_x, box.min_y, box.width(), box.height());
    set_rgba(cr, look_of(r->kind).colour);
    cairo_fill_preserve(cr);
    cairo_set_source_rgb(cr, 1, 1, 1);
    cairo_set_line_width(cr, 0.35 * f);
    cairo_stroke(cr);
    text::draw_text(cr, t, {box.min_x + pad, box.min_y + pad + t.ascent_mm}, 0, number_paint);
  }
}

void draw_veil(cairo_t* cr, const ExhibitProject& project, const OverlayData& data) {
  if (!(project.dim_outside > 0)) return;
  cairo_set_fill_rule(cr, CAIRO_FILL_RULE_EVEN_ODD);
  for (const PageArea& a : data.veil) path_rings(cr, a.rings);
  cairo_set_source_rgba(cr, 1, 1, 1, project.dim_outside);
  cairo_fill(cr);
}

void draw_areas(cairo_t* cr, const ExhibitProject& project, const OverlayData& data, double f) {
  for (std::size_t i = 0; i < data.areas.size(); ++i) {
    const AreaOverlay& style = project.areas[i];
    cairo_new_path(cr);
    for (const PageArea& a : data.areas[i]) path_rings(cr, a.rings);
    cairo_set_dash(cr, nullptr, 0, 0);
    cairo_set_source_rgba(cr, 1, 1, 1, 0.85);  // casing: the outline holds on dark relief
    cairo_set_line_width(cr, style.width_mm + 1.2 * f);
    cairo_stroke_preserve(cr);
    if (!style.dash_mm.empty()) {
      cairo_set_dash(cr, style.dash_mm.data(), static_cast<int>(style.dash_mm.size()), 0);
    }
    set_rgba(cr, style.colour);
    cairo_set_line_width(cr, style.width_mm);
    cairo_stroke(cr);
    cairo_set_dash(cr, nullptr, 0, 0);
  }
}

}  // namespace

CalloutReport draw_overlay_groups(const OverlayTarget& target, const ExhibitProject& project,
                                  const MapFrame& frame, const OverlayData& data,
                                  const TypeScale& type, text::FontCache& fonts) {
  const double f = type.factor;
  const Box map = frame.page_box_mm();
  CalloutReport rep;
  auto group = [&](const char* name, auto&& body) {
    cairo_t* cr = target.begin(name);
    cairo_save(cr);
    clip_to_map(cr, map);
    body(cr);
    cairo_restore(cr);
    target.end();
  };
  group("water", [&](cairo_t* cr) { draw_water(cr, project, data, f); });
  group("roads", [&](cairo_t* cr) { draw_roads(cr, data, f); });
  group("veil", [&](cairo_t* cr) { draw_veil(cr, project, data); });
  group("areas", [&](cairo_t* cr) { draw_areas(cr, project, data, f); });
  // Callouts first in the one collision index (they are what the hearing is about), then the
  // names of rivers, lakes and roads where they are free of them and of each other.
  text::CollisionIndex labels(map.expanded(1), 20 * type.factor);
  labels.set_bounds(map);
  group("places", [&](cairo_t* cr) { rep = draw_callouts(cr, data.places, labels, type, fonts); });
  group("names", [&](cairo_t* cr) { draw_names(cr, data, map, labels, type, fonts); });
  return rep;
}

CalloutReport draw_overlays(cairo_t* cr, const ExhibitProject& project, const MapFrame& frame,
                            const OverlayData& data, const TypeScale& type,
                            text::FontCache& fonts) {
  OverlayTarget one{[cr](const char*) { return cr; }, [] {}};
  return draw_overlay_groups(one, project, frame, data, type, fonts);
}

}  // namespace sheetmill::exhibit
