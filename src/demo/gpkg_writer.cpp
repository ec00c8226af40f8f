#include <cpl_conv.h>
#include <cpl_string.h>
#include <ogr_spatialref.h>

#include <initializer_list>
#include <string>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/demo/scenario.hpp"
#include "sheetmill/demo/writers.hpp"

namespace sheetmill::demo {

namespace {

struct Field {
  const char* name;
  OGRFieldType type;
};

// One GeoPackage being written; features go in one transaction per layer.
class Gpkg {
 public:
  explicit Gpkg(const std::filesystem::path& path) : path_(path.string()) {
    gdal_init();
    GDALDriver* driver = GetGDALDriverManager()->GetDriverByName("GPKG");
    if (!driver) throw_internal_error("GDAL has no GPKG driver");
    ds_.reset(driver->Create(path_.c_str(), 0, 0, 0, GDT_Unknown, nullptr));
    if (!ds_) fail("cannot create the GeoPackage");
    srs_.importFromEPSG(kEpsg);
    srs_.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  }

  OGRLayer* layer(const char* name, OGRwkbGeometryType type, std::initializer_list<Field> fields) {
    OGRLayer* l = ds_->CreateLayer(name, &srs_, type, nullptr);
    if (!l) fail(std::string("cannot create layer ") + name);
    for (const Field& f : fields) {
      OGRFieldDefn def(f.name, f.type);
      if (l->CreateField(&def) != OGRERR_NONE) fail(std::string("cannot create field ") + f.name);
    }
    return l;
  }

  void begin() { ds_->StartTransaction(); }
  void commit() {
    if (ds_->CommitTransaction() != OGRERR_NONE) fail("cannot commit features");
  }

  void add(OGRLayer* l, OGRFeature& f) {
    if (l->CreateFeature(&f) != OGRERR_NONE) fail("cannot write a feature");
  }

  void close() {
    errors_.clear();
    ds_.reset();
    if (!errors_.last_failure().empty()) fail("cannot finish the GeoPackage");
  }

  [[noreturn]] void fail(const std::string& what) {
    std::string detail = errors_.last_failure();
    throw_input_error(path_, what + (detail.empty() ? "" : " (" + detail + ")"));
  }

