#pragma once
// `sheetmill accuracy` as a library call: test a DEM against check points, optionally the
// horizontal positions too, write the residuals table and the report page when asked, and
// return the assessment with its terminal summary. The CLI only parses options into an
// AccuracyRequest and prints the summary.

#include <optional>
#include <string>

#include "sheetmill/accuracy/assess.hpp"

namespace sheetmill::accuracy {

struct AccuracyRequest {
  std::string dem;
  CheckPointSource points;
  AssessOptions options;
  // The map's positions of the same points (matched by ID) for the horizontal test.
  std::optional<CheckPointSource> map_positions;
  std::string residuals_out;  // .csv or .gpkg; empty: none
  std::string report_out;     // .pdf or .png; empty: none
};

struct AccuracyOutcome {
  Assessment assessment;
  std::string summary;  // summary_text(), plus the statement lines
};

AccuracyOutcome run_accuracy(const AccuracyRequest& request);

}  // namespace sheetmill::accuracy
