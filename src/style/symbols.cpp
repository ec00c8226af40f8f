// Line, area and point symbols, inline or by name from the `symbols` section.
#include <cctype>

#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

std::vector<std::string> with_stroke_keys(std::vector<std::string> own) {
  const auto& s = Reader::stroke_keys();
  own.insert(own.end(), s.begin(), s.end());
  return own;
}

bool has_any(const ConfigNode& n, const std::vector<std::string>& keys) {
  for (const auto& k : keys) {
    if (n.has(k)) return true;
  }
  return false;
}

double positive_length(const ConfigNode& n) {
  double v = n.as_length_mm();
  if (!(v > 0)) n.fail_expected("a positive length such as 1.5mm");
  return v;
}

// Path data in millimetres around the anchor, the grammar the draw stage reads: commands
// M L H V C Z (lower case: relative), numbers separated by spaces or commas, a command's numbers
// may repeat (after M, repeats are line-tos).
void check_path_data(const ConfigNode& n) {
  const std::string d = n.as_string();
  auto bad = [&](const std::string& why) {
    n.fail("expected path data such as \"M -1 0 L 1 0 Z\" (M L H V C Z; numbers in mm): " + why);
  };
  auto numbers_of = [](char c) {
    switch (std::toupper(static_cast<unsigned char>(c))) {
      case 'M':
      case 'L':
        return 2;
      case 'H':
      case 'V':
        return 1;
      case 'C':
        return 6;
      default:
        return 0;
    }
  };
  std::size_t i = 0;
  char cmd = 0;
  int need = 0, group = 0;
  auto skip = [&] {
    while (i < d.size() && (std::isspace(static_cast<unsigned char>(d[i])) || d[i] == ',')) ++i;
  };
  for (skip(); i < d.size(); skip()) {
    char c = d[i];
    if (std::isalpha(static_cast<unsigned char>(c))) {
      if (std::string("MLHVCZmlhvcz").find(c) == std::string::npos) {
        bad(std::string("unknown command '") + c + "'");
      }
      if (cmd == 0 && c != 'M' && c != 'm') bad("it must start with M");
      if (need > 0) bad(std::string("'") + c + "' where a number was expected");
      cmd = c;
      group = numbers_of(c);
      need = group;
      ++i;
      continue;
    }
    std::size_t end = i;
    while (end < d.size() && !std::isspace(static_cast<unsigned char>(d[end])) && d[end] != ',' &&
           !std::isalpha(static_cast<unsigned char>(d[end]))) {
      ++end;
    }
    // An exponent ("1e-3") keeps its letter.
    while (end < d.size() && (d[end] == 'e' || d[end] == 'E') && end + 1 < d.size() &&
           (std::isdigit(static_cast<unsigned char>(d[end + 1])) || d[end + 1] == '-' ||
            d[end + 1] == '+')) {
      end += 2;
      while (end < d.size() && std::isdigit(static_cast<unsigned char>(d[end]))) ++end;
    }
    std::string tok = d.substr(i, end - i);
    if (!parse_number(tok)) bad("'" + tok + "' is neither a command nor a number");
    if (cmd == 0) bad("it must start with M");
    if (group == 0) bad("a number after Z");
    if (need == 0) need = group;  // the command repeats
    --need;
    i = end;
  }
  if (cmd == 0) bad("it is empty");
  if (need > 0) bad("it ends in the middle of a command");
}

}  // namespace

const Reader::Named& Reader::named(const ConfigNode& ref, const char* wanted_kind) {
  std::string name = ref.as_string();
  std::optional<ConfigNode> def = symbols_ ? symbols_->find(name) : std::nullopt;
  if (!def) {
    std::vector<std::string> names;
    if (symbols_) {
      for (const auto& kv : symbols_->entries()) names.push_back(kv.first);
    }
    std::string near = config::closest_word(name, names);
    ref.fail(std::string("expected a ") + wanted_kind +
             " symbol (a mapping) or the name of one in symbols, got \"" + name + "\"" +
             (near.empty() ? "" : "; did you mean '" + near + "'?"));
  }
  if (in_progress_.count(name))
    ref.fail("symbol '" + name + "' refers to itself (directly or through other symbols)");
  return named_entry(name, *def);
}

