#include "sheetmill/contours/contour_layer.hpp"

#include <cpl_conv.h>
#include <ogr_spatialref.h>
#include <ogrsf_frmts.h>

#include <chrono>
#include <cmath>

#include "contours/dem_sampling.hpp"
#include "contours/depression.hpp"
#include "contours/orient.hpp"
#include "sheetmill/contours/contour_labels.hpp"
#include "sheetmill/contours/generate.hpp"
#include "sheetmill/contours/ground_plane.hpp"
#include "sheetmill/contours/prepare.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/caution.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/terrain/dem_source.hpp"
#include "sheetmill/text/collision_index.hpp"

namespace sheetmill::contours {

namespace {

void write_label_layer(GDALDataset& ds, const std::vector<LabelPoint>& labels,
                       const OGRSpatialReference* srs, const std::filesystem::path& out) {
  GdalErrorScope errors;
  const std::string description = std::string("DESCRIPTION=") + kProductCaution;
  const char* lco[] = {"SPATIAL_INDEX=YES", description.c_str(), nullptr};
  OGRLayer* layer = ds.CreateLayer("contour_labels", const_cast<OGRSpatialReference*>(srs),
                                   wkbPoint, const_cast<char**>(lco));
  if (!layer)
    throw_input_error(out.string(), "cannot create the layer: " +
                                        library_write_failure(out, errors.last_failure()));
  OGRFieldDefn elev("elevation", OFTReal), text("text", OFTString), angle("angle_deg", OFTReal),
      up("up_deg", OFTReal);
  for (OGRFieldDefn* f : {&elev, &text, &angle, &up}) layer->CreateField(f);
  ds.StartTransaction();
  OGRFeatureDefn* defn = layer->GetLayerDefn();
  for (const auto& l : labels) {
    FeaturePtr f(OGRFeature::CreateFeature(defn));
    f->SetField(0, l.elevation);
    f->SetField(1, l.text.c_str());
    f->SetField(2, l.angle_deg);
    f->SetField(3, l.up_deg);
    f->SetGeometryDirectly(new OGRPoint(l.ground.x, l.ground.y));
    if (layer->CreateFeature(f.get()) != OGRERR_NONE)
      throw_input_error(out.string(), "cannot write a feature: " +
                                          library_write_failure(out, errors.last_failure()));
  }
  if (ds.CommitTransaction() != OGRERR_NONE)
    throw_input_error(out.string(), "cannot write the GeoPackage: " +
                                        library_write_failure(out, errors.last_failure()));
}

// Page (y down, clockwise angles) to ground (y up, counter-clockwise), degrees in [0, 360).
double ground_degrees(double page_x, double page_y) {
  double a = std::atan2(-page_y, page_x) * 180.0 / M_PI;
  return a < 0 ? a + 360.0 : a;
}

}  // namespace

std::vector<LabelPoint> place_labels(const std::vector<ContourLine>& lines, const terrain::Dem& dem,
                                     const ContourParams& params, const style::ContourStyle& style,
                                     double unit_m) {
  MapFrame frame;
  frame.scale_denominator = params.scale_denominator;
  frame.ground = dem.grid.bounds();
  frame.crs_wkt = dem.grid.crs_wkt;
  text::FontCache fonts;
  ContourLabels cl = contour_label_candidates(lines, dem, frame, style, fonts, unit_m);
  text::CollisionIndex index(frame.page_box_mm());
  labels::place(cl.candidates, index);
  std::vector<LabelPoint> out;
  for (std::size_t i = 0; i < cl.candidates.size(); ++i) {
    const auto& chosen = cl.candidates[i].chosen;
    if (!chosen) continue;
    const LabelGeometry& g = cl.geometry[i][*chosen];
    const ContourLine& line = lines[g.line];
    LabelPoint p;
    p.ground = frame.to_ground(g.centre_mm);
    p.elevation = std::round(line.elevation_m / unit_m * 1e6) / 1e6;  // whole levels
    p.text = contour_label_text(line, style, unit_m);
    p.angle_deg = ground_degrees(std::cos(g.angle_rad), std::sin(g.angle_rad));
    p.up_deg = ground_degrees(g.up_mm.x, g.up_mm.y);
    out.push_back(std::move(p));
  }
  return out;
}

void write_geopackage(const std::filesystem::path& out, const std::vector<ContourLine>& lines,
                      const std::string& crs_wkt, const std::vector<LabelPoint>* labels,
                      double unit_m) {
  gdal_init();
  GdalErrorScope errors;
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GPKG");
  if (!drv) throw_internal_error("GDAL has no GeoPackage driver");
  AtomicOutput file(out);
  file.clear_temp_for_writer();  // the GeoPackage driver will not create over an existing file
  {
    DatasetPtr ds(drv->Create(file.temp_path().c_str(), 0, 0, 0, GDT_Unknown, nullptr));
    if (!ds)
      throw_input_error(out.string(), "cannot create a GeoPackage: " +
                                          library_write_failure(out, errors.last_failure()));
    OGRSpatialReference srs;
    bool has_srs = !crs_wkt.empty() && srs.importFromWkt(crs_wkt.c_str()) == OGRERR_NONE;
    const std::string description = std::string("DESCRIPTION=") + kProductCaution;
    const char* lco[] = {"SPATIAL_INDEX=YES", description.c_str(), nullptr};
    OGRLayer* layer = ds->CreateLayer("contours", has_srs ? &srs : nullptr, wkbLineString,
                                      const_cast<char**>(lco));
    if (!layer)
      throw_input_error(out.string(), "cannot create the layer: " +
                                          library_write_failure(out, errors.last_failure()));
    OGRFieldDefn elev("elevation", OFTReal);
    layer->CreateField(&elev);
    for (const char* name : {"index", "depression", "supplementary", "depth", "coastline"}) {
      OGRFieldDefn f(name, OFTInteger);
      f.SetSubType(OFSTBoolean);
      layer->CreateField(&f);
    }
    ds->StartTransaction();
    OGRFeatureDefn* defn = layer->GetLayerDefn();
    for (const auto& l : lines) {
      FeaturePtr f(OGRFeature::CreateFeature(defn));
      // Levels are whole multiples of the interval in the unit: no 99.99999 ft.
      f->SetField(0, std::round(l.elevation_m / unit_m * 1e6) / 1e6);
      f->SetField(1, l.index ? 1 : 0);
      f->SetField(2, l.depression ? 1 : 0);
      f->SetField(3, l.supplementary ? 1 : 0);
      f->SetField(4, l.depth ? 1 : 0);
      f->SetField(5, l.coastline ? 1 : 0);
      auto* ls = new OGRLineString();
      ls->setNumPoints(static_cast<int>(l.ground.size() + (l.closed ? 1 : 0)), FALSE);
      for (std::size_t i = 0; i < l.ground.size(); ++i)
        ls->setPoint(static_cast<int>(i), l.ground[i].x, l.ground[i].y);
      if (l.closed) ls->setPoint(static_cast<int>(l.ground.size()), l.ground[0].x, l.ground[0].y);
      f->SetGeometryDirectly(ls);
      if (layer->CreateFeature(f.get()) != OGRERR_NONE)
        throw_input_error(out.string(), "cannot write a feature: " +
                                            library_write_failure(out, errors.last_failure()));
    }
    if (ds->CommitTransaction() != OGRERR_NONE)
      throw_input_error(out.string(), "cannot write the GeoPackage: " +
                                          library_write_failure(out, errors.last_failure()));
    if (labels) write_label_layer(*ds, *labels, has_srs ? &srs : nullptr, out);
    errors.clear();
    ds.reset();  // closes the file (GDAL 3.6 reports close errors through CPLError only)
    if (!errors.last_failure().empty())
      throw_input_error(out.string(), "cannot finish the GeoPackage: " +
                                          library_write_failure(out, errors.last_failure()));
  }
  // Read back before the rename: SQLite reports a full disk at commit, but a file cut short at
  // close would only show when opened.
  {
    GdalErrorScope reading;
    DatasetPtr back(GDALDataset::Open(file.temp_path().c_str(), GDAL_OF_VECTOR | GDAL_OF_READONLY));
    OGRLayer* layer = back ? back->GetLayerByName("contours") : nullptr;
    if (!layer || layer->GetFeatureCount() != static_cast<GIntBig>(lines.size())) {
      throw_input_error(out.string(), "the written GeoPackage does not read back whole (" +
                                          library_write_failure(out, reading.last_failure()) + ")");
    }
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
      detail::classify_loop(l, *dem, *sampler);
    } else {
      l.uphill_known = false;
    }
    mark_depth(l, params);
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
                               ContourParams params, const ContourFileOptions& options) {
  // Compressed GeoTIFF blocks are decoded on all cores (GDAL's multi-threaded decoding, read
  // when the dataset opens); a user's own setting wins.
  CPLConfigOptionSetter threads("GDAL_NUM_THREADS", "ALL_CPUS", true);
  terrain::DemReadOptions read_options;
  read_options.assumed_crs = options.dem_crs;
  terrain::DemSource source(dem_path, read_options);
  if (options.labels && source.crs().IsGeographic()) {
    throw_input_error(dem_path,
                      "--labels needs a DEM in a projected CRS (labels are placed in mm at the "
                      "scale); warp it to one first");
  }
  using Clock = std::chrono::steady_clock;
  auto since = [](Clock::time_point t) {
    return std::chrono::duration<double>(Clock::now() - t).count();
  };
  auto t0 = Clock::now();
  terrain::Dem dem = source.read_all();
  const double t_read = since(t0);
  ContourFileReport report;
  const double unit_m = options.unit_m ? *options.unit_m : terrain::vertical_unit_m(dem_path);
  report.unit = height_unit(unit_m);
  params.interval_m *= unit_m;
  params.base_m *= unit_m;
  if (params.sea_level_m) *params.sea_level_m *= unit_m;
  if (params.interval_m == 0) {
    auto [lo, hi] = elevation_range(dem);
    if (!std::isnan(lo) && hi > lo) {
      params.interval_m = propose_interval_m(params.scale_denominator, hi - lo, unit_m);
      log::info("contour interval {:g} {} proposed for 1:{:.0f} and {:.0f} m of relief",
                params.interval_m / unit_m, report.unit.symbol, params.scale_denominator, hi - lo);
    } else {
      params.interval_m = 1;  // generate() names the real problem below
    }
  }
  std::vector<ContourLine> lines;
  t0 = Clock::now();
  double t_prepare = 0;
  ContourFileReport measured;
  try {
    lines = generate_raw(dem, params);
    // Paper lengths are ground lengths: a grid not in ground metres is measured (and prepared)
    // in a local plane; the written lines stay in the DEM's CRS.
    std::optional<GroundPlane> plane = GroundPlane::for_grid(dem.grid);
    auto t1 = Clock::now();
    std::vector<ContourLine> in_plane;
    if (plane) {
      in_plane = options.prepare ? std::move(lines) : lines;
      plane->to_plane(in_plane);
    }
    std::vector<ContourLine>& metric = plane ? in_plane : lines;
    if (options.prepare)
      prepare_for_print(metric, params, plane ? plane->cell_m() : detail::DemSampler(dem).cell_m());
    for (const auto& l : metric) {
      measured.length_m += line_length(l);
      measured.closed += l.closed;
    }
    if (plane && options.prepare) {
      plane->from_plane(in_plane);
      lines = std::move(in_plane);
    }
    t_prepare = since(t1);
  } catch (const Error& e) {
    if (e.kind() == Error::Kind::input && e.where().file.empty()) {
      SourceLocation where = e.where();
      where.file = dem_path;
      throw_input_error(where, e.message());
    }
    throw;
  }
  const double t_generate = since(t0) - t_prepare;
  t0 = Clock::now();
  std::vector<LabelPoint> labels;
  if (options.labels) labels = place_labels(lines, dem, params, options.style, unit_m);
  const double t_labels = since(t0);
  t0 = Clock::now();
  write_geopackage(out, lines, dem.grid.crs_wkt, options.labels ? &labels : nullptr, unit_m);
  log::debug(
      "contours: read {:.2f} s, generated {:.2f} s, prepared {:.2f} s, labels {:.2f} s, "
      "written {:.2f} s",
      t_read, t_generate, t_prepare, t_labels, since(t0));
  report.labels = static_cast<long>(labels.size());
  report.interval = params.interval_m / unit_m;
  report.lines = static_cast<long>(lines.size());
  report.closed = measured.closed;
  report.length_m = measured.length_m;
  for (const auto& l : lines) report.vertices += static_cast<long>(l.ground.size());
  return report;
}

}  // namespace sheetmill::contours
