#include "sheetmill/accuracy/check_points.hpp"

#include <fmt/format.h>

#include <string_view>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"

namespace sheetmill::accuracy {

namespace {

constexpr std::initializer_list<const char*> kUsualHeightFields = {"elevation_m", "elevation",
                                                                   "height_m", "height", "z"};

int find_field(OGRFeatureDefn& defn, const std::string& wanted,
               std::initializer_list<const char*> usual) {
  if (!wanted.empty()) return defn.GetFieldIndex(wanted.c_str());
  for (const char* name : usual) {
    int i = defn.GetFieldIndex(name);
    if (i >= 0) return i;
  }
  return -1;
}

// The named layer; else the first point layer with a height field (when heights are wanted);
// else the first point layer; else the first layer.
OGRLayer* pick_layer(GDALDataset& ds, const CheckPointSource& src) {
  if (!src.layer.empty()) {
    OGRLayer* l = ds.GetLayerByName(src.layer.c_str());
    if (!l) throw_input_error(src.path, "no layer named '" + src.layer + "'");
    return l;
  }
  if (ds.GetLayerCount() == 0) throw_input_error(src.path, "the points file has no layers");
  OGRLayer* first_point = nullptr;
  for (int i = 0; i < ds.GetLayerCount(); ++i) {
    OGRLayer* l = ds.GetLayer(i);
    if (wkbFlatten(l->GetGeomType()) != wkbPoint) continue;
    if (!first_point) first_point = l;
    if (!src.heights_required ||
        find_field(*l->GetLayerDefn(), src.height_field, kUsualHeightFields) >= 0) {
      return l;
    }
  }
  return first_point ? first_point : ds.GetLayer(0);
}

std::string field_names(OGRFeatureDefn& defn) {
  std::string out;
  for (int i = 0; i < defn.GetFieldCount(); ++i) {
    out += (i ? ", " : "") + std::string(defn.GetFieldDefn(i)->GetNameRef());
  }
  return out.empty() ? "none" : out;
}

// GeoPackage stores a layer without CRS under its "Undefined geographic SRS" or "Undefined
// Cartesian SRS" (srs_id 0 and -1 of the GeoPackage standard): that states nothing.
bool states_crs(const OGRSpatialReference* srs) {
  if (!srs || srs->IsEmpty()) return false;
  const char* name = srs->GetName();
  return !(name && std::string_view(name).starts_with("Undefined "));
}

OGRSpatialReference points_crs(OGRLayer& layer, const CheckPointSource& src) {
  OGRSpatialReference srs;
  if (const OGRSpatialReference* own = layer.GetSpatialRef(); states_crs(own)) {
    srs = *own;
  } else if (src.crs) {
    if (srs.SetFromUserInput(src.crs->c_str()) != OGRERR_NONE) {
      throw_input_error(src.path, "the points' CRS '" + *src.crs + "' is not one PROJ knows");
    }
  } else {
    throw_input_error(src.path, fmt::format("layer '{}' states no CRS; give the points' CRS "
                                            "(for instance --points-crs EPSG:32632)",
                                            layer.GetName()));
  }
  srs.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  return srs;
}

}  // namespace

double height_unit_metres(const std::string& unit, const std::string& what) {
  if (unit == "m") return 1;
  if (unit == "ft") return 0.3048;            // international foot (1959)
  if (unit == "us-ft") return 1200.0 / 3937;  // US survey foot
  throw_input_error(what, "expected a height unit m, ft or us-ft, not '" + unit + "'");
}

CheckPointSet read_check_points(const CheckPointSource& src, const OGRSpatialReference* target) {
  DatasetPtr ds = open_vector(src.path);
  OGRLayer* layer = pick_layer(*ds, src);
  OGRFeatureDefn& defn = *layer->GetLayerDefn();
  CheckPointSet set;
  set.layer_name = layer->GetName();
  const std::string where = fmt::format("{} layer '{}'", src.path, set.layer_name);

  int z_field = -1;
  if (src.heights_required) {
    z_field = find_field(defn, src.height_field, kUsualHeightFields);
    if (z_field < 0) {
      throw_input_error(where,
                        fmt::format("no height field {}(fields: {}); name it with "
                                    "--height-field",
                                    src.height_field.empty() ? "" : "'" + src.height_field + "' ",
                                    field_names(defn)));
    }
    OGRFieldType t = defn.GetFieldDefn(z_field)->GetType();
    if (t != OFTReal && t != OFTInteger && t != OFTInteger64) {
      throw_input_error(where, fmt::format("field '{}' holds no numbers; heights must be numeric",
                                           defn.GetFieldDefn(z_field)->GetNameRef()));
    }
    set.height_field = defn.GetFieldDefn(z_field)->GetNameRef();
  }
  int id_field = find_field(defn, src.id_field, {"id"});
  if (!src.id_field.empty() && id_field < 0) {
    throw_input_error(
        where, fmt::format("no ID field '{}' (fields: {})", src.id_field, field_names(defn)));
  }
  int cover_field = -1;
  if (!src.cover_field.empty()) {
    cover_field = defn.GetFieldIndex(src.cover_field.c_str());
    if (cover_field < 0) {
      throw_input_error(where, fmt::format("no land-cover field '{}' (fields: {})", src.cover_field,
                                           field_names(defn)));
    }
  }

  OGRSpatialReference srs = points_crs(*layer, src);
  CoordinateTransformPtr to_target;
  if (target && !srs.IsSame(target)) {
    to_target.reset(OGRCreateCoordinateTransformation(&srs, target));
    if (!to_target) {
      throw_input_error(where, "PROJ finds no transformation from the points' CRS to the DEM's");
    }
  }

  GdalErrorScope errors;
  layer->ResetReading();
  std::size_t with_height = 0;
  for (FeaturePtr f(layer->GetNextFeature()); f; f.reset(layer->GetNextFeature())) {
    const OGRGeometry* g = f->GetGeometryRef();
    if (!g || g->IsEmpty() || wkbFlatten(g->getGeometryType()) != wkbPoint) continue;
    const auto* p = g->toPoint();
    CheckPoint cp;
    double x = p->getX(), y = p->getY();
    if (to_target && !to_target->Transform(1, &x, &y)) {
      throw_input_error(
          where, fmt::format("point {} cannot be transformed into the DEM's CRS", f->GetFID()));
    }
    cp.xy = {x, y};
    cp.id = id_field >= 0 && f->IsFieldSetAndNotNull(id_field)
                ? std::string(f->GetFieldAsString(id_field))
                : fmt::format("#{}", f->GetFID());
    if (z_field >= 0 && f->IsFieldSetAndNotNull(z_field)) {
      cp.z_m = f->GetFieldAsDouble(z_field) * src.height_unit_m;
      ++with_height;
    }
    if (cover_field >= 0 && f->IsFieldSetAndNotNull(cover_field)) {
      cp.cover = f->GetFieldAsString(cover_field);
    }
    set.points.push_back(std::move(cp));
  }
  if (set.points.empty()) throw_input_error(where, "no point features");
  if (src.heights_required && with_height == 0) {
    throw_input_error(where, fmt::format("no point has a height in field '{}'", set.height_field));
  }
  return set;
}

}  // namespace sheetmill::accuracy
