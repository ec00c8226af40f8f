// Label styles: text template, type, halo and placement.
#include "sheetmill/core/units.hpp"
#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

// "{name} {elevation_m} m": braces must pair and hold a field name.
void check_template(const ConfigNode& n) {
  const std::string t = n.as_string();
  for (std::size_t i = 0; i < t.size(); ++i) {
    if (t[i] == '}') n.fail("expected a text template such as \"{name}\": '}' without '{'");
    if (t[i] != '{') continue;
    std::size_t close = t.find('}', i);
    if (close == std::string::npos) {
      n.fail("expected a text template such as \"{name}\": '{' without '}'");
    }
    if (close == i + 1 || t.find('{', i + 1) < close) {
      n.fail("expected a text template such as \"{name}\": a field name inside each {}");
    }
    i = close;
  }
  if (t.empty()) n.fail_expected("a text template such as \"{name}\"");
  // Plain text without fields is allowed (fixed captions).
}

double read_em(const ConfigNode& n) {
  std::string s = n.is_scalar() ? n.as_string() : "";
  std::optional<double> v;
  if (s.size() > 2 && s.compare(s.size() - 2, 2, "em") == 0)
    v = parse_number(s.substr(0, s.size() - 2));
  if (!v || *v < -0.5 || *v > 5) n.fail_expected("a letter spacing in ems such as 0.1em");
  return *v;
}

}  // namespace

FontSpec Reader::font(const ConfigNode& n, FontSpec f) const {
  if (auto fam = n.find("font")) {
    f.family = fam->as_string();
    if (f.family.empty()) fam->fail_expected("a font family name such as DejaVu Sans");
  }
  if (auto w = n.find("weight")) {
    std::string s = w->as_string();
    if (s == "normal") {
      f.weight = 400;
    } else if (s == "bold") {
      f.weight = 700;
    } else {
      auto v = parse_number(s);
      if (!v || *v < 100 || *v > 900 || static_cast<int>(*v) % 100 != 0) {
        w->fail_expected("normal, bold or a weight from 100 to 900 in hundreds");
      }
      f.weight = static_cast<int>(*v);
    }
  }
  if (auto sl = n.find("slant")) f.italic = sl->as_choice({"upright", "italic"}) == "italic";
  return f;
}

LabelStyle Reader::label(const ConfigNode& n, LabelStyle l,
                         const std::vector<std::string>& extra_keys) const {
  if (!n.is_map()) n.fail_expected("a label style (a mapping)");
  std::vector<std::string> keys = {
      "text",      "font",           "weight",   "slant",    "size",         "colour",
      "halo",      "letter_spacing", "place",    "priority", "repeat_every", "gap",
      "droppable", "spread",         "capitals", "based_on", "decimals"};
  keys.insert(keys.end(), extra_keys.begin(), extra_keys.end());
  n.expect_keys(keys);
  if (auto b = n.find("based_on")) {
    std::string name = b->as_string();
    auto it = label_styles_.find(name);
    if (it == label_styles_.end()) {
      std::vector<std::string> names;
      for (const auto& kv : label_styles_) names.push_back(kv.first);
      std::string near = config::closest_word(name, names);
      b->fail("expected the name of a label style defined above in label_styles, got \"" + name +
              "\"" + (near.empty() ? "" : "; did you mean '" + near + "'?"));
    }
    l = it->second;
  }
  if (auto t = n.find("text")) {
    check_template(*t);
    l.text_template = t->as_string();
  }
  l.font = font(n, l.font);
  if (auto s = n.find("size")) {
    l.size_pt = s->as_length_mm() * kPtPerMm;
    if (!(l.size_pt >= 2 && l.size_pt <= 200)) s->fail_expected("a type size from 2pt to 200pt");
  }
  if (auto c = n.find("colour")) l.colour = colour(*c);
  if (auto h = n.find("halo")) {
    if (h->is_scalar() && (h->as_string() == "none" || h->as_string() == "false")) {
      l.halo.reset();
    } else {
      if (!h->is_map()) h->fail_expected("a halo (colour, width) or none");
      h->expect_keys({"colour", "width"});
      Halo halo = l.halo.value_or(Halo{});
      if (auto c = h->find("colour")) halo.colour = colour(*c);
      if (auto w = h->find("width")) {
        halo.width_mm = w->as_length_mm();
        if (!(halo.width_mm > 0)) w->fail_expected("a positive length such as 0.3mm");
      }
      l.halo = halo;
    }
  }
  if (auto s = n.find("letter_spacing")) l.letter_spacing_em = read_em(*s);
  if (auto p = n.find("place")) {
    std::string v = p->as_choice({"beside", "along", "inside"});
    l.placement = v == "beside"  ? LabelPlacement::point
                  : v == "along" ? LabelPlacement::line
                                 : LabelPlacement::area;
  }
  if (auto p = n.find("priority")) {
    l.priority = p->as_int();
    if (l.priority < 0 || l.priority > 100) p->fail_expected("a priority from 0 to 100");
  }
  if (auto r = n.find("repeat_every")) {
    l.repeat_mm = r->as_length_mm();
    if (l.repeat_mm != 0) l.repeat_mm = r->as_spacing_mm();  // 0: once per feature
  }
  if (auto g = n.find("gap")) l.offset_mm = g->as_length_mm();
  if (auto d = n.find("droppable")) l.may_drop = d->as_bool();
  if (auto s = n.find("spread")) l.spread_in_area = s->as_bool();
  if (auto c = n.find("capitals")) l.upper_case = c->as_bool();
  if (auto d = n.find("decimals")) {
    if (!d->is_map())
      d->fail_expected("a mapping of field names to decimals, such as {elevation_m: 0}");
    for (const auto& [field, places] : d->entries()) {
      const int v = places.as_int();
      if (v < 0 || v > 6) places.fail_expected("a number of decimals from 0 to 6");
      if (l.text_template.find("{" + field + "}") == std::string::npos)
        places.fail("expected a field of this label's text \"" + l.text_template + "\", got \"" +
                    field + "\"");
      l.decimals[field] = v;
    }
  }
  return l;
}

void Reader::read_label_styles(const ConfigNode& n) {
  for (const auto& [name, node] : n.entries()) label_styles_[name] = label(node);
}

}  // namespace sheetmill::style::detail
