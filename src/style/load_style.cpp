// load_style(): the top of a style file, its layers and their rules.
#include <algorithm>
#include <map>

#include "sheetmill/core/scale_text.hpp"
#include "sheetmill/style/default_order.hpp"
#include "style/reader.hpp"

namespace sheetmill::style {

namespace {

using config::ConfigNode;
using detail::Reader;

// "1:25000" or 25000; "any" for an open end (0).
double read_scale(const ConfigNode& n) {
  if (n.as_string() == "any") return 0;
  auto v = parse_scale_denominator(n.as_string());
  if (!v) n.fail_expected(std::string(kScaleExpected) + ", or any");
  return *v;
}

void read_scales(const ConfigNode& n, Layer& layer) {
  auto ends = n.items();
  if (ends.size() != 2) n.fail_expected("two scales [largest, smallest] such as [1:5000, 1:50000]");
  layer.min_scale = read_scale(ends[0]);
  layer.max_scale = read_scale(ends[1]);
  if (layer.min_scale > 0 && layer.max_scale > 0 && layer.min_scale > layer.max_scale) {
    n.fail("expected the larger scale first (1:5000 before 1:50000)");
  }
}

// displacement: { priority: 50, max_shift: 2mm }
Displacement read_displacement(const ConfigNode& n) {
  if (!n.is_map()) n.fail_expected("a mapping with priority and max_shift");
  n.expect_keys({"priority", "max_shift"});
  Displacement d;
  if (auto p = n.find("priority")) d.priority = p->as_int();
  if (auto m = n.find("max_shift")) {
    d.max_shift_mm = m->as_length_mm();
    if (!(d.max_shift_mm >= 0 && d.max_shift_mm <= 10))
      m->fail_expected("a shift from 0mm to 10mm on paper");
  }
  return d;
}

// The symbol keys a rule and a one-rule layer share.
void read_symbols(const ConfigNode& n, Reader& r, Rule& rule) {
  if (auto l = n.find("line")) rule.line = r.line(*l);
  if (auto a = n.find("area")) rule.area = r.area(*a);
  if (auto p = n.find("point")) rule.point = r.point(*p);
  if (auto g = n.find("legend")) rule.legend = g->as_string();
}

Rule read_rule(const ConfigNode& n, Reader& r, const Layer& layer) {
  if (!n.is_map()) n.fail_expected("a rule (a mapping)");
  n.expect_keys({"name", "when", "legend", "line", "area", "point", "label"});
  Rule rule;
  if (auto nm = n.find("name")) rule.name = nm->as_string();
  if (auto w = n.find("when")) rule.filter = detail::read_filter(*w);
  read_symbols(n, r, rule);
  if (auto l = n.find("label")) {
    rule.label = r.label(*l, layer.label.value_or(LabelStyle{}));
    if (rule.label->text_template.empty()) l->fail("missing required key 'text'");
  }
  if (!rule.line && !rule.area && !rule.point && !rule.label) {
    n.fail("empty rule: expected line, area, point or label");
  }
  return rule;
}

Layer read_layer(const ConfigNode& n, Reader& r) {
  if (!n.is_map()) n.fail_expected("a layer (a mapping with id and source)");
  n.expect_keys({"id", "source", "group", "order", "show_between", "blocks_labels", "water_surface",
                 "label", "rules", "legend", "line", "area", "point", "displacement"});
  Layer layer;
  layer.id = n.at("id").as_string();
  if (layer.id.empty()) n.at("id").fail_expected("a layer id");
  layer.source = n.at("source").as_string();
  if (auto g = n.find("group")) layer.group = g->as_string();
  if (auto o = n.find("order")) layer.order = o->as_int();
  if (auto s = n.find("show_between")) read_scales(*s, layer);
  if (auto b = n.find("blocks_labels")) layer.obstacle = b->as_bool();
  if (auto w = n.find("water_surface")) layer.water_surface = w->as_bool();
  if (auto d = n.find("displacement")) layer.displacement = read_displacement(*d);
  if (auto l = n.find("label")) {
    layer.label = r.label(*l);
    if (layer.label->text_template.empty()) l->fail("missing required key 'text'");
  }
  bool direct = n.has("line") || n.has("area") || n.has("point") || n.has("legend");
  if (auto rules = n.find("rules")) {
    if (direct) n.fail("give either rules or one symbol (line, area, point, legend), not both");
    for (const auto& item : rules->items()) {
      layer.rules.push_back(read_rule(item, r, layer));
      // Unnamed rules are named after their place, for the log: "roads.rules[2]".
      if (layer.rules.back().name.empty()) {
        layer.rules.back().name =
            layer.id + ".rules[" + std::to_string(layer.rules.size() - 1) + "]";
      }
    }
    if (layer.rules.empty()) rules->fail("expected at least one rule, got an empty list");
  } else if (direct) {
    Rule rule;
    rule.name = layer.id;
    read_symbols(n, r, rule);
    if (!rule.line && !rule.area && !rule.point) n.fail("a legend needs a line, area or point");
    layer.rules.push_back(std::move(rule));
  } else if (layer.label) {
    Rule rule;  // a names-only layer: one rule that draws nothing but the layer's label
    rule.name = layer.id;
    layer.rules.push_back(std::move(rule));
  } else {
    n.fail("expected rules, a symbol (line, area or point) or a label");
  }
  return layer;
}

}  // namespace

namespace {

Style load(const std::filesystem::path& path, const std::optional<std::string>& plate_ink) {
  ConfigNode root = config::load_file(path);
  detail::reject_duplicate_keys(root);
  root.expect_keys({"name", "about", "press", "colours", "symbols", "label_styles", "layers",
                    "relief", "contours", "grid", "sheet"});
  std::optional<ConfigNode> plate;
  if (plate_ink) {
    // Located like the rest: a plate for an ink the style does not name is the style's error.
    plate = ConfigNode(YAML::Node(*plate_ink), std::make_shared<const std::string>(path.string()),
                       "press.inks");
  }
  Reader r(root.find("colours"), root.find("symbols"), root.find("press"), plate);
  if (auto ls = root.find("label_styles")) r.read_label_styles(*ls);
  Style s;
  s.file = path;
  s.name = root.get_or<std::string>("name", path.stem().string());
  s.palette = r.palette();
  r.check_all_symbols();

  std::map<std::string, int> seen_ids;  // id -> line of first use
  bool numbered = false;                // some layer states its order
  if (auto layers = root.find("layers")) {
    for (const auto& item : layers->items()) {
      numbered = numbered || (item.is_map() && item.has("order"));
      Layer layer = read_layer(item, r);
      int line = item.at("id").location().line;
      auto [it, fresh] = seen_ids.emplace(layer.id, line);
      if (!fresh) {
        item.at("id").fail("duplicate layer id '" + layer.id + "' (first used on line " +
                           std::to_string(it->second) + ")");
      }
      s.layers.push_back(std::move(layer));
    }
  }
  // A style that numbers none of its layers gets the usual stack by layer kind; one that numbers
  // some keeps 0 for the others (docs/style.md, layers).
  if (!numbered)
    for (Layer& layer : s.layers) layer.order = default_layer_order(layer);
  std::stable_sort(s.layers.begin(), s.layers.end(),
                   [](const Layer& a, const Layer& b) { return a.order < b.order; });

  s.relief = detail::default_relief();
  s.contours = detail::default_contours(r);
  s.grid = detail::default_grid(r);
  s.furniture = detail::default_furniture(r);
  if (auto n = root.find("relief")) s.relief = detail::read_relief(*n, r, s.relief);
  if (auto n = root.find("contours")) s.contours = detail::read_contours(*n, r, s.contours);
  if (auto n = root.find("grid")) s.grid = detail::read_grid(*n, r, s.grid);
  if (auto n = root.find("sheet")) s.furniture = detail::read_furniture(*n, r, s.furniture);
  s.press = r.press();
  if (s.press.plate >= 0) {
    // Relief shading lies on one plate; hypsometric tints are not separated into inks.
    s.relief.tint = false;
    s.relief.water_shade.reset();
    if (s.press.plate != s.press.relief_ink) s.relief.hillshade = false;
  }
  return s;
}

}  // namespace

Style load_style(const std::filesystem::path& path) {
  return load(path, std::nullopt);
}

Style load_style(const std::filesystem::path& path, const std::string& plate_ink) {
  return load(path, plate_ink);
}

}  // namespace sheetmill::style
