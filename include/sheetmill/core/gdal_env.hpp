#pragma once
// GDAL and PROJ set-up, and the routing of their messages.
//
// gdal_init() registers drivers once (thread-safe, idempotent) and routes every GDAL message
// outside a GdalErrorScope to the log, once per distinct message. GdalErrorScope installs a
// thread-local CPLError handler for its lifetime: CE_Failure and CE_Fatal messages are kept so
// the caller can turn them into one Error naming the file; CE_Warning becomes a log warning.

#include <string>
#include <vector>

#include "sheetmill/core/handles.hpp"

class OGRSpatialReference;

namespace sheetmill {

void gdal_init();

class GdalErrorScope {
 public:
  GdalErrorScope();
  ~GdalErrorScope();
  GdalErrorScope(const GdalErrorScope&) = delete;
  GdalErrorScope& operator=(const GdalErrorScope&) = delete;

  // The last failure message GDAL reported in this scope, or "" if none.
  const std::string& last_failure() const { return last_failure_; }
  void clear() { last_failure_.clear(); }

 private:
  static void handler(CPLErr level, CPLErrorNum num, const char* msg);
  std::string last_failure_;
};

// Opens a raster with GDAL; throws Error(input) "PATH: not a raster GDAL can read (...)".
DatasetPtr open_raster(const std::string& path);
// Opens a vector source with OGR (a file path or a connection string GDAL supports).
DatasetPtr open_vector(const std::string& path);

// The CRS as WKT in GDAL's `format` (an exportToWkt FORMAT: "WKT2_2019", "WKT1_GDAL", ...;
// null: GDAL's default), or "" when it cannot be expressed.
std::string crs_wkt(const OGRSpatialReference& srs, const char* format = nullptr);

}  // namespace sheetmill
