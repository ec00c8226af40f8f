// GDAL's messages outside a GdalErrorScope reach the person through the log, once per distinct
// message, and GDAL's default handler (which prints "ERROR 1: ..." to stderr,
// CPLDefaultErrorHandler in GDAL's port/cpl_error.cpp) is never the one that runs.
#include <cpl_error.h>

#include <catch2/catch.hpp>

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"

using namespace sheetmill;

TEST_CASE("GDAL errors and warnings outside a scope become one log warning each", "[core]") {
  gdal_init();
  log::WarningCollector warnings;
  CPLError(CE_Failure, CPLE_AppDefined, "test failure 7f3a");
  CPLError(CE_Failure, CPLE_AppDefined, "test failure 7f3a");
  CPLError(CE_Warning, CPLE_AppDefined, "test warning 7f3a");
  CPLError(CE_Warning, CPLE_AppDefined, "test warning 7f3a");
  REQUIRE(warnings.warnings().size() == 2);
  CHECK(warnings.warnings()[0] == "GDAL: test failure 7f3a");
  CHECK(warnings.warnings()[1] == "GDAL: test warning 7f3a");
  {
    // Inside a scope the failure is the caller's to report, not the log's.
    GdalErrorScope scope;
    CPLError(CE_Failure, CPLE_AppDefined, "scoped failure 7f3a");
    CHECK(scope.last_failure() == "scoped failure 7f3a");
  }
  CHECK(warnings.warnings().size() == 2);
}
