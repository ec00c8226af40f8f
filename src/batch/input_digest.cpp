#include "sheetmill/batch/input_digest.hpp"

#include <fmt/format.h>
#include <ogr_spatialref.h>
#include <ogrsf_frmts.h>

#include <algorithm>
#include <cmath>
#include <fstream>
#include <optional>
#include <set>

#include "sheetmill/batch/sha256.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/sheet/sheet_info.hpp"

namespace sheetmill::batch {
namespace fs = std::filesystem;

DigestInputs digest_inputs_for(const project::Project& p, const style::Style& style,
                               const std::string& index_crs_wkt,
                               const std::string& program_version) {
  DigestInputs in;
  in.program_version = program_version;
  in.files.push_back(p.file);
  if (!p.style.empty()) in.files.push_back(p.style);
  if (p.magnetic.model_file) in.files.emplace_back(*p.magnetic.model_file);
  // The accuracy statement in the notes comes from every check point, on the sheet or not.
  if (p.accuracy && fs::is_regular_file(p.accuracy->points)) {
    in.files.emplace_back(p.accuracy->points);
  }
  std::set<std::string> seen;
  for (const style::Layer& layer : style.layers) {
    bool shown = (layer.min_scale <= 0 || p.scale >= layer.min_scale) &&
                 (layer.max_scale <= 0 || p.scale <= layer.max_scale);
    if (!shown || layer.source.empty() || !seen.insert(layer.source).second) continue;
    try {
      project::Source s = project::source_for(p, layer.source);
      in.vectors.push_back({layer.source, s.path, s.layer, s.where, s.required});
    } catch (const Error&) {
      // The renderer leaves a layer without a source off the sheet (with a warning): it reads
      // nothing, so nothing to digest.
    }
  }
  if (p.contours.from_layer) {
    const auto& s = *p.contours.from_layer;
    in.vectors.push_back({"contours", s.path, s.layer, s.where, s.required});
  }
  if (p.tile_index) {
    // The sheet's neighbours in the index: their IDs and names are in the collar's diagrams.
    in.vectors.push_back({kTileIndexSource, p.tile_index->path, p.tile_index->layer, "", true});
  }
  in.dem_path = p.elevation.dem;
  in.index_crs_wkt = index_crs_wkt;
  in.margin_m = 10.0 * p.scale / 1000.0;  // 10 mm on paper
  return in;
}

namespace {

std::string file_digest(const fs::path& path) {
  std::ifstream f(path, std::ios::binary);
  if (!f) throw_input_error(path.string(), "cannot read (needed for the batch's input digest)");
  Sha256 h;
  char buf[65536];
  while (f) {
    f.read(buf, sizeof buf);
    h.update(buf, static_cast<std::size_t>(f.gcount()));
  }
  return h.hex();
}

std::unique_ptr<OGRSpatialReference> srs_from_wkt(const std::string& wkt) {
  if (wkt.empty()) return nullptr;
  auto srs = std::make_unique<OGRSpatialReference>();
  if (srs->importFromWkt(wkt.c_str()) != OGRERR_NONE) return nullptr;
  srs->SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  return srs;
}

// A transformation from the index CRS to `target` (null when either is unknown or they match).
CoordinateTransformPtr transform_to(const OGRSpatialReference* index_srs,
                                    const OGRSpatialReference* target) {
  if (!index_srs || !target || index_srs->IsSame(target)) return nullptr;
  OGRSpatialReference t(*target);
  t.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
  return CoordinateTransformPtr(OGRCreateCoordinateTransformation(index_srs, &t));
}

Box transformed(const Box& b, OGRCoordinateTransformation* ct) {
  if (!ct) return b;
  Box out;
  if (!ct->TransformBounds(b.min_x, b.min_y, b.max_x, b.max_y, &out.min_x, &out.min_y, &out.max_x,
                           &out.max_y, 21)) {
    throw_input_error("tile index", "a sheet footprint cannot be transformed to a source's CRS");
  }
  return out;
}

struct OpenVector {
  DatasetPtr ds;
  OGRLayer* layer = nullptr;
  CoordinateTransformPtr ct;
  bool absent = false;
};

struct OpenDem {
  DatasetPtr ds;
  CoordinateTransformPtr ct;
  double gt[6] = {0, 1, 0, 0, 0, -1};
  bool north_up = true;
  std::string header;  // size, georeferencing, CRS, nodata: hashed with every window
};

}  // namespace

struct InputDigester::Impl {
  DigestInputs in;
  std::unique_ptr<OGRSpatialReference> index_srs;
  std::map<std::string, std::string> file_parts;
  std::map<std::string, OpenVector> vectors;
  std::optional<OpenDem> dem;

