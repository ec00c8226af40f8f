#include "sheetmill/batch/tile_index_io.hpp"

#include <ogr_spatialref.h>
#include <ogrsf_frmts.h>
#include <unistd.h>

#include <cmath>
#include <cstdio>
#include <memory>

#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/temp_registry.hpp"
#include "sheetmill/core/utf8.hpp"

namespace sheetmill::batch {

namespace fs = std::filesystem;

namespace {

OGRLayer* find_layer(GDALDataset& ds, const std::string& path, const std::string& layer) {
  OGRLayer* l = layer.empty() ? ds.GetLayer(0) : ds.GetLayerByName(layer.c_str());
  if (!l) {
    throw_input_error(
        path, layer.empty() ? std::string("has no layers") : "has no layer \"" + layer + "\"");
  }
  return l;
}

std::unique_ptr<OGRSpatialReference> srs_from(const std::string& crs, const std::string& where) {
  auto srs = std::make_unique<OGRSpatialReference>();
  GdalErrorScope errors;  // PROJ's own message stays out of the terminal
  if (srs->SetFromUserInput(crs.c_str()) != OGRERR_NONE) {
    throw_input_error(where, "expected a CRS such as EPSG:32633, got \"" + crs + "\"");
  }
  srs->SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  return srs;
}

// True when every vertex of `g` has finite coordinates: one NaN vertex would otherwise poison
// the envelope and every neighbour and overlap test of the whole index.
class FiniteVertices : public OGRDefaultConstGeometryVisitor {
 public:
  using OGRDefaultConstGeometryVisitor::visit;
  void visit(const OGRPoint* p) override {
    // Not IsEmpty(): OGR counts a point with a NaN coordinate as empty.
    if (!std::isfinite(p->getX()) || !std::isfinite(p->getY())) finite = false;
  }
  bool finite = true;
};

// A sheet ID names files, stamps and log lines: it must be text. (Control and direction
// characters are allowed: file names replace them, messages show them escaped.)
void check_sheet_id(const std::string& id, const std::string& where) {
  if (auto bad = first_invalid_utf8(id)) {
    throw_input_error(where, "the sheet ID " + quote_untrusted(id) + " is not valid UTF-8 (byte " +
                                 std::to_string(*bad + 1) + "); fix the ID in the tile index");
  }
}

}  // namespace

void write_tile_index(const IndexPlan& plan, const fs::path& gpkg, const std::string& layer_name) {
  gdal_init();
  GdalErrorScope errors;
  GDALDriver* driver = GetGDALDriverManager()->GetDriverByName("GPKG");
  if (!driver) throw_internal_error("GDAL has no GeoPackage driver");
  // A missing folder, or a device, FIFO, folder or link at the target, is refused before
  // anything is written (core/atomic_file.hpp).
  resolve_output_target(gpkg);
  // The GeoPackage driver wants its extension; the temporary keeps it, then replaces the target.
  // It is registered for removal on SIGINT and SIGTERM (core/temp_registry.hpp) with SQLite's
  // journal beside it, and a killed run's leftovers go with the next write of the same file.
  remove_stale_temps(gpkg);
  TempFile temp_file(sibling_temp_path(gpkg, "part.gpkg"), gpkg.string());
  const fs::path temp = temp_file.path();
  ::unlink(temp.c_str());  // the GeoPackage driver will not create over an existing file
  const fs::path journal = temp.string() + "-journal";
  struct JournalSlot {
    int slot;
    fs::path path;
    ~JournalSlot() {
      ::unlink(path.c_str());
      unregister_temp(slot);
    }
  } journal_slot{register_temp(journal), journal};
  {
    DatasetPtr ds(driver->Create(temp.c_str(), 0, 0, 0, GDT_Unknown, nullptr));
    if (!ds) {
      throw_input_error(gpkg.string(),
                        "cannot create: " + library_write_failure(gpkg, errors.last_failure()));
    }
    OGRSpatialReference srs;
    srs.importFromWkt(plan.crs_wkt.c_str());
    srs.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
    OGRLayer* layer = ds->CreateLayer(layer_name.c_str(), &srs, wkbPolygon, nullptr);
    if (!layer) throw_input_error(gpkg.string(), "cannot create layer " + layer_name);
    auto add_field = [&](const char* name, OGRFieldType type) {
      OGRFieldDefn f(name, type);
      if (layer->CreateField(&f) != OGRERR_NONE) throw_internal_error("cannot add index field");
    };
    add_field("sheet_id", OFTString);
    add_field("name", OFTString);
    add_field("row", OFTInteger);
    add_field("col", OFTInteger);
    for (const char* n : kNeighbourFields) add_field(n, OFTString);
    if (layer->StartTransaction() != OGRERR_NONE) throw_internal_error("cannot start transaction");
    for (const IndexSheet& s : plan.sheets) {
      FeaturePtr f(OGRFeature::CreateFeature(layer->GetLayerDefn()));
      f->SetField("sheet_id", s.id.c_str());
      f->SetField("name", s.name.c_str());
      f->SetField("row", s.row);
      f->SetField("col", s.col);
      for (std::size_t k = 0; k < kNeighbourFields.size(); ++k) {
        if (s.neighbours[k].empty()) {
          f->SetFieldNull(f->GetFieldIndex(kNeighbourFields[k]));
        } else {
          f->SetField(kNeighbourFields[k], s.neighbours[k].c_str());
        }
      }
      OGRPolygon poly;
      OGRLinearRing ring;
      for (const Point& p : s.ring) ring.addPoint(p.x, p.y);
      ring.closeRings();
      poly.addRing(&ring);
      f->SetGeometry(&poly);
      if (layer->CreateFeature(f.get()) != OGRERR_NONE) {
        throw_input_error(gpkg.string(), "cannot write sheet " + s.id + ": " +
                                             library_write_failure(gpkg, errors.last_failure()));
      }
    }
    if (layer->CommitTransaction() != OGRERR_NONE) {
      throw_input_error(gpkg.string(),
                        "cannot write: " + library_write_failure(gpkg, errors.last_failure()));
    }
    errors.clear();
    ds.reset();  // closing writes the GeoPackage's last pages
    if (!errors.last_failure().empty()) {
      throw_input_error(gpkg.string(), "cannot finish the file: " +
                                           library_write_failure(gpkg, errors.last_failure()));
    }
  }
  resolve_output_target(gpkg);  // still not a device: never rename over one
  if (std::rename(temp.c_str(), gpkg.c_str()) != 0) {
    throw_input_error(gpkg.string(), "cannot replace the file: " + errno_text(errno));
  }
  temp_file.release();
}

AreaOfInterest read_area_polygons(const std::string& path, const std::string& layer_name,
                                  const std::string& crs) {
  DatasetPtr ds = open_vector(path);
  OGRLayer* layer = find_layer(*ds, path, layer_name);
  auto target = srs_from(crs, "--crs");
  AreaOfInterest area;
  for (auto& f : *layer) {
    OGRGeometry* g = f->GetGeometryRef();
    if (!g) continue;
    OGRwkbGeometryType t = wkbFlatten(g->getGeometryType());
    if (t != wkbPolygon && t != wkbMultiPolygon && t != wkbCurvePolygon && t != wkbMultiSurface) {
      throw_input_error(path, "the area layer must hold polygons (feature " +
                                  std::to_string(f->GetFID()) + " is " +
                                  OGRGeometryTypeToName(g->getGeometryType()) + ")");
    }
    std::unique_ptr<OGRGeometry> copy(g->clone());
    const OGRSpatialReference* from = layer->GetSpatialRef();
    if (from) {
      OGRSpatialReference src(*from);
      src.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
      copy->assignSpatialReference(&src);
      if (copy->transformTo(target.get()) != OGRERR_NONE) {
        throw_input_error(path, "cannot transform the area polygons to " + crs);
      }
    }
    OGREnvelope env;
    copy->getEnvelope(&env);
    area.box.add({env.MinX, env.MinY});
    area.box.add({env.MaxX, env.MaxY});
    char* wkt = nullptr;
    copy->exportToWkt(&wkt);
    area.polygons_wkt.emplace_back(wkt);
    CPLFree(wkt);
  }
  if (area.polygons_wkt.empty()) throw_input_error(path, "the area layer has no polygons");
  return area;
}

TileIndexContent read_tile_index(const std::string& path, const std::string& layer_name,
                                 const std::string& id_field, const std::string& name_field) {
  DatasetPtr ds = open_vector(path);
  OGRLayer* layer = find_layer(*ds, path, layer_name);
  OGRFeatureDefn* defn = layer->GetLayerDefn();
  int id_index = defn->GetFieldIndex(id_field.c_str());
  if (id_index < 0) {
    throw_input_error(path, "the tile index has no ID field \"" + id_field + "\"");
  }
  int name_index = name_field.empty() ? -1 : defn->GetFieldIndex(name_field.c_str());
  if (!name_field.empty() && name_index < 0) {
    throw_input_error(path, "the tile index has no name field \"" + name_field + "\"");
  }
  TileIndexContent out;
  if (const OGRSpatialReference* srs = layer->GetSpatialRef()) {
    out.crs_wkt = crs_wkt(*srs, "WKT2_2018");
  }
  layer->ResetReading();
  for (auto& f : *layer) {
    SheetJob job;
    std::string where = path + ": feature " + std::to_string(f->GetFID());
    if (!f->IsFieldSetAndNotNull(id_index)) throw_input_error(where, "has no sheet ID");
    job.id = f->GetFieldAsString(id_index);
    check_sheet_id(job.id, where);
    if (name_index >= 0 && f->IsFieldSetAndNotNull(name_index)) {
      job.name = f->GetFieldAsString(name_index);
    }
    for (int k = 0; k < defn->GetFieldCount(); ++k) {
      job.fields[defn->GetFieldDefn(k)->GetNameRef()] =
          f->IsFieldSetAndNotNull(k) ? f->GetFieldAsString(k) : "";
    }
    OGRGeometry* g = f->GetGeometryRef();
    if (!g || g->IsEmpty()) throw_input_error(where, "has no footprint polygon");
    FiniteVertices vertices;
    g->accept(&vertices);
    if (!vertices.finite) {
      throw_input_error(where, "sheet " + quote_untrusted(job.id) +
                                   ": the footprint has a vertex that is not a finite number "
                                   "(NaN or infinite); fix or remove that feature");
    }
    OGREnvelope env;
    g->getEnvelope(&env);
    job.footprint = Box::of(env.MinX, env.MinY, env.MaxX, env.MaxY);
    char* wkt = nullptr;
    g->exportToWkt(&wkt);
    job.footprint_wkt = wkt ? wkt : "";
    CPLFree(wkt);
    out.sheets.push_back(std::move(job));
  }
  return out;
}

}  // namespace sheetmill::batch
