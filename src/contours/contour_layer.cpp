#include "sheetmill/contours/contour_layer.hpp"

#include <ogr_spatialref.h>
#include <ogrsf_frmts.h>

#include <cmath>

#include "contours/dem_sampling.hpp"
#include "contours/orient.hpp"
#include "sheetmill/contours/generate.hpp"
#include "sheetmill/contours/prepare.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/terrain/dem_source.hpp"

namespace sheetmill::contours {

void write_geopackage(const std::filesystem::path& out, const std::vector<ContourLine>& lines,
                      const std::string& crs_wkt) {
  gdal_init();
  GdalErrorScope errors;
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GPKG");
  if (!drv) throw_internal_error("GDAL has no GeoPackage driver");
  AtomicOutput file(out);
  {
    DatasetPtr ds(drv->Create(file.temp_path().c_str(), 0, 0, 0, GDT_Unknown, nullptr));
    if (!ds)
      throw_input_error(out.string(), "cannot create a GeoPackage: " + errors.last_failure());
    OGRSpatialReference srs;
    bool has_srs = !crs_wkt.empty() && srs.importFromWkt(crs_wkt.c_str()) == OGRERR_NONE;
    const char* lco[] = {"SPATIAL_INDEX=YES", nullptr};
    OGRLayer* layer = ds->CreateLayer("contours", has_srs ? &srs : nullptr, wkbLineString,
                                      const_cast<char**>(lco));
    if (!layer)
      throw_input_error(out.string(), "cannot create the layer: " + errors.last_failure());
    OGRFieldDefn elev("elevation", OFTReal);
    layer->CreateField(&elev);
    for (const char* name : {"index", "depression", "supplementary"}) {
      OGRFieldDefn f(name, OFTInteger);
      f.SetSubType(OFSTBoolean);
      layer->CreateField(&f);
    }
    ds->StartTransaction();
    OGRFeatureDefn* defn = layer->GetLayerDefn();
    for (const auto& l : lines) {
      FeaturePtr f(OGRFeature::CreateFeature(defn));
      f->SetField(0, l.elevation_m);
      f->SetField(1, l.index ? 1 : 0);
      f->SetField(2, l.depression ? 1 : 0);
      f->SetField(3, l.supplementary ? 1 : 0);
      auto* ls = new OGRLineString();
      ls->setNumPoints(static_cast<int>(l.ground.size() + (l.closed ? 1 : 0)), FALSE);
      for (std::size_t i = 0; i < l.ground.size(); ++i)
        ls->setPoint(static_cast<int>(i), l.ground[i].x, l.ground[i].y);
      if (l.closed) ls->setPoint(static_cast<int>(l.ground.size()), l.ground[0].x, l.ground[0].y);
      f->SetGeometryDirectly(ls);
      if (layer->CreateFeature(f.get()) != OGRERR_NONE)
        throw_input_error(out.string(), "cannot write a feature: " + errors.last_failure());
    }
    if (ds->CommitTransaction() != OGRERR_NONE)
      throw_input_error(out.string(), "cannot write the GeoPackage: " + errors.last_failure());
    errors.clear();
    ds.reset();  // closes the file (GDAL 3.6 reports close errors through CPLError only)
    if (!errors.last_failure().empty())
      throw_input_error(out.string(), "cannot finish the GeoPackage: " + errors.last_failure());
  }
  file.commit();
}

std::vector<ContourLine> read_layer(const std::string& path, const std::string& layer_name,
                                    const std::string& elevation_field, const Box& ground,
                                    const std::string& target_crs_wkt, const ContourParams& params,
                                    const terrain::Dem* dem) {
  validate(params);
  DatasetPtr ds = open_vector(path);
  GdalErrorScope errors;
  OGRLayer* layer = layer_name.empty() ? ds->GetLayer(0) : ds->GetLayerByName(layer_name.c_str());
  if (!layer) throw_input_error(path, "no layer named '" + layer_name + "'");
  OGRFeatureDefn* defn = layer->GetLayerDefn();
  int field = defn->GetFieldIndex(elevation_field.c_str());
  if (field < 0) {
    std::string names;
    for (int i = 0; i < defn->GetFieldCount(); ++i)
      names += (i ? ", " : "") + std::string(defn->GetFieldDefn(i)->GetNameRef());
    throw_input_error(path, "layer '" + std::string(layer->GetName()) +
                                "' has no elevation field '" + elevation_field +
                                "' (its fields: " + (names.empty() ? "none" : names) + ")");
  }
  // Bring lines into the sheet CRS; filter by the sheet's box in the layer's own CRS.
  CoordinateTransformPtr to_sheet;
  const OGRSpatialReference* src = layer->GetSpatialRef();
  OGRSpatialReference dst;
  if (src && !target_crs_wkt.empty() && dst.importFromWkt(target_crs_wkt.c_str()) == OGRERR_NONE &&
      !src->IsSame(&dst)) {
    dst.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
    OGRSpatialReference s2(*src);
    s2.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
    to_sheet.reset(OGRCreateCoordinateTransformation(&s2, &dst));
    if (!to_sheet) throw_input_error(path, "cannot transform the layer's CRS to the sheet's");
    CoordinateTransformPtr back(OGRCreateCoordinateTransformation(&dst, &s2));
    double x0, y0, x1, y1;
    if (back && !ground.empty() &&
        back->TransformBounds(ground.min_x, ground.min_y, ground.max_x, ground.max_y, &x0, &y0, &x1,
                              &y1, 21)) {
      layer->SetSpatialFilterRect(x0, y0, x1, y1);
    }
  } else if (!ground.empty()) {
    layer->SetSpatialFilterRect(ground.min_x, ground.min_y, ground.max_x, ground.max_y);
  }
  std::vector<ContourLine> lines;
  std::optional<detail::DemSampler> sampler;
  if (dem) sampler.emplace(*dem);
  auto take = [&](const OGRLineString& ls, double z) {
    int n = ls.getNumPoints();
    if (n < 2) return;
    ContourLine l;
    l.elevation_m = z;
    for (int i = 0; i < n; ++i) l.ground.push_back({ls.getX(i), ls.getY(i)});
    if (n >= 4 && l.ground.front().x == l.ground.back().x &&
        l.ground.front().y == l.ground.back().y) {
      l.closed = true;
      l.ground.pop_back();
    }
    l.index = level_number(z, params) % params.index_every == 0;
    if (sampler) {
      detail::orient_uphill_left(l, *sampler);
      if (l.closed) l.depression = l.uphill_known && detail::signed_area(l.ground) < 0;
    } else {
      l.uphill_known = false;
    }
    lines.push_back(std::move(l));
  };
  for (auto& f : *layer) {
    if (!f->IsFieldSetAndNotNull(field)) continue;
    double z = f->GetFieldAsDouble(field);
    OGRGeometry* g = f->GetGeometryRef();
    if (!g) continue;
    if (to_sheet && g->transform(to_sheet.get()) != OGRERR_NONE) continue;
    auto type = wkbFlatten(g->getGeometryType());
    if (type == wkbLineString) {
      take(*g->toLineString(), z);
    } else if (type == wkbMultiLineString) {
      for (const auto* part : *g->toMultiLineString()) take(*part, z);
    }
  }
  prepare_for_print(lines, params, dem ? detail::DemSampler(*dem).cell_m() : 0);
  return lines;
}

ContourFileReport contour_file(const std::string& dem_path, const std::filesystem::path& out,
                               ContourParams params, bool prepare) {
  terrain::DemSource source(dem_path);
  terrain::Dem dem = source.read_all();
  ContourFileReport report;
  if (params.interval_m == 0) {
    auto [lo, hi] = elevation_range(dem);
    if (!std::isnan(lo) && hi > lo) {
      params.interval_m = propose_interval_m(params.scale_denominator, hi - lo);
      log::info("contour interval {} m proposed for 1:{:.0f} and {:.0f} m of relief",
                params.interval_m, params.scale_denominator, hi - lo);
    } else {
      params.interval_m = 1;  // generate() names the real problem below
    }
  }
  std::vector<ContourLine> lines;
  try {
    lines = prepare ? generate(dem, params) : generate_raw(dem, params);
  } catch (const Error& e) {
    if (e.kind() == Error::Kind::input && e.where().file.empty()) {
      SourceLocation where = e.where();
      where.file = dem_path;
      throw_input_error(where, e.message());
    }
    throw;
  }
  write_geopackage(out, lines, dem.grid.crs_wkt);
  report.interval_m = params.interval_m;
  report.lines = static_cast<long>(lines.size());
  for (const auto& l : lines) {
    report.vertices += static_cast<long>(l.ground.size());
    report.length_m += line_length(l);
  }
  return report;
}

}  // namespace sheetmill::contours