  OpenVector& vector(const DigestInputs::Vector& v) {
    auto it = vectors.find(v.name);
    if (it != vectors.end()) return it->second;
    OpenVector ov;
    try {
      ov.ds = open_vector(v.path);
      ov.layer = v.layer.empty() ? ov.ds->GetLayer(0) : ov.ds->GetLayerByName(v.layer.c_str());
      if (!ov.layer) throw_input_error(v.path, "has no layer \"" + v.layer + "\"");
      if (!v.where.empty() && ov.layer->SetAttributeFilter(v.where.c_str()) != OGRERR_NONE) {
        throw_input_error(v.path, "the source's filter \"" + v.where + "\" is not valid");
      }
      ov.ct = transform_to(index_srs.get(), ov.layer->GetSpatialRef());
    } catch (const Error&) {
      if (v.required) throw;
      ov = OpenVector{};
      ov.absent = true;
    }
    return vectors.emplace(v.name, std::move(ov)).first->second;
  }

  // The features of `v` in `footprint` (index CRS), or all of them when it is null.
  std::string vector_part(const DigestInputs::Vector& v, const Box* footprint) {
    OpenVector& ov = vector(v);
    if (ov.absent) return "absent";
    if (footprint) {
      Box b = transformed(*footprint, ov.ct.get());
      ov.layer->SetSpatialFilterRect(b.min_x, b.min_y, b.max_x, b.max_y);
    }
    ov.layer->ResetReading();
    // Order-independent: a rewrite of the file in another order is no change.
    std::vector<std::string> features;
    OGRFeatureDefn* defn = ov.layer->GetLayerDefn();
    std::vector<unsigned char> wkb;
    for (auto& f : *ov.layer) {
      Sha256 h;
      for (int k = 0; k < defn->GetFieldCount(); ++k) {
        h.update_field(defn->GetFieldDefn(k)->GetNameRef());
        bool set = f->IsFieldSetAndNotNull(k);
        h.update_field(set ? "v" : "null");
        if (set) h.update_field(f->GetFieldAsString(k));
      }
      if (const OGRGeometry* g = f->GetGeometryRef()) {
        wkb.resize(static_cast<std::size_t>(g->WkbSize()));
        g->exportToWkb(wkbNDR, wkb.data(), wkbVariantIso);
        h.update(wkb.data(), wkb.size());
      }
      features.push_back(h.hex());
    }
    ov.layer->SetSpatialFilter(nullptr);
    std::sort(features.begin(), features.end());
    Sha256 all;
    all.update_field(fmt::format("{} features", features.size()));
    for (const auto& f : features) all.update(f);
    return all.hex();
  }

  // What the collar shows of the index: the neighbours (in `window`) and the location diagram
  // (sheet::kLocationWholeIndex, kLocationReach): all sheets of a small index; for a large one
  // the sheets within reach, and the index's extent and count.
  // The index's own summary, the same for every sheet: computed once per digester (a worker's
  // batch), so a large index does not cost each sheet a pass over it.
  std::optional<GIntBig> index_count;
  std::string index_summary;

  std::string index_part(const DigestInputs::Vector& v, const SheetJob& job, const Box& window) {
    OpenVector& ov = vector(v);
    if (ov.absent) return "absent";
    if (!index_count) {
      index_count = ov.layer->GetFeatureCount();
      if (*index_count <= static_cast<GIntBig>(sheet::kLocationWholeIndex)) {
        index_summary = vector_part(v, nullptr);  // every sheet shows the whole index
      } else {
        OGREnvelope e;
        if (ov.layer->GetExtent(&e, TRUE) != OGRERR_NONE) e = OGREnvelope();
        index_summary =
            fmt::format("{} sheets in {} {} {} {}", *index_count, e.MinX, e.MinY, e.MaxX, e.MaxY);
      }
    }
    if (*index_count <= static_cast<GIntBig>(sheet::kLocationWholeIndex)) return index_summary;
    const Box& f = job.footprint;
    const double rx = sheet::kLocationReach * f.width(), ry = sheet::kLocationReach * f.height();
    Box reach = Box::of(f.min_x - rx, f.min_y - ry, f.max_x + rx, f.max_y + ry);
    reach.add({window.min_x, window.min_y});
    reach.add({window.max_x, window.max_y});
    Sha256 h;
    h.update_field(index_summary);
    h.update_field(vector_part(v, &reach));
    return h.hex();
  }

  OpenDem& open_dem() {
    if (dem) return *dem;
    OpenDem d;
    d.ds = open_raster(in.dem_path);
    d.ds->GetGeoTransform(d.gt);
    d.north_up = d.gt[2] == 0 && d.gt[4] == 0 && d.gt[1] > 0 && d.gt[5] < 0;
    d.ct = transform_to(index_srs.get(), d.ds->GetSpatialRef());
    const char* wkt = d.ds->GetProjectionRef();
    d.header = fmt::format("{}x{}x{} {} {} {} {} {} {} {}", d.ds->GetRasterXSize(),
                           d.ds->GetRasterYSize(), d.ds->GetRasterCount(), d.gt[0], d.gt[1],
                           d.gt[2], d.gt[3], d.gt[4], d.gt[5], wkt ? wkt : "");
    for (int b = 1; b <= d.ds->GetRasterCount(); ++b) {
      int has = 0;
      double nodata = d.ds->GetRasterBand(b)->GetNoDataValue(&has);
      d.header += has ? fmt::format(" nodata{}={}", b, nodata) : "";
    }
    dem = std::move(d);
    return *dem;
  }

