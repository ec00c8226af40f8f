#include "sheetmill/render/feature_layers.hpp"

#include <algorithm>
#include <cmath>
#include <map>
#include <optional>
#include <set>

#include "render/line_chains.hpp"
#include "render/line_displacement.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/plural.hpp"
#include "sheetmill/draw/area.hpp"
#include "sheetmill/draw/line.hpp"
#include "sheetmill/draw/point.hpp"
#include "sheetmill/features/reader.hpp"
#include "sheetmill/features/simplify.hpp"
#include "sheetmill/labels/names.hpp"
#include "sheetmill/text/shaping.hpp"

namespace sheetmill::render {

namespace {

// Field names a layer needs: rule filters, rotation fields, label templates.
std::vector<std::string> fields_of(const style::Layer& layer) {
  std::vector<std::string> out;
  auto add = [&](const std::string& f) {
    if (!f.empty() && std::find(out.begin(), out.end(), f) == out.end()) out.push_back(f);
  };
  auto add_label = [&](const std::optional<style::LabelStyle>& l) {
    if (l)
      for (const auto& f : labels::template_fields(l->text_template)) add(f);
  };
  for (const auto& r : layer.rules) {
    add(r.filter.field);
    if (r.point) add(r.point->rotation_field);
    add_label(r.label);
  }
  add_label(layer.label);
  return out;
}

Polyline to_page(const Polyline& ground, const MapFrame& frame) {
  Polyline out;
  out.reserve(ground.size());
  for (const Point& p : ground) out.push_back(frame.to_page(p));
  return out;
}

// Footprint of a stroked line as one rotated box per segment (page mm).
void line_obstacles(const Polyline& l, double half_width_mm, std::vector<text::Quad>& out) {
  for (std::size_t i = 0; i + 1 < l.size(); ++i) {
    Point d = l[i + 1] - l[i];
    double len = length(d);
    if (len <= 0) continue;
    double a = std::atan2(d.y, d.x);
    Point n{-d.y / len, d.x / len};  // towards +y of the segment's frame (its "down")
    out.push_back(text::rotated_box(l[i] + n * half_width_mm, len, 2 * half_width_mm, a));
  }
}

// Footprint of an area symbol of an obstacle layer (page mm). Its outline always blocks labels;
// a small area (a building: both sides of its box under kSmallAreaMm) blocks its whole box, since
// for such shapes the box is close to the area itself. A large obstacle area blocks only along its
// edge, so a name may still sit inside a wood or a lake whose layer is marked as an obstacle.
constexpr double kSmallAreaMm = 10.0;
void area_obstacles(const std::vector<Polyline>& rings, std::vector<text::Quad>& out) {
  if (rings.empty() || rings.front().size() < 3) return;
  Box box;
  for (const Point& p : rings.front()) box.add(p);
  if (box.width() <= kSmallAreaMm && box.height() <= kSmallAreaMm) {
    out.push_back(text::box_quad(box));
    return;
  }
  for (const Polyline& r : rings) {
    Polyline closed = r;
    closed.push_back(closed.front());
    line_obstacles(closed, 0.1, out);
  }
}

// Names along lines wait until every layer is read and displaced: pieces of one named line are
// chained end to end first, so a name can run along the whole road rather than one short
// segment, and along where the road is drawn.
struct PendingPiece {
  std::optional<LineRef> drawn;  // the piece as drawn (after displacement), else `own`
  Polyline own;
};
using PendingNames =
    std::map<std::pair<const style::LabelStyle*, std::string>, std::vector<PendingPiece>>;

void clip_to(cairo_t* cr, const std::vector<Point>& ring) {
  if (ring.size() < 3) return;
  cairo_new_path(cr);
  cairo_move_to(cr, ring[0].x, ring[0].y);
  for (std::size_t i = 1; i < ring.size(); ++i) cairo_line_to(cr, ring[i].x, ring[i].y);
  cairo_close_path(cr);
  cairo_clip(cr);
}

}  // namespace

bool layer_visible(const style::Layer& layer, double n) {
  return (layer.min_scale <= 0 || layer.min_scale <= n) &&
         (layer.max_scale <= 0 || n <= layer.max_scale);
}

FeatureLayersResult prepare_feature_layers(const project::Project& project,
                                           const style::Style& style, const MapFrame& frame,
                                           text::FontCache& fonts, PreparedLayers& out) {
  FeatureLayersResult result;
  out.layers.clear();
  out.clip_page_mm.clear();
  if (frame.neatline.size() >= 3) {
    for (const Point& p : frame.neatline) out.clip_page_mm.push_back(frame.to_page(p));
  } else {
    const Box b = frame.page_box_mm();
    out.clip_page_mm = {
        {b.min_x, b.min_y}, {b.max_x, b.min_y}, {b.max_x, b.max_y}, {b.min_x, b.max_y}};
  }
  const Box clip_ground = frame.ground.expanded(kClipMarginMm * frame.metres_per_mm());
  const double ground_tol = kSimplifyMm * frame.metres_per_mm();
  // Water surfaces for contour clipping: layers flagged water_surface; a style flagging none
  // falls back to area layers in the "water" group.
  const bool any_water_flag = std::any_of(style.layers.begin(), style.layers.end(),
                                          [](const style::Layer& l) { return l.water_surface; });

  std::vector<std::vector<LineRef>> line_refs;  // per prepared layer
  std::vector<PendingNames> line_names;         // per prepared layer
  for (const style::Layer& layer : style.layers) {
    if (!layer_visible(layer, frame.scale_denominator)) continue;
    LayerReport report;
    report.layer = layer.id;
    PreparedLayer prepared;
    prepared.layer = &layer;
    prepared.group = layer.group.empty() ? layer.id : layer.group;
    prepared.rules.resize(layer.rules.size());
    for (std::size_t i = 0; i < layer.rules.size(); ++i) prepared.rules[i].rule = &layer.rules[i];

    // The project's own sources first, else the layer of that name in its vector_data.
    if (project.sources.find(layer.source) == project.sources.end() &&
        project.vector_data.empty()) {
      log::warn("layer '{}': the project maps no source '{}'; layer not drawn", layer.id,
                layer.source);
      result.reports.push_back(report);
      continue;
    }
    const project::Source source = project::source_for(project, layer.source);
    const project::Source* src = &source;
    const bool is_water = any_water_flag ? layer.water_surface : layer.group == "water";
    const std::vector<std::string> fields = fields_of(layer);
    auto field_index = [&](const std::string& f) -> std::size_t {
      return static_cast<std::size_t>(std::find(fields.begin(), fields.end(), f) - fields.begin());
    };
    std::vector<std::size_t> filter_field(layer.rules.size());
    for (std::size_t i = 0; i < layer.rules.size(); ++i)
      filter_field[i] = field_index(layer.rules[i].filter.field);

    std::vector<LineRef> refs;
    PendingNames pending_line_names;
    features::ReadRequest request{frame.crs_wkt, clip_ground, fields};
    auto sink = [&](const features::Feature& f) {
      std::size_t ri = 0;
      for (; ri < layer.rules.size(); ++ri)
        if (style::matches(layer.rules[ri].filter, f.value(filter_field[ri]))) break;
      if (ri == layer.rules.size()) return;  // no rule: not drawn
      const style::Rule& rule = layer.rules[ri];
      PreparedRule& pr = prepared.rules[ri];
      ++pr.features;
      ++report.features;
      const style::LabelStyle* label = rule.label    ? &*rule.label
                                       : layer.label ? &*layer.label
                                                     : nullptr;
      std::string name;
      if (label) {
        name = labels::label_text(*label,
                                  [&](const std::string& k) { return f.value(field_index(k)); });
      }

      for (const Point& g : f.points) {
        Point p = frame.to_page(g);
        double r = 0;
        if (rule.point) {
          double rot = draw::symbol_rotation_deg(*rule.point,
                                                 f.value(field_index(rule.point->rotation_field)));
          pr.points.push_back({p, rot});
          r = draw::point_symbol_radius_mm(*rule.point);
          if (layer.obstacle && r > 0)
            result.obstacles.push_back(text::box_quad(Box::of(p.x - r, p.y - r, p.x + r, p.y + r)));
        }
        if (!name.empty())
          if (auto c = labels::point_name(fonts, *label, name, p, r, layer.id))
            result.name_candidates.push_back(std::move(*c));
      }
      for (const Polyline& g : f.lines) {
        Polyline l = to_page(g, frame);
        features::simplify_polyline(l, kSimplifyMm);
        std::optional<LineRef> drawn;
        if (rule.line) drawn = LineRef{ri, pr.lines.size()};
        if (!name.empty()) {
          if (label->placement == style::LabelPlacement::point) {
            if (auto c = labels::point_name(fonts, *label, name, l[l.size() / 2], 0, layer.id))
              result.name_candidates.push_back(std::move(*c));
          } else {
            pending_line_names[{label, name}].push_back({drawn, drawn ? Polyline{} : l});
          }
        }
        if (drawn) {
          refs.push_back(*drawn);
          pr.lines.push_back(std::move(l));
        }
      }
      for (const features::Polygon& g : f.polygons) {
        std::vector<Polyline> rings;
        rings.push_back(to_page(g.outer, frame));
        for (const Polyline& h : g.holes) rings.push_back(to_page(h, frame));
        for (Polyline& r : rings) features::simplify_ring(r, kSimplifyMm);
        if (is_water) {
          std::vector<Polyline> w{g.outer};
          w.insert(w.end(), g.holes.begin(), g.holes.end());
          for (Polyline& r : w) features::simplify_ring(r, ground_tol);
          result.water_polygons_ground.push_back(std::move(w));
        }
        if (!name.empty()) {
          if (label->placement == style::LabelPlacement::area) {
            if (auto c = labels::area_name(fonts, *label, name, rings, layer.id))
              result.name_candidates.push_back(std::move(*c));
          } else {
            auto pole = labels::pole_of_inaccessibility(rings, 0.5);
            if (auto c = labels::point_name(fonts, *label, name, pole.at, 0, layer.id))
              result.name_candidates.push_back(std::move(*c));
          }
        }
        if (layer.obstacle && (rule.area || rule.line)) area_obstacles(rings, result.obstacles);
        if (rule.line && !rule.area) {
          for (const Polyline& r : rings) {
            Polyline closed = r;
            if (!closed.empty()) closed.push_back(closed.front());
            pr.lines.push_back(std::move(closed));
          }
        }
        if (rule.point) {
          auto pole = labels::pole_of_inaccessibility(rings, 0.5);
          pr.points.push_back({pole.at, rule.point->rotation_deg});
        }
        if (rule.area) pr.areas.push_back(std::move(rings));
      }
    };
    features::read_features(*src, request, sink);
    line_refs.push_back(std::move(refs));
    line_names.push_back(std::move(pending_line_names));
    log::debug("layer '{}': {}", layer.id, counted(report.features, "feature"));

    for (const PreparedRule& pr : prepared.rules)
      if (pr.features > 0 && !pr.rule->legend.empty()) result.legend_rules.push_back(pr.rule);
    result.reports.push_back(report);
    out.layers.push_back(std::move(prepared));
  }

  // Every layer read: lines that run together give way, then what depends on where lines are
  // drawn: the footprints that labels avoid, and the names along the lines.
  displace_layers(out, line_refs, frame);
  for (std::size_t li = 0; li < out.layers.size(); ++li) {
    const PreparedLayer& prepared = out.layers[li];
    if (prepared.layer->obstacle)
      for (const LineRef& r : line_refs[li]) {
        const PreparedRule& pr = prepared.rules[r.rule];
        line_obstacles(pr.lines[r.line], symbol_half_width_mm(*pr.rule->line), result.obstacles);
      }
    for (auto& [key, pieces] : line_names[li]) {
      std::vector<Polyline> lines;
      for (PendingPiece& p : pieces)
        lines.push_back(p.drawn ? prepared.rules[p.drawn->rule].lines[p.drawn->line]
                                : std::move(p.own));
      for (const Polyline& chain : chain_lines(std::move(lines)))
        for (auto& c : labels::line_names(fonts, *key.first, key.second, chain, prepared.layer->id))
          result.name_candidates.push_back(std::move(c));
    }
  }
  return result;
}

void draw_prepared_layer(cairo_t* cr, const PreparedLayer& layer,
                         const std::vector<Point>& clip_page_mm) {
  cairo_save(cr);
  clip_to(cr, clip_page_mm);
  for (const PreparedRule& pr : layer.rules)
    if (pr.rule->area)
      for (const auto& rings : pr.areas) draw::draw_area(cr, rings, *pr.rule->area);
  // Passes run across all rules of the layer, so casings of every class lie under every fill.
  std::set<int> passes;
  for (const PreparedRule& pr : layer.rules)
    if (pr.rule->line && !pr.lines.empty())
      for (int p : draw::passes_of(*pr.rule->line)) passes.insert(p);
  for (int pass : passes)
    for (const PreparedRule& pr : layer.rules)
      if (pr.rule->line && !pr.lines.empty())
        draw::draw_line_pass(cr, pr.lines, *pr.rule->line, pass);
  for (const PreparedRule& pr : layer.rules)
    if (pr.rule->point)
      for (const PreparedPoint& p : pr.points)
        draw::draw_point_symbol(cr, p.at_mm, *pr.rule->point, p.rotation_deg);
  cairo_restore(cr);
}

void draw_feature_layer(pdf::LayeredCanvas& canvas, const PreparedLayer& layer,
                        const std::vector<Point>& clip_page_mm) {
  cairo_t* cr = canvas.begin_group(layer.group);
  draw_prepared_layer(cr, layer, clip_page_mm);
  canvas.end_group();
}

void draw_feature_layers(pdf::LayeredCanvas& canvas, const PreparedLayers& prepared,
                         const style::Style&) {
  for (const PreparedLayer& layer : prepared.layers)
    draw_feature_layer(canvas, layer, prepared.clip_page_mm);
}

}  // namespace sheetmill::render
