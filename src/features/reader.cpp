#include "sheetmill/features/reader.hpp"

#include <ogr_spatialref.h>

#include <set>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/plural.hpp"
#include "sheetmill/core/utf8.hpp"
#include "sheetmill/features/clip.hpp"

namespace sheetmill::features {

namespace {

Polyline ring_points(const OGRLinearRing& ring) {
  Polyline out;
  int n = ring.getNumPoints();
  out.reserve(n);
  for (int i = 0; i < n; ++i) out.push_back({ring.getX(i), ring.getY(i)});
  // Rings are delivered open.
  if (out.size() >= 2 && out.front().x == out.back().x && out.front().y == out.back().y)
    out.pop_back();
  return out;
}

// Converts a (linear) geometry into the feature's parts, clipped to `box`.
void collect(const OGRGeometry& g, const Box& box, Feature& f) {
  switch (wkbFlatten(g.getGeometryType())) {
    case wkbPoint: {
      auto& p = *g.toPoint();
      if (p.IsEmpty()) return;
      Point pt{p.getX(), p.getY()};
      if (box.contains(pt)) f.points.push_back(pt);
      return;
    }
    case wkbLineString: {
      auto& l = *g.toLineString();
      Polyline line;
      line.reserve(l.getNumPoints());
      for (int i = 0; i < l.getNumPoints(); ++i) line.push_back({l.getX(i), l.getY(i)});
      clip_polyline(line, box, f.lines);
      return;
    }
    case wkbPolygon: {
      auto& poly = *g.toPolygon();
      if (poly.IsEmpty()) return;
      Polygon out;
      out.outer = ring_points(*poly.getExteriorRing());
      for (int i = 0; i < poly.getNumInteriorRings(); ++i)
        out.holes.push_back(ring_points(*poly.getInteriorRing(i)));
      if (clip_polygon(out, box)) f.polygons.push_back(std::move(out));
      return;
    }
    case wkbMultiPoint:
    case wkbMultiLineString:
    case wkbMultiPolygon:
    case wkbGeometryCollection: {
      for (const OGRGeometry* part : *g.toGeometryCollection()) collect(*part, box, f);
      return;
    }
    default:
      log::debug("skipping geometry of type {}", g.getGeometryName());
  }
}

[[noreturn]] void missing(const project::Source& source, const std::string& why) {
  throw_input_error(source.path, "source '" + source.name + "': " + why);
}

// Names and field values become label text, file names and log lines: they must be text. The
// sheet is refused, naming the feature, rather than drawn with broken or missing names
// (docs/features.md, text fields).
void check_text(const std::string& value, const project::Source& source, const char* field,
                long long fid) {
  if (auto bad = first_invalid_utf8(value)) {
    missing(source, "feature " + std::to_string(fid) + ", field '" + field +
                        "': " + quote_untrusted(value) + " is not valid UTF-8 (byte " +
                        std::to_string(*bad + 1) + "); store the text as UTF-8");
  }
}

}  // namespace

ReadSummary read_features(const project::Source& source, const ReadRequest& request,
                          const FeatureSink& sink) {
  ReadSummary summary;
  DatasetPtr ds;
  OGRLayer* layer = nullptr;
  try {
    ds = open_vector(source.path);
    layer = source.layer.empty() ? ds->GetLayer(0) : ds->GetLayerByName(source.layer.c_str());
    if (!layer)
      missing(source, source.layer.empty() ? "no layer" : "no layer '" + source.layer + "'");
  } catch (const Error& e) {
    if (source.required) throw;
    log::warn("optional source '{}' not drawn: {}", source.name, e.message());
    summary.found = false;
    return summary;
  }

  GdalErrorScope errors;

  // CRS: the layer's own; a layer without one is taken to be in the sheet CRS.
  OGRSpatialReference sheet_srs;
  if (sheet_srs.SetFromUserInput(request.sheet_crs_wkt.c_str()) != OGRERR_NONE)
    throw_internal_error("sheet CRS not understood by OGR");
  sheet_srs.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  CoordinateTransformPtr to_sheet, to_source;
  if (const OGRSpatialReference* layer_srs = layer->GetSpatialRef()) {
    OGRSpatialReference src_srs(*layer_srs);
    src_srs.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
    if (!src_srs.IsSame(&sheet_srs)) {
      to_sheet.reset(OGRCreateCoordinateTransformation(&src_srs, &sheet_srs));
      to_source.reset(OGRCreateCoordinateTransformation(&sheet_srs, &src_srs));
      if (!to_sheet || !to_source)
        missing(source,
                "no transformation from its CRS to the sheet CRS (" + errors.last_failure() + ")");
    }
  } else {
    log::warn("source '{}' has no CRS; taken to be in the sheet CRS", source.name);
  }

  // Spatial filter in the source CRS: the clip box with densified edges (21 points per edge),
  // so a curved image of a straight frame edge is covered.
  const Box& clip = request.clip_ground;
  if (!to_source) {
    layer->SetSpatialFilterRect(clip.min_x, clip.min_y, clip.max_x, clip.max_y);
  } else {
    double x0, y0, x1, y1;
    if (to_source->TransformBounds(clip.min_x, clip.min_y, clip.max_x, clip.max_y, &x0, &y0, &x1,
                                   &y1, 21)) {
      layer->SetSpatialFilterRect(x0, y0, x1, y1);
    } else {
      log::debug("source '{}': frame not transformable to its CRS; reading unfiltered",
                 source.name);
      layer->SetSpatialFilter(nullptr);
    }
  }

  if (!source.where.empty()) {
    if (layer->SetAttributeFilter(source.where.c_str()) != OGRERR_NONE)
      throw_input_error(source.path, "source '" + source.name +
                                         "': where: not an OGR SQL filter: " + source.where + " (" +
                                         errors.last_failure() + ")");
  } else {
    layer->SetAttributeFilter(nullptr);
  }

  // Only the requested fields are read (the driver may skip the rest).
  OGRFeatureDefn* defn = layer->GetLayerDefn();
  std::vector<int> index;
  std::set<std::string> wanted(request.fields.begin(), request.fields.end());
  for (const std::string& name : request.fields) {
    int i = defn->GetFieldIndex(name.c_str());
    if (i < 0) log::debug("source '{}' has no field '{}'", source.name, name);
    index.push_back(i);
  }
  std::vector<std::string> ignored_names;
  for (int i = 0; i < defn->GetFieldCount(); ++i) {
    std::string n = defn->GetFieldDefn(i)->GetNameRef();
    if (!wanted.count(n)) ignored_names.push_back(n);
  }
  ignored_names.push_back("OGR_STYLE");
  std::vector<const char*> ignored;
  for (const auto& n : ignored_names) ignored.push_back(n.c_str());
  ignored.push_back(nullptr);
  layer->SetIgnoredFields(ignored.data());

  layer->ResetReading();
  Feature f;
  for (FeaturePtr feat(layer->GetNextFeature()); feat; feat.reset(layer->GetNextFeature())) {
    ++summary.read;
    OGRGeometry* g = feat->GetGeometryRef();
    if (!g || g->IsEmpty()) continue;
    GeometryPtr linear;
    if (g->hasCurveGeometry()) {
      linear.reset(g->getLinearGeometry());
      g = linear.get();
      if (!g) continue;
    }
    if (to_sheet && g->transform(to_sheet.get()) != OGRERR_NONE) {
      ++summary.failed;
      continue;
    }
    f.clear();
    collect(*g, clip, f);
    if (f.empty()) continue;
    f.fid = feat->GetFID();
    f.values.resize(index.size());
    for (std::size_t k = 0; k < index.size(); ++k) {
      int i = index[k];
      if (i >= 0 && feat->IsFieldSetAndNotNull(i)) {
        f.values[k] = feat->GetFieldAsString(i);
        check_text(*f.values[k], source, layer->GetLayerDefn()->GetFieldDefn(i)->GetNameRef(),
                   f.fid);
      } else
        f.values[k].reset();
    }
    ++summary.delivered;
    sink(f);
  }
  // Some drivers (SQLite-based ones) only parse the filter when reading starts.
  if (!source.where.empty() && !errors.last_failure().empty())
    throw_input_error(source.path, "source '" + source.name + "': where: not an OGR SQL filter: " +
                                       source.where + " (" + errors.last_failure() + ")");
  if (summary.failed)
    log::warn("source '{}': {} could not be reprojected to the sheet CRS", source.name,
              counted(summary.failed, "feature"));
  return summary;
}

}  // namespace sheetmill::features