const Reader::Named& Reader::named_entry(const std::string& name, const ConfigNode& def) {
  auto done = parsed_.find(name);
  if (done != parsed_.end()) return done->second;
  in_progress_.insert(name);
  def.expect_keys({"line", "area", "point"});
  auto kinds = def.entries();
  if (kinds.size() != 1) def.fail("expected exactly one of line, area or point");
  const auto& [kind, body] = kinds.front();
  Named value;
  if (kind == "line") value = line_inline(body);
  if (kind == "area") value = area_inline(body);
  if (kind == "point") value = point_inline(body);
  in_progress_.erase(name);
  return parsed_.emplace(name, std::move(value)).first->second;
}

void Reader::check_all_symbols() {
  if (!symbols_) return;
  for (const auto& [name, def] : symbols_->entries()) named_entry(name, def);
}

template <class T>
static const T& pick(const std::variant<LineSymbol, AreaSymbol, PointSymbol>& v,
                     const ConfigNode& ref, const char* kind) {
  if (!std::holds_alternative<T>(v)) {
    ref.fail("symbol '" + ref.as_string() + "' is not a " + kind + " symbol");
  }
  return std::get<T>(v);
}

LineSymbol Reader::line(const ConfigNode& n) {
  if (n.is_scalar()) return pick<LineSymbol>(named(n, "line"), n, "line");
  return line_inline(n);
}
AreaSymbol Reader::area(const ConfigNode& n) {
  if (n.is_scalar()) return pick<AreaSymbol>(named(n, "area"), n, "area");
  return area_inline(n);
}
PointSymbol Reader::point(const ConfigNode& n) {
  if (n.is_scalar()) return pick<PointSymbol>(named(n, "point"), n, "point");
  return point_inline(n);
}

LineSymbol Reader::line_inline(const ConfigNode& n) {
  if (!n.is_map()) n.fail_expected("a line symbol (a mapping) or the name of one in symbols");
  n.expect_keys(with_stroke_keys({"strokes", "marks"}));
  LineSymbol out;
  bool shorthand = has_any(n, stroke_keys());
  if (auto s = n.find("strokes")) {
    if (shorthand) n.fail("give either strokes or the keys of one stroke, not both");
    for (const auto& item : s->items()) out.strokes.push_back(stroke(item));
    if (out.strokes.empty()) s->fail("expected at least one stroke, got an empty list");
  } else if (shorthand) {
    out.strokes.push_back(stroke_fields(n, {}));
  }
  if (auto m = n.find("marks")) {
    if (m->is_map()) {
      out.marks.push_back(marks(*m));
    } else {
      for (const auto& item : m->items()) out.marks.push_back(marks(item));
    }
  }
  if (out.strokes.empty() && out.marks.empty()) n.fail("expected strokes, marks or a colour");
  return out;
}

LineMarks Reader::marks(const ConfigNode& n) {
  n.expect_keys(with_stroke_keys({"every", "first_at", "length", "side", "symbol"}));
  LineMarks m;
  if (auto e = n.find("every")) m.spacing_mm = e->as_spacing_mm();
  if (auto f = n.find("first_at")) m.start_mm = f->as_length_mm();
  if (auto l = n.find("length")) m.length_mm = positive_length(*l);
  if (auto s = n.find("side")) {
    std::string v = s->as_choice({"left", "right", "both"});
    m.side = v == "left"    ? LineMarks::Side::left
             : v == "right" ? LineMarks::Side::right
                            : LineMarks::Side::both;
  }
  if (auto s = n.find("symbol")) m.symbol = point(*s);
  m.stroke = stroke_fields(n, m.stroke);
  return m;
}

