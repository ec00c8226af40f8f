#include "sheetmill/project/project.hpp"

#include <fmt/format.h>

#include <algorithm>

#include "sheetmill/config/node.hpp"
#include "sheetmill/core/error.hpp"

namespace sheetmill::project {

using config::ConfigNode;

namespace {

Source read_source(const std::string& name, const ConfigNode& n) {
  Source src;
  src.name = name;
  if (n.is_scalar()) {
    src.path = n.as_data_source();
    return src;
  }
  n.expect_keys({"path", "layer", "where", "required"});
  src.path = n.at("path").as_data_source();
  src.layer = n.get_or<std::string>("layer", "");
  src.where = n.get_or<std::string>("where", "");
  src.required = n.get_or<bool>("required", true);
  return src;
}

Paper read_paper(const ConfigNode& n) {
  Paper paper;
  if (n.is_scalar()) {
    n.fail_expected("a mapping with size (and orientation), or width and height");
  }
  n.expect_keys({"size", "width", "height", "orientation"});
  if (auto size = n.find("size"); size && size->is_scalar() && size->as_string() == kFitPaper) {
    if (n.has("width") || n.has("height")) n.fail("give either size or width and height, not both");
    paper.name = kFitPaper;
    return paper;  // orientation too is the layout's choice
  }
  if (auto size = n.find("size")) {
    try {
      paper = paper_by_name(size->as_string());
    } catch (const Error& e) {
      size->fail(e.message());
    }
    if (n.has("width") || n.has("height")) n.fail("give either size or width and height, not both");
  } else {
    paper.name = "custom";
    paper.width_mm = n.at("width").as_length_mm();
    paper.height_mm = n.at("height").as_length_mm();
    if (paper.width_mm <= 0 || paper.height_mm <= 0) n.fail("paper width and height must be > 0");
    // The PDF format caps a page at 200 in (14 400 pt) on a side.
    if (paper.width_mm > 200 * 25.4 || paper.height_mm > 200 * 25.4) {
      n.fail("paper larger than 200 in on a side, the PDF page limit");
    }
  }
  std::string orientation = "portrait";
  if (auto o = n.find("orientation")) orientation = o->as_choice({"portrait", "landscape"});
  bool landscape = orientation == "landscape";
  if (landscape != (paper.width_mm > paper.height_mm) && paper.name != "custom") {
    std::swap(paper.width_mm, paper.height_mm);
  }
  return paper;
}

Extent read_extent(const ConfigNode& n) {
  n.expect_keys({"centre", "box", "sheet"});
  Extent e;
  int given = 0;
  if (auto c = n.find("centre")) {
    auto v = c->as_coordinates(2);
    e.centre = Point{v[0], v[1]};
    ++given;
  }
  if (auto b = n.find("box")) {
    auto v = b->as_coordinates(4);
    if (v[2] <= v[0] || v[3] <= v[1])
      b->fail("expected [min_x, min_y, max_x, max_y] with max > min");
    e.box = Box::of(v[0], v[1], v[2], v[3]);
    ++given;
  }
  if (auto s = n.find("sheet")) {
    e.sheet_id = s->as_string();
    ++given;
  }
  if (given != 1) n.fail("expected exactly one of centre, box or sheet");
  return e;
}

Elevation read_elevation(const ConfigNode& n) {
  n.expect_keys({"dem", "vertical_unit", "crs", "vertical_datum", "sea_level"});
  Elevation el;
  el.dem = n.at("dem").as_data_source();
  if (auto u = n.find("vertical_unit")) el.vertical_unit = u->as_choice({"m", "ft", "us-ft"});
  if (auto c = n.find("crs")) el.crs = c->as_string();
  if (auto d = n.find("vertical_datum")) el.vertical_datum = d->as_string();
  if (auto s = n.find("sea_level")) el.sea_level_m = s->as_ground_length_m();
  return el;
}

ContourSettings read_contours(const ConfigNode& n) {
  n.expect_keys({"interval", "base", "from_layer", "elevation_field"});
  ContourSettings c;
  if (auto i = n.find("interval")) {
    c.interval_m = i->as_ground_length_m();
    if (*c.interval_m <= 0) i->fail("expected a contour interval > 0");
  }
  if (auto b = n.find("base")) c.base_m = b->as_ground_length_m();
  if (auto l = n.find("from_layer")) c.from_layer = read_source("contours", *l);
  c.elevation_field = n.get_or<std::string>("elevation_field", "elevation");
  return c;
}

TileIndex read_tile_index(const ConfigNode& n) {
  n.expect_keys({"path", "layer", "id_field", "name_field"});
  TileIndex t;
  t.path = n.at("path").as_data_source();
  t.layer = n.get_or<std::string>("layer", "");
  t.id_field = n.get_or<std::string>("id_field", "sheet_id");
  t.name_field = n.get_or<std::string>("name_field", "name");
  return t;
}

Magnetic read_magnetic(const ConfigNode& n) {
  n.expect_keys({"model", "declination", "annual_change", "date"});
  Magnetic m;
  if (auto f = n.find("model")) m.model_file = f->as_path().string();
  if (auto d = n.find("declination")) m.declination_deg = d->as_angle_deg();
  if (auto a = n.find("annual_change")) m.annual_change_deg = a->as_angle_deg();
  if (auto d = n.find("date")) m.date = d->as_string();
  if (m.model_file && m.declination_deg) n.fail("give either model or declination, not both");
  if (m.declination_deg && !m.date) n.fail("a stated declination needs its date");
  return m;
}

AccuracyCheck read_accuracy(const ConfigNode& n) {
  n.expect_keys({"points", "layer", "height_field", "id_field", "crs", "height_unit", "cover_field",
                 "vegetated", "date"});
  AccuracyCheck a;
  a.points = n.at("points").as_data_source();
  a.layer = n.get_or<std::string>("layer", "");
  a.height_field = n.get_or<std::string>("height_field", "");
  a.id_field = n.get_or<std::string>("id_field", "");
  if (auto c = n.find("crs")) a.crs = c->as_string();
  if (auto u = n.find("height_unit")) a.height_unit = u->as_choice({"m", "ft", "us-ft"});
  a.cover_field = n.get_or<std::string>("cover_field", "");
  if (auto v = n.find("vegetated")) {
    for (const auto& item : v->items()) a.vegetated.push_back(item.as_string());
    if (a.cover_field.empty()) v->fail("vegetated classes need a cover_field");
  }
  if (auto d = n.find("date")) a.date = d->as_string();
  return a;
}

Output read_output(const ConfigNode& n) {
  n.expect_keys({"relief_dpi", "relief_compression", "jpeg_quality", "file_names"});
  Output o;
  if (auto d = n.find("relief_dpi")) {
    o.relief_dpi = d->as_number();
    if (o.relief_dpi < 50 || o.relief_dpi > 1200) d->fail("expected a resolution from 50 to 1200");
  }
  if (auto c = n.find("relief_compression"))
    o.relief_compression = c->as_choice({"lossless", "jpeg"});
  if (auto q = n.find("jpeg_quality")) {
    o.jpeg_quality = q->as_int();
    if (o.jpeg_quality < 10 || o.jpeg_quality > 100) q->fail("expected a quality from 10 to 100");
  }
  o.file_template = n.get_or<std::string>("file_names", o.file_template);
  return o;
}

std::vector<std::string> read_strings(const ConfigNode& n) {
  std::vector<std::string> out;
  for (const auto& item : n.items()) out.push_back(item.as_string());
  return out;
}

}  // namespace

Project load_project(const std::filesystem::path& path) {
  ConfigNode root = config::load_file(path);
  root.expect_keys({"title",     "subtitle", "producer",  "revision",    "credits",    "notes",
                    "crs",       "scale",    "paper",     "margin",      "extent",     "style",
                    "elevation", "contours", "sources",   "vector_data", "tile_index", "magnetic",
                    "accuracy",  "output",   "scale_bars"});
  Project p;
  p.file = path;
  p.title = root.at("title").as_string();
  p.subtitle = root.get_or<std::string>("subtitle", "");
  p.producer = root.get_or<std::string>("producer", "");
  p.revision_date = root.get_or<std::string>("revision", "");
  if (auto c = root.find("credits")) p.data_credits = read_strings(*c);
  if (auto n = root.find("notes")) p.notes = read_strings(*n);
  p.crs = root.at("crs").as_string();
  p.scale = root.at("scale").as_scale();
  // A series sheet without stated paper gets paper that fits it.
  if (root.has("paper") || !root.has("tile_index"))
    p.paper = read_paper(root.at("paper"));
  else
    p.paper.name = kFitPaper;
  if (auto m = root.find("margin")) {
    p.margin_mm = m->as_length_mm();
    // The map face needs some paper: margins take at most 45% of the shorter side each (paper
    // that fits the sheet is chosen later, with the margin inside it).
    if (p.paper.name != kFitPaper) {
      double most_mm = 0.45 * std::min(p.paper.width_mm, p.paper.height_mm);
      if (!(p.margin_mm >= 0 && p.margin_mm <= most_mm)) {
        m->fail_expected(
            fmt::format("a margin from 0mm to {:g}mm (45% of the paper's shorter side)", most_mm));
      }
    } else if (!(p.margin_mm >= 0)) {
      m->fail_expected("a margin of 0mm or more");
    }
  }
  if (auto b = root.find("scale_bars")) {
    for (const auto& item : b->items()) p.scale_bars.push_back(item.as_choice({"m", "ft", "mi"}));
    if (p.scale_bars.empty()) b->fail_expected("a list of scale-bar units (m, ft, mi)");
  }
  p.extent = read_extent(root.at("extent"));
  p.style = root.at("style").as_path();
  if (auto e = root.find("elevation")) p.elevation = read_elevation(*e);
  if (auto c = root.find("contours")) p.contours = read_contours(*c);
  if (auto s = root.find("sources")) {
    for (const auto& [name, node] : s->entries()) p.sources[name] = read_source(name, node);
  }
  if (auto v = root.find("vector_data")) p.vector_data = v->as_data_source();
  if (auto t = root.find("tile_index")) p.tile_index = read_tile_index(*t);
  if (auto m = root.find("magnetic")) p.magnetic = read_magnetic(*m);
  if (auto a = root.find("accuracy")) p.accuracy = read_accuracy(*a);
  if (auto o = root.find("output")) p.output = read_output(*o);
  if (p.accuracy && p.elevation.dem.empty()) {
    root.at("accuracy").fail("check points test a DEM; give elevation.dem");
  }
  if (p.extent.sheet_id && !p.tile_index) {
    root.at("extent").fail("extent.sheet needs a tile_index");
  }
  return p;
}

Source source_for(const Project& project, const std::string& name) {
  auto it = project.sources.find(name);
  if (it != project.sources.end()) return it->second;
  if (project.vector_data.empty()) {
    throw_input_error(project.file.string(), "sources: the style needs a source named '" + name +
                                                 "'; add it under sources or give vector_data");
  }
  Source s;
  s.name = name;
  s.path = project.vector_data;
  s.layer = name;
  // A shared style names more layers than any one dataset holds: a layer the default dataset
  // lacks is left off the sheet with a warning, not an error.
  s.required = false;
  return s;
}

}  // namespace sheetmill::project
