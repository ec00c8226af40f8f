#pragma once
// One sheet of a batch: a feature of the tile index and where its output goes.
//
// Values read from the index are untrusted text (any bytes GDAL hands over); `output` is built
// from them only through output_name.hpp, so it always lies inside the batch's output folder.

#include <filesystem>
#include <map>
#include <string>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::batch {

struct SheetJob {
  std::string id;                             // as in the index (untrusted)
  std::string name;                           // as in the index, may be empty
  std::map<std::string, std::string> fields;  // every attribute of the feature, as text
  std::string footprint_wkt;                  // the feature's polygon, index CRS
  Box footprint;                              // its envelope, index CRS
  std::filesystem::path output;               // absolute; inside the output folder
};

}  // namespace sheetmill::batch
