#include "sheetmill/exhibit/exhibit_project.hpp"

#include <algorithm>

#include "sheetmill/config/node.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/exhibit/ramps.hpp"
#include "sheetmill/sheet/paper_sizes.hpp"

namespace sheetmill::exhibit {

using config::ConfigNode;

namespace {

Colour colour_of(const ConfigNode& n) {
  Colour c;
  if (!terrain::parse_hex_colour(n.as_string(), c)) n.fail_expected("a colour \"#rrggbb\"");
  return c;
}

// A fraction written 0.4 or 40%.
double fraction_of(const ConfigNode& n) {
  std::string s = n.as_string();
  double v = 0;
  if (!s.empty() && s.back() == '%') {
    try {
      v = std::stod(s.substr(0, s.size() - 1)) / 100.0;
    } catch (const std::exception&) {
      n.fail_expected("a fraction such as 0.4 or 40%");
    }
  } else {
    v = n.as_number();
  }
  if (v < 0 || v > 1) n.fail_expected("a fraction between 0 and 1 (or 0% and 100%)");
  return v;
}

LayerRef layer_of(const ConfigNode& n, std::initializer_list<std::string_view> extra_keys) {
  std::vector<std::string> keys{"file", "layer", "where"};
  for (auto k : extra_keys) keys.emplace_back(k);
  n.expect_keys(keys);
  LayerRef r;
  r.path = n.at("file").as_data_source();
  r.layer = n.get_or<std::string>("layer", "");
  r.where = n.get_or<std::string>("where", "");
  return r;
}

void read_paper(const ConfigNode& n, ExhibitProject& p) {
  n.expect_keys({"size", "orientation"});
  const ConfigNode size = n.at("size");
  sheet::PaperSize paper;
  try {
    paper = sheet::paper_size(size.as_string());
  } catch (const Error& e) {
    size.fail(e.message());
  }
  // The PDF format caps a page at 200 in (14 400 pt) on a side.
  if (std::max(paper.width_mm, paper.height_mm) > 200 * 25.4 + 1e-9) {
    size.fail("paper larger than 200 in on a side, the PDF page limit");
  }
  p.paper = size.as_string();
  if (auto o = n.find("orientation"))
    p.landscape = o->as_choice({"portrait", "landscape"}) == "landscape";
}

terrain::TintRamp stops_of(const ConfigNode& n) {
  terrain::TintRamp ramp;
  for (const ConfigNode& item : n.items()) {
    item.expect_keys({"elevation", "colour"});
    ramp.stops.emplace_back(item.at("elevation").as_ground_length_m(),
                            colour_of(item.at("colour")));
  }
  try {
    terrain::validate_ramp(ramp, n.path());
  } catch (const Error& e) {
    n.fail(e.message());
  }
  return ramp;
}

void read_relief(const ConfigNode& n, ReliefSettings& r) {
  n.expect_keys({"dem", "dem_crs", "tint", "tint_range", "tint_stops", "tint_file", "exaggeration",
                 "shading", "sun_altitude", "dpi", "compression", "jpeg_quality", "water_shade"});
  r.dem = n.at("dem").as_data_source();
  if (auto c = n.find("dem_crs")) r.dem_crs = c->as_string();
  int given = 0;
  if (auto t = n.find("tint")) {
    r.ramp_name = t->as_string();
    try {
      shipped_ramp(r.ramp_name);
    } catch (const Error& e) {
      t->fail(e.message());
    }
    ++given;
  }
  if (auto s = n.find("tint_stops")) {
    r.ramp = stops_of(*s);
    ++given;
  }
  if (auto f = n.find("tint_file")) {
    r.ramp = terrain::load_ramp_file(f->as_path());
    ++given;
  }
  if (given > 1) n.fail("give one of tint, tint_stops and tint_file");
  if (auto range = n.find("tint_range")) {
    auto items = range->items();
    if (items.size() != 2) range->fail_expected("[LOW, HIGH] elevations such as [0 m, 1200 m]");
    double lo = items[0].as_ground_length_m(), hi = items[1].as_ground_length_m();
    if (!(hi > lo)) range->fail("the high end must be above the low end");
    if (r.ramp) range->fail("tint_range applies to a shipped tint, not to stated stops");
    r.range_m = std::make_pair(lo, hi);
  }
  if (auto e = n.find("exaggeration")) {
    r.exaggeration = e->as_number();
    if (!(r.exaggeration > 0) || r.exaggeration > 20) e->fail_expected("a factor in (0, 20]");
  }
  if (auto s = n.find("shading")) r.shade_strength = fraction_of(*s);
  if (auto a = n.find("sun_altitude")) {
    r.altitude_deg = a->as_angle_deg();
    if (!(r.altitude_deg > 0 && r.altitude_deg <= 90)) a->fail_expected("an angle in (0, 90]");
  }
  if (auto d = n.find("dpi")) {
    r.dpi = d->as_number();
    if (r.dpi < 20 || r.dpi > 1200) d->fail_expected("a resolution between 20 and 1200 dpi");
  }
  if (auto c = n.find("compression")) {
    r.compression = c->as_choice({"jpeg", "lossless"}) == "jpeg" ? ReliefCompression::jpeg
                                                                 : ReliefCompression::lossless;
  }
  if (auto q = n.find("jpeg_quality")) {
    r.jpeg_quality = q->as_int();
    if (r.jpeg_quality < 1 || r.jpeg_quality > 100) q->fail_expected("a quality from 1 to 100");
  }
  if (auto w = n.find("water_shade")) {
    if (w->as_string() == "none") {
      r.water_shade.reset();
    } else {
      r.water_shade = colour_of(*w);
    }
  }
}

AreaOverlay area_of(const ConfigNode& n) {
  AreaOverlay a;
  if (auto ring = n.find("ring")) {
    n.expect_keys({"ring", "label", "colour", "width", "dash", "focus"});
    for (const ConfigNode& item : ring->items()) {
      auto v = item.as_numbers(2);
      a.ring.push_back({v[0], v[1]});
    }
    if (a.ring.size() < 3) ring->fail_expected("at least three [easting, northing] corners");
  } else {
    a.data = layer_of(n, {"label", "colour", "width", "dash", "focus"});
  }
  a.label = n.get_or<std::string>("label", "");
  if (auto c = n.find("colour")) a.colour = colour_of(*c);
  if (auto w = n.find("width")) {
    a.width_mm = w->as_length_mm();
    if (!(a.width_mm > 0)) w->fail_expected("a positive width such as 2.5mm");
  }
  if (auto d = n.find("dash")) {
    for (const ConfigNode& item : d->items()) a.dash_mm.push_back(item.as_length_mm());
    if (a.dash_mm.size() % 2 != 0) d->fail_expected("an even number of lengths (on, off, ...)");
  }
  a.focus = n.get_or<bool>("focus", true);
  return a;
}

ExhibitProject read(const ConfigNode& root) {
  root.expect_keys({"title", "subtitle", "producer", "date", "credits", "notes", "crs", "paper",
                    "extent", "scale", "relief", "context", "areas", "dim_outside", "places"});
  ExhibitProject p;
  p.file = root.file();
  p.title = root.at("title").as_string();
  p.subtitle = root.get_or<std::string>("subtitle", "");
  p.producer = root.get_or<std::string>("producer", "");
  p.date = root.get_or<std::string>("date", "");
  if (auto c = root.find("credits")) {
    for (const ConfigNode& item : c->items()) p.credits.push_back(item.as_string());
  }
  if (auto c = root.find("notes")) {
    for (const ConfigNode& item : c->items()) p.notes.push_back(item.as_string());
  }
  p.crs = root.at("crs").as_string();
  read_paper(root.at("paper"), p);
  const ConfigNode extent = root.at("extent");
  auto v = extent.as_numbers(4);
  if (v[2] <= v[0] || v[3] <= v[1])
    extent.fail_expected("[min_e, min_n, max_e, max_n] with max > min");
  p.extent = Box::of(v[0], v[1], v[2], v[3]);
  if (auto s = root.find("scale")) {
    p.scale = s->as_scale();
  }
  read_relief(root.at("relief"), p.relief);
  if (auto c = root.find("context")) {
    c->expect_keys({"water_areas", "water_lines", "roads"});
    if (auto n = c->find("water_areas")) {
      p.context.water_areas = layer_of(*n, {"name_field"});
      p.context.water_areas->name_field = n->get_or<std::string>("name_field", "name");
    }
    if (auto n = c->find("water_lines")) {
      p.context.water_lines = layer_of(*n, {"name_field"});
      p.context.water_lines->name_field = n->get_or<std::string>("name_field", "name");
    }
    if (auto n = c->find("roads")) {
      p.context.roads = layer_of(*n, {"class_field", "number_field"});
      p.context.roads->class_field = n->get_or<std::string>("class_field", "class");
      p.context.roads->number_field = n->get_or<std::string>("number_field", "ref");
    }
  }
  if (auto a = root.find("areas")) {
    for (const ConfigNode& item : a->items()) p.areas.push_back(area_of(item));
  }
  if (auto d = root.find("dim_outside")) p.dim_outside = fraction_of(*d);
  if (auto pl = root.find("places")) {
    PlaceCallouts c;
    c.data = layer_of(*pl, {"name_field", "only"});
    c.name_field = pl->get_or<std::string>("name_field", "name");
    if (auto only = pl->find("only")) {
      for (const ConfigNode& item : only->items()) c.only.push_back(item.as_string());
    }
    p.places = c;
  }
  return p;
}

}  // namespace

ExhibitProject load_exhibit_project(const std::filesystem::path& path) {
  return read(config::load_file(path));
}

ExhibitProject parse_exhibit_project(const std::string& yaml_text, const std::string& name) {
  return read(config::load_string(yaml_text, name));
}

}  // namespace sheetmill::exhibit