 private:
  std::string path_;
  GdalErrorScope errors_;
  DatasetPtr ds_;
  OGRSpatialReference srs_;
};

OGRLineString* make_line(const Polyline& line) {
  auto* g = new OGRLineString();
  for (const Point& p : line) g->addPoint(p.x, p.y);
  return g;
}

OGRPolygon* make_polygon(const std::vector<Polyline>& rings) {
  auto* poly = new OGRPolygon();
  for (const Polyline& r : rings) {
    auto* ring = new OGRLinearRing();
    for (const Point& p : r) ring->addPoint(p.x, p.y);
    ring->closeRings();
    poly->addRingDirectly(ring);
  }
  return poly;
}

OGRPolygon* make_polygon(const Polyline& ring) {
  return make_polygon(std::vector<Polyline>{ring});
}

template <class T, class Fill>
void write_layer(Gpkg& gpkg, OGRLayer* layer, const std::vector<T>& items, Fill fill) {
  gpkg.begin();
  for (const T& item : items) {
    OGRFeature f(layer->GetLayerDefn());
    fill(f, item);
    gpkg.add(layer, f);
  }
  gpkg.commit();
}

}  // namespace

void write_features_gpkg(const std::filesystem::path& path, const DemoFeatures& fs) {
  // GeoPackage metadata carries a timestamp; a fixed one keeps the file reproducible.
  CPLConfigOptionSetter fixed_date("OGR_CURRENT_DATE", "2026-12-01T00:00:00.000Z", false);
  Gpkg g(path);
  write_layer(g,
              g.layer("water_lines", wkbLineString,
                      {{"kind", OFTString}, {"name", OFTString}, {"strahler", OFTInteger}}),
              fs.water_lines, [](OGRFeature& f, const WaterLine& w) {
                f.SetField("kind", w.kind.c_str());
                f.SetField("name", w.name.c_str());
                f.SetField("strahler", w.strahler);
                f.SetGeometryDirectly(make_line(w.line));
              });
  write_layer(g,
              g.layer("water_areas", wkbPolygon,
                      {{"kind", OFTString}, {"name", OFTString}, {"level_m", OFTReal}}),
              fs.water_areas, [](OGRFeature& f, const WaterArea& w) {
                f.SetField("kind", w.kind.c_str());
                f.SetField("name", w.name.c_str());
                f.SetField("level_m", w.level_m);
                f.SetGeometryDirectly(make_polygon(w.ring));
              });
  write_layer(g,
              g.layer("roads", wkbLineString,
                      {{"class", OFTString}, {"ref", OFTString}, {"name", OFTString}}),
              fs.roads, [](OGRFeature& f, const Road& r) {
                f.SetField("class", r.road_class.c_str());
                f.SetField("ref", r.ref.c_str());
                f.SetField("name", r.name.c_str());
                f.SetGeometryDirectly(make_line(r.line));
              });
  write_layer(g, g.layer("tracks", wkbLineString, {{"kind", OFTString}}), fs.tracks,
              [](OGRFeature& f, const Track& t) {
                f.SetField("kind", t.kind.c_str());
                f.SetGeometryDirectly(make_line(t.line));
              });
  write_layer(g, g.layer("railways", wkbLineString, {{"kind", OFTString}, {"name", OFTString}}),
              fs.railways, [](OGRFeature& f, const Railway& r) {
                f.SetField("kind", r.kind.c_str());
                f.SetField("name", r.name.c_str());
                f.SetGeometryDirectly(make_line(r.line));
              });
  write_layer(g, g.layer("buildings", wkbPolygon, {{"kind", OFTString}}), fs.buildings,
              [](OGRFeature& f, const Building& b) {
                f.SetField("kind", b.kind.c_str());
                f.SetGeometryDirectly(make_polygon(b.ring));
              });
  write_layer(g, g.layer("landcover", wkbPolygon, {{"kind", OFTString}}), fs.landcover,
              [](OGRFeature& f, const LandcoverArea& a) {
                f.SetField("kind", a.kind.c_str());
                f.SetGeometryDirectly(make_polygon(a.rings));
              });
  write_layer(g, g.layer("power_lines", wkbLineString, {{"voltage_kv", OFTInteger}}),
              fs.power_lines, [](OGRFeature& f, const PowerLine& p) {
                f.SetField("voltage_kv", p.voltage_kv);
                f.SetGeometryDirectly(make_line(p.line));
              });
  write_layer(g,
              g.layer("places", wkbPoint,
                      {{"name", OFTString}, {"kind", OFTString}, {"population", OFTInteger}}),
              fs.places, [](OGRFeature& f, const Place& p) {
                f.SetField("name", p.name.c_str());
                f.SetField("kind", p.kind.c_str());
                f.SetField("population", p.population);
                f.SetGeometryDirectly(new OGRPoint(p.at.x, p.at.y));
              });
  write_layer(g, g.layer("summits", wkbPoint, {{"name", OFTString}, {"elevation_m", OFTReal}}),
              fs.summits, [](OGRFeature& f, const Summit& s) {
                f.SetField("name", s.name.c_str());
                f.SetField("elevation_m", s.elevation_m);
                f.SetGeometryDirectly(new OGRPoint(s.at.x, s.at.y));
              });
  write_layer(g,
              g.layer("control_points", wkbPoint,
                      {{"id", OFTString}, {"kind", OFTString}, {"elevation_m", OFTReal}}),
              fs.control_points, [](OGRFeature& f, const ControlPoint& c) {
                f.SetField("id", c.id.c_str());
                f.SetField("kind", c.kind.c_str());
                f.SetField("elevation_m", c.elevation_m);
                f.SetGeometryDirectly(new OGRPoint(c.at.x, c.at.y));
              });
  g.close();
}

void write_tiles_gpkg(const std::filesystem::path& path, const std::vector<SheetTile>& sheets) {
  CPLConfigOptionSetter fixed_date("OGR_CURRENT_DATE", "2026-12-01T00:00:00.000Z", false);
  Gpkg g(path);
  OGRLayer* layer = g.layer("sheets", wkbPolygon,
                            {{"sheet_id", OFTString},
                             {"name", OFTString},
                             {"row", OFTInteger},
                             {"col", OFTInteger},
                             {"n", OFTString},
                             {"s", OFTString},
                             {"e", OFTString},
                             {"w", OFTString},
                             {"ne", OFTString},
                             {"nw", OFTString},
                             {"se", OFTString},
                             {"sw", OFTString}});
  write_layer(g, layer, sheets, [](OGRFeature& f, const SheetTile& t) {
    f.SetField("sheet_id", t.sheet_id.c_str());
    f.SetField("name", t.name.c_str());
    f.SetField("row", t.row);
    f.SetField("col", t.col);
    const std::pair<const char*, const std::string*> nb[] = {
        {"n", &t.n},   {"s", &t.s},   {"e", &t.e},   {"w", &t.w},
        {"ne", &t.ne}, {"nw", &t.nw}, {"se", &t.se}, {"sw", &t.sw}};
    for (const auto& [key, value] : nb) f.SetField(key, value->c_str());
    const Box& b = t.ground;
    f.SetGeometryDirectly(make_polygon(
        Polyline{{b.min_x, b.min_y}, {b.max_x, b.min_y}, {b.max_x, b.max_y}, {b.min_x, b.max_y}}));
  });
  g.close();
}

}  // namespace sheetmill::demo
