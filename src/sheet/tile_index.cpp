#include "sheetmill/sheet/tile_index.hpp"

#include <ogrsf_frmts.h>

#include <optional>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/sheet/sheet_crs.hpp"

namespace sheetmill::sheet {

namespace {

const OGRLinearRing* outer_ring(const OGRGeometry* g) {
  if (!g) return nullptr;
  switch (wkbFlatten(g->getGeometryType())) {
    case wkbPolygon:
      return g->toPolygon()->getExteriorRing();
    case wkbMultiPolygon: {
      auto* mp = g->toMultiPolygon();
      return mp->getNumGeometries() > 0 ? mp->getGeometryRef(0)->getExteriorRing() : nullptr;
    }
    default:
      return nullptr;
  }
}

// Ring vertices (without the closing repeat), densified to `steps` pieces per edge when the
// index is geographic so meridians and parallels project to their true curves.
std::vector<Point> ring_points(const OGRLinearRing& ring, bool geographic) {
  std::vector<Point> pts;
  int n = ring.getNumPoints();
  if (n > 1 && ring.getX(0) == ring.getX(n - 1) && ring.getY(0) == ring.getY(n - 1)) --n;
  const int steps = geographic ? 24 : 1;
  for (int i = 0; i < n; ++i) {
    Point a{ring.getX(i), ring.getY(i)};
    Point b{ring.getX((i + 1) % n), ring.getY((i + 1) % n)};
    for (int s = 0; s < steps; ++s) pts.push_back(a + (b - a) * (double(s) / steps));
  }
  return pts;
}

}  // namespace

TileIndexContents read_tile_index(const project::TileIndex& index,
                                  const std::string& sheet_crs_definition) {
  gdal_init();
  DatasetPtr ds = open_vector(index.path);
  OGRLayer* layer = index.layer.empty() ? ds->GetLayer(0) : ds->GetLayerByName(index.layer.c_str());
  if (!layer) throw_input_error(index.path, "no layer '" + index.layer + "' in the tile index");
  OGRFeatureDefn* defn = layer->GetLayerDefn();
  int id_field = defn->GetFieldIndex(index.id_field.c_str());
  int name_field = defn->GetFieldIndex(index.name_field.c_str());
  if (id_field < 0) {
    throw_input_error(index.path,
                      "the tile index has no field '" + index.id_field + "' (tile_index.id_field)");
  }

  TileIndexContents out;
  std::optional<Reprojector> to_sheet;
  if (const OGRSpatialReference* srs = layer->GetSpatialRef()) {
    out.geographic = srs->IsGeographic();
    std::string src = crs_wkt(*srs);
    if (!src.empty()) to_sheet.emplace(src, sheet_crs_definition);
  }

  layer->ResetReading();
  for (FeaturePtr f(layer->GetNextFeature()); f; f.reset(layer->GetNextFeature())) {
    const OGRLinearRing* ring = outer_ring(f->GetGeometryRef());
    if (!ring || ring->getNumPoints() < 3) continue;
    IndexSheet s;
    s.id = f->GetFieldAsString(id_field);
    if (name_field >= 0) s.name = f->GetFieldAsString(name_field);
    for (Point p : ring_points(*ring, out.geographic)) {
      Point g = to_sheet ? to_sheet->forward(p) : p;
      s.outline.push_back(g);
      s.bounds.add(g);
    }
    out.sheets.push_back(std::move(s));
  }
  if (out.sheets.empty()) throw_input_error(index.path, "the tile index holds no polygons");
  return out;
}

const IndexSheet& find_sheet(const TileIndexContents& index, const std::string& id,
                             const std::string& index_path) {
  for (const auto& s : index.sheets) {
    if (s.id == id) return s;
  }
  throw_input_error(index_path, "no sheet '" + id + "' in the tile index");
}

std::vector<const IndexSheet*> adjoining_sheets(const TileIndexContents& index,
                                                const IndexSheet& sheet, double tolerance_m) {
  std::vector<const IndexSheet*> out;
  Box grown = sheet.bounds.expanded(tolerance_m);
  for (const auto& s : index.sheets) {
    if (&s == &sheet || s.id == sheet.id) continue;
    if (s.bounds.intersects(grown)) out.push_back(&s);
  }
  return out;
}

}  // namespace sheetmill::sheet
