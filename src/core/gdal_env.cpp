#include "sheetmill/core/gdal_env.hpp"

#include <cpl_conv.h>
#include <cpl_error.h>
#include <ogr_spatialref.h>

#include <filesystem>
#include <mutex>
#include <set>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"

namespace sheetmill {

namespace {
// GDAL's messages where no GdalErrorScope listens (a driver on another thread, a warning while
// closing a file): each distinct message once as a log warning, never GDAL's own "ERROR 1:" or
// "Warning 1:" line on stderr. Debug chatter stays with CPL_DEBUG.
void CPL_STDCALL route_unscoped(CPLErr level, CPLErrorNum, const char* msg) {
  if (level != CE_Warning && level != CE_Failure && level != CE_Fatal) return;
  std::string text = msg ? msg : "";
  static std::mutex mutex;
  static std::set<std::string> seen;
  {
    std::lock_guard lock(mutex);
    // Bounded: a driver that reports once per pixel cannot grow this without end.
    if (seen.size() >= 1000 || !seen.insert(text).second) return;
  }
  log::warn("GDAL: {}", text);
}
}  // namespace

void gdal_init() {
  static std::once_flag once;
  std::call_once(once, [] {
    CPLSetErrorHandler(route_unscoped);
    GDALAllRegister();
    // A sheet is one process's work; let GDAL use both cores for warping.
    CPLSetConfigOption("GDAL_NUM_THREADS", CPLGetConfigOption("GDAL_NUM_THREADS", "ALL_CPUS"));
  });
}

void GdalErrorScope::handler(CPLErr level, CPLErrorNum, const char* msg) {
  auto* self = static_cast<GdalErrorScope*>(CPLGetErrorHandlerUserData());
  if (level == CE_Failure || level == CE_Fatal) {
    if (self) self->last_failure_ = msg ? msg : "";
  } else if (level == CE_Warning) {
    log::debug("GDAL: {}", msg ? msg : "");
  }
}

GdalErrorScope::GdalErrorScope() {
  CPLPushErrorHandlerEx(&GdalErrorScope::handler, this);
}
GdalErrorScope::~GdalErrorScope() {
  CPLPopErrorHandler();
}

namespace {
DatasetPtr open_with(const std::string& path, unsigned flags, const char* what) {
  gdal_init();
  GdalErrorScope errors;
  auto* ds = GDALDataset::Open(path.c_str(), flags | GDAL_OF_VERBOSE_ERROR);
  if (!ds) {
    std::error_code ec;
    bool is_file_path = path.find(':') == std::string::npos;
    if (is_file_path && !std::filesystem::exists(path, ec)) {
      throw_input_error(path, "file not found");
    }
    std::string detail = errors.last_failure();
    throw_input_error(path, std::string("not ") + what + " GDAL can read" +
                                (detail.empty() ? "" : " (" + detail + ")"));
  }
  return DatasetPtr(ds);
}
}  // namespace

DatasetPtr open_raster(const std::string& path) {
  return open_with(path, GDAL_OF_RASTER | GDAL_OF_READONLY, "a raster");
}

DatasetPtr open_vector(const std::string& path) {
  return open_with(path, GDAL_OF_VECTOR | GDAL_OF_READONLY, "a vector source");
}

std::string crs_wkt(const OGRSpatialReference& srs, const char* format) {
  std::string option = format ? std::string("FORMAT=") + format : std::string();
  const char* options[] = {format ? option.c_str() : nullptr, nullptr};
  char* wkt = nullptr;
  srs.exportToWkt(&wkt, options);
  std::string out = wkt ? wkt : "";
  CPLFree(wkt);
  return out;
}

}  // namespace sheetmill