AreaSymbol Reader::area_inline(const ConfigNode& n) {
  if (!n.is_map()) n.fail_expected("an area symbol (a mapping) or the name of one in symbols");
  n.expect_keys({"fill", "outline", "hatching", "pattern"});
  AreaSymbol a;
  if (auto f = n.find("fill")) a.fill = colour(*f);
  if (auto o = n.find("outline")) a.outline = stroke(*o);
  if (auto h = n.find("hatching")) {
    std::vector<ConfigNode> list = h->is_map() ? std::vector<ConfigNode>{*h} : h->items();
    for (const auto& item : list) {
      item.expect_keys(with_stroke_keys({"spacing", "angle"}));
      Hatch hatch;
      if (auto s = item.find("spacing")) hatch.spacing_mm = s->as_spacing_mm();
      if (auto g = item.find("angle")) hatch.angle_deg = g->as_angle_deg();
      hatch.stroke = stroke_fields(item, hatch.stroke);
      a.hatches.push_back(hatch);
    }
  }
  if (auto p = n.find("pattern")) {
    p->expect_keys({"symbol", "spacing", "staggered"});
    PatternFill fill;
    fill.symbol = point(p->at("symbol"));
    if (auto s = p->find("spacing")) {
      if (s->is_sequence()) {
        auto xy = s->items();
        if (xy.size() != 2) s->fail_expected("one length or two [across, down] such as [3mm, 2mm]");
        fill.spacing_x_mm = xy[0].as_spacing_mm();
        fill.spacing_y_mm = xy[1].as_spacing_mm();
      } else {
        fill.spacing_x_mm = fill.spacing_y_mm = s->as_spacing_mm();
      }
    }
    if (auto s = p->find("staggered")) fill.staggered = s->as_bool();
    a.pattern = fill;
  }
  if (!a.fill && !a.outline && a.hatches.empty() && !a.pattern) {
    n.fail("expected at least one of fill, outline, hatching or pattern");
  }
  return a;
}

ShapePart Reader::shape(const ConfigNode& n) const {
  ShapePart p;
  std::string kind = n.at("shape").as_choice({"circle", "square", "triangle", "cross", "path"});
  p.kind = kind == "circle"     ? ShapePart::Kind::circle
           : kind == "square"   ? ShapePart::Kind::square
           : kind == "triangle" ? ShapePart::Kind::triangle
           : kind == "cross"    ? ShapePart::Kind::cross
                                : ShapePart::Kind::path;
  if (auto s = n.find("size")) p.size_mm = positive_length(*s);
  if (auto d = n.find("path")) {
    if (p.kind != ShapePart::Kind::path) d->fail("path data needs shape: path");
    check_path_data(*d);
    p.path_data = d->as_string();
  } else if (p.kind == ShapePart::Kind::path) {
    n.fail("missing required key 'path' for shape: path");
  }
  if (auto o = n.find("offset")) {
    auto xy = o->items();
    if (!o->is_sequence() || xy.size() != 2)
      o->fail_expected("two lengths [x, y] such as [0mm, -1mm]");
    p.offset_mm = {xy[0].as_length_mm(), xy[1].as_length_mm()};
  }
  if (auto f = n.find("fill")) p.fill = colour(*f);
  if (auto o = n.find("outline")) p.outline = stroke(*o);
  if (!p.fill && !p.outline) n.fail("expected a fill or an outline (or both)");
  return p;
}

PointSymbol Reader::point_inline(const ConfigNode& n) {
  if (!n.is_map()) n.fail_expected("a point symbol (a mapping) or the name of one in symbols");
  static const std::vector<std::string> shape_keys = {"shape",  "size", "path",
                                                      "offset", "fill", "outline"};
  std::vector<std::string> keys = {"shapes", "scale", "rotate_by", "rotation"};
  keys.insert(keys.end(), shape_keys.begin(), shape_keys.end());
  n.expect_keys(keys);
  PointSymbol s;
  if (auto list = n.find("shapes")) {
    if (has_any(n, shape_keys)) n.fail("give either shapes or the keys of one shape, not both");
    for (const auto& item : list->items()) {
      item.expect_keys(shape_keys);
      s.parts.push_back(shape(item));
    }
    if (s.parts.empty()) list->fail("expected at least one shape, got an empty list");
  } else {
    s.parts.push_back(shape(n));
  }
  if (auto sc = n.find("scale")) {
    s.scale = sc->as_number();
    if (!(s.scale > 0)) sc->fail_expected("a positive number");
  }
  if (auto r = n.find("rotate_by")) s.rotation_field = r->as_string();
  if (auto r = n.find("rotation")) s.rotation_deg = r->as_angle_deg();
  return s;
}

}  // namespace sheetmill::style::detail
