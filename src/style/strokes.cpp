// Line ink: width, ends, corners, dashes, parallel offset and drawing pass.
#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

double positive_length(const ConfigNode& n) {
  double v = n.as_length_mm();
  if (!(v > 0)) n.fail_expected("a positive length such as 0.35mm");
  return v;
}

std::vector<double> read_dashes(const ConfigNode& n) {
  if (n.is_scalar() && n.as_string() == "solid") return {};
  if (!n.is_sequence()) n.fail_expected("a list of lengths (on, off, ...) such as [2mm, 0.5mm]");
  std::vector<double> out;
  double total = 0;
  for (const auto& item : n.items()) {
    double v = item.as_length_mm();
    if (v < 0) item.fail_expected("a length of zero or more such as 0.5mm");
    out.push_back(v);
    total += v;
  }
  if (out.size() % 2 != 0) {
    n.fail("expected an even number of dash lengths (on, off, ...), got " +
           std::to_string(out.size()));
  }
  if (!out.empty() && !(total > 0)) n.fail("expected at least one dash length above zero");
  return out;
}

}  // namespace

const std::vector<std::string>& Reader::stroke_keys() {
  static const std::vector<std::string> keys = {"colour", "width",      "ends",        "corners",
                                                "dashes", "dash_start", "side_offset", "pass"};
  return keys;
}

Stroke Reader::stroke_fields(const ConfigNode& n, Stroke s) const {
  if (auto c = n.find("colour")) s.colour = colour(*c);
  if (auto w = n.find("width")) s.width_mm = positive_length(*w);
  if (auto e = n.find("ends")) {
    std::string v = e->as_choice({"flat", "round", "square"});
    s.cap = v == "flat" ? LineCap::butt : v == "round" ? LineCap::round : LineCap::square;
  }
  if (auto j = n.find("corners")) {
    std::string v = j->as_choice({"mitre", "round", "bevel"});
    s.join = v == "mitre" ? LineJoin::miter : v == "round" ? LineJoin::round : LineJoin::bevel;
  }
  if (auto d = n.find("dashes")) s.dash_mm = read_dashes(*d);
  if (auto d = n.find("dash_start")) {
    s.dash_offset_mm = d->as_length_mm();
    if (s.dash_mm.empty()) d->fail("dash_start needs dashes");
  }
  if (auto o = n.find("side_offset")) s.offset_mm = o->as_length_mm();
  if (auto p = n.find("pass")) {
    s.pass = p->as_int();
    if (s.pass < 0 || s.pass > 9) p->fail_expected("a drawing pass from 0 to 9");
  }
  return s;
}

Stroke Reader::stroke(const ConfigNode& n, Stroke base) const {
  if (!n.is_map()) n.fail_expected("a mapping of stroke keys (colour, width, ...)");
  n.expect_keys(stroke_keys());
  return stroke_fields(n, base);
}

}  // namespace sheetmill::style::detail
