#include "sheetmill/accuracy/residuals_io.hpp"

#include <fmt/format.h>

#include <cmath>
#include <cstdio>

#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/caution.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"

namespace sheetmill::accuracy {

namespace {

// RFC 4180 quoting, only where needed.
std::string csv_field(const std::string& s) {
  if (s.find_first_of(",\"\n") == std::string::npos) return s;
  std::string q = "\"";
  for (char c : s) q += c == '"' ? std::string("\"\"") : std::string(1, c);
  return q + "\"";
}

std::string number(double v) {
  return std::isfinite(v) ? fmt::format("{:.4f}", v) : "";
}

void write_csv(const Assessment& a, const std::filesystem::path& out) {
  AtomicOutput file(out);
  {
    std::FILE* f = std::fopen(file.temp_path().c_str(), "w");
    if (!f) throw_input_error(out.string(), "cannot write the residuals here");
    std::string text = "id,x,y,z_check_m,z_dem_m,error_m,status,cover,vegetated,outlier\n";
    for (const Residual& r : a.residuals) {
      bool used = r.status == PointStatus::used;
      text += fmt::format("{},{:.3f},{:.3f},{},{},{},{},{},{},{}\n", csv_field(r.id), r.xy.x,
                          r.xy.y, number(r.z_check_m), number(r.z_dem_m),
                          used ? number(r.error_m) : "", csv_field(status_name(r.status)),
                          csv_field(r.cover), r.vegetated ? 1 : 0, r.outlier ? 1 : 0);
    }
    bool ok = std::fwrite(text.data(), 1, text.size(), f) == text.size();
    ok = std::fclose(f) == 0 && ok;
    if (!ok) throw_input_error(out.string(), "writing the residuals failed");
  }
  file.commit();
}

void write_gpkg(const Assessment& a, const std::filesystem::path& out) {
  gdal_init();
  GdalErrorScope errors;
  GDALDriver* drv = GetGDALDriverManager()->GetDriverByName("GPKG");
  if (!drv) throw_internal_error("GDAL has no GeoPackage driver");
  AtomicOutput file(out);
  file.clear_temp_for_writer();  // the GeoPackage driver will not create over an existing file
  {
    DatasetPtr ds(drv->Create(file.temp_path().c_str(), 0, 0, 0, GDT_Unknown, nullptr));
    if (!ds)
      throw_input_error(out.string(), "cannot create a GeoPackage: " + errors.last_failure());
    OGRSpatialReference srs;
    bool has_srs =
        !a.dem_grid.crs_wkt.empty() && srs.importFromWkt(a.dem_grid.crs_wkt.c_str()) == OGRERR_NONE;
    const std::string description = std::string("DESCRIPTION=") + kProductCaution;
    const char* lco[] = {description.c_str(), nullptr};
    OGRLayer* layer =
        ds->CreateLayer("residuals", has_srs ? &srs : nullptr, wkbPoint, const_cast<char**>(lco));
    if (!layer) throw_input_error(out.string(), "cannot create a layer: " + errors.last_failure());
    for (const char* name : {"id", "status", "cover"}) {
      OGRFieldDefn fd(name, OFTString);
      layer->CreateField(&fd);
    }
    for (const char* name : {"z_check_m", "z_dem_m", "error_m"}) {
      OGRFieldDefn fd(name, OFTReal);
      layer->CreateField(&fd);
    }
    for (const char* name : {"vegetated", "outlier"}) {
      OGRFieldDefn fd(name, OFTInteger);
      fd.SetSubType(OFSTBoolean);
      layer->CreateField(&fd);
    }
    if (layer->StartTransaction() != OGRERR_NONE) throw_internal_error("GeoPackage transaction");
    for (const Residual& r : a.residuals) {
      FeaturePtr f(OGRFeature::CreateFeature(layer->GetLayerDefn()));
      f->SetField("id", r.id.c_str());
      f->SetField("status", status_name(r.status));
      f->SetField("cover", r.cover.c_str());
      f->SetField("z_check_m", r.z_check_m);
      if (std::isfinite(r.z_dem_m)) f->SetField("z_dem_m", r.z_dem_m);
      if (r.status == PointStatus::used) f->SetField("error_m", r.error_m);
      f->SetField("vegetated", r.vegetated ? 1 : 0);
      f->SetField("outlier", r.outlier ? 1 : 0);
      OGRPoint p(r.xy.x, r.xy.y);
      f->SetGeometry(&p);
      if (layer->CreateFeature(f.get()) != OGRERR_NONE) {
        throw_input_error(out.string(), "writing a residual failed: " + errors.last_failure());
      }
    }
    if (layer->CommitTransaction() != OGRERR_NONE) {
      throw_input_error(out.string(), "writing the residuals failed: " + errors.last_failure());
    }
  }
  file.commit();
}

}  // namespace

void write_residuals(const Assessment& a, const std::filesystem::path& out) {
  std::string ext = out.extension().string();
  for (auto& c : ext) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  if (ext == ".csv") return write_csv(a, out);
  if (ext == ".gpkg") return write_gpkg(a, out);
  throw_input_error(out.string(), "expected a residuals file ending in .csv or .gpkg");
}

}  // namespace sheetmill::accuracy
