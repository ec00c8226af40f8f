#pragma once
// The digest of everything one sheet is rendered from, so that a batch re-renders exactly the
// sheets whose inputs changed:
//   program   the program version
//   files     the bytes of the project and style files (and other files they name)
//   sheet     the sheet's index feature: ID, attributes, footprint
//   source:*  each vector source, read with a spatial filter on the sheet's footprint grown by
//             a margin: only the features that can appear on the sheet count; the tile index
//             itself is one (the neighbours' IDs and names appear in the collar)
//   dem       the DEM's georeferencing and the values of the window under the footprint
// Each part has its own digest (kept in the stamp, to say WHY a sheet was re-rendered); the
// sheet's digest hashes the parts in name order. Memory is bounded by one DEM row and one
// sheet's feature digests. Datasets are opened once per InputDigester and kept open.

#include <filesystem>
#include <map>
#include <memory>
#include <string>
#include <vector>

#include "sheetmill/batch/sheet_job.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::batch {

// The vector source named so is the tile index itself. Its digest part covers what the collar
// shows of it: the neighbours, and the sheets of the location diagram (sheet_info.hpp).
inline constexpr const char* kTileIndexSource = "tile index";

struct DigestInputs {
  std::string program_version;
  std::vector<std::filesystem::path> files;  // hashed whole (project, style, model files)
  struct Vector {
    std::string name;  // logical source name
    std::string path;
    std::string layer;
    std::string where;
    bool required = true;
  };
  std::vector<Vector> vectors;
  std::string dem_path;       // "" = none
  std::string index_crs_wkt;  // CRS of SheetJob::footprint; "" = same as every source
  double margin_m = 0;        // footprint growth before filtering
};

// What a sheet reads: the source of every style layer shown at the project's scale (as
// project::source_for resolves it), the supplied contours, the DEM. The margin is 10 mm on
// paper at the project's scale, enough for symbols and labels of features just outside.
DigestInputs digest_inputs_for(const project::Project& project, const style::Style& style,
                               const std::string& index_crs_wkt,
                               const std::string& program_version);

struct SheetDigest {
  std::string hex;
  std::map<std::string, std::string> parts;
};

class InputDigester {
 public:
  explicit InputDigester(DigestInputs inputs);
  ~InputDigester();
  InputDigester(const InputDigester&) = delete;
  InputDigester& operator=(const InputDigester&) = delete;

  // Throws Error(input) when a required source cannot be read.
  SheetDigest digest(const SheetJob& job);

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace sheetmill::batch