  std::string dem_part(const Box& footprint) {
    OpenDem& d = open_dem();
    Sha256 h;
    h.update_field(d.header);
    if (!d.north_up) {
      // A rotated grid: fall back to the file's identity.
      std::error_code ec;
      h.update_field(fmt::format("{} {}", fs::file_size(in.dem_path, ec),
                                 fs::last_write_time(in.dem_path, ec).time_since_epoch().count()));
      return h.hex();
    }
    Box b = transformed(footprint, d.ct.get());
    int w = d.ds->GetRasterXSize(), hgt = d.ds->GetRasterYSize();
    int c0 = std::clamp(static_cast<int>(std::floor((b.min_x - d.gt[0]) / d.gt[1])) - 1, 0, w);
    int c1 = std::clamp(static_cast<int>(std::ceil((b.max_x - d.gt[0]) / d.gt[1])) + 1, 0, w);
    int r0 = std::clamp(static_cast<int>(std::floor((d.gt[3] - b.max_y) / -d.gt[5])) - 1, 0, hgt);
    int r1 = std::clamp(static_cast<int>(std::ceil((d.gt[3] - b.min_y) / -d.gt[5])) + 1, 0, hgt);
    h.update_field(fmt::format("window {} {} {} {}", c0, r0, c1, r1));
    std::vector<double> row(static_cast<std::size_t>(std::max(0, c1 - c0)));
    GdalErrorScope errors;
    for (int band = 1; band <= d.ds->GetRasterCount() && !row.empty(); ++band) {
      GDALRasterBand* rb = d.ds->GetRasterBand(band);
      for (int r = r0; r < r1; ++r) {
        if (rb->RasterIO(GF_Read, c0, r, c1 - c0, 1, row.data(), c1 - c0, 1, GDT_Float64, 0, 0,
                         nullptr) != CE_None) {
          throw_input_error(in.dem_path, "cannot read elevations: " + errors.last_failure());
        }
        h.update(row.data(), row.size() * sizeof(double));
      }
    }
    return h.hex();
  }
};

InputDigester::InputDigester(DigestInputs inputs) : impl_(std::make_unique<Impl>()) {
  gdal_init();
  impl_->in = std::move(inputs);
  impl_->index_srs = srs_from_wkt(impl_->in.index_crs_wkt);
  for (std::size_t i = 0; i < impl_->in.files.size(); ++i) {
    const fs::path& f = impl_->in.files[i];
    impl_->file_parts[fmt::format("file{}:{}", i + 1, f.filename().string())] = file_digest(f);
  }
}

InputDigester::~InputDigester() = default;

SheetDigest InputDigester::digest(const SheetJob& job) {
  SheetDigest d;
  d.parts = impl_->file_parts;
  d.parts["program"] = sha256_hex(impl_->in.program_version);
  {
    Sha256 h;
    h.update_field(job.id);
    h.update_field(job.name);
    for (const auto& [k, v] : job.fields) {
      h.update_field(k);
      h.update_field(v);
    }
    h.update_field(job.footprint_wkt);
    d.parts["sheet"] = h.hex();
  }
  double margin = impl_->in.margin_m;
  Box window = job.footprint.expanded(margin);
  if (impl_->index_srs && impl_->index_srs->IsGeographic()) {
    // A geographic index: the margin in degrees (1 degree of latitude ~ 111 km; a degree of
    // longitude shrinks with cos(latitude), capped near the poles).
    double lat = std::clamp(std::abs(job.footprint.centre().y), 0.0, 85.0) * kDegToRad;
    double dy = margin / 111000.0, dx = dy / std::cos(lat);
    window = Box{job.footprint.min_x - dx, job.footprint.min_y - dy, job.footprint.max_x + dx,
                 job.footprint.max_y + dy};
  }
  for (const auto& v : impl_->in.vectors) {
    if (v.name == kTileIndexSource) {
      d.parts["source:" + v.name] = impl_->index_part(v, job, window);
    } else {
      d.parts["source:" + v.name] = impl_->vector_part(v, &window);
    }
  }
  if (!impl_->in.dem_path.empty()) d.parts["dem"] = impl_->dem_part(window);
  Sha256 all;
  for (const auto& [k, v] : d.parts) {
    all.update_field(k);
    all.update_field(v);
  }
  d.hex = all.hex();
  return d;
}

}  // namespace sheetmill::batch
