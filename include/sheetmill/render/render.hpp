#pragma once
// Rendering one sheet: the pipeline read -> prepare -> place -> draw -> finish, end to end.
// render_sheet() is what `sheetmill render`, `sheetmill batch` and the tests call.

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "sheetmill/core/file_format.hpp"
#include "sheetmill/geomag/model.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/sheet/tile_index.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::render {

using OutputFormat = FileFormat;  // chosen by the output's extension: core/file_format.hpp

struct RenderOptions {
  OutputFormat format = OutputFormat::pdf;
  double raster_dpi = 150;              // PNG/GeoTIFF export
  std::optional<std::string> sheet_id;  // overrides the project's extent with an index sheet
  // Read once and shared by every sheet a batch worker renders; null = read for this sheet.
  // The index must be the project's own, read in the project's CRS.
  const sheet::TileIndexContents* tile_index = nullptr;
  // Fonts and shaping faces, likewise kept across a worker's sheets; null = a fresh cache.
  text::FontCache* fonts = nullptr;
  // The project's magnetic model, likewise; null = loaded for this sheet when the project names
  // one.
  const geomag::Model* magnetic_model = nullptr;
  // A symbolic link at the output is refused unless this is set; then the file it points to
  // is replaced and the link stays (core/atomic_file.hpp).
  bool write_through_link = false;
  // PDF output only: write PDF/X-4 for print with this output profile (it overrides the style's
  // press.profile); palette colours given as CMYK or ink tints keep their exact values.
  std::optional<std::filesystem::path> print_profile;
};

struct LayerReport {
  std::string layer;
  long features = 0;
  long labels_placed = 0;
  long labels_dropped = 0;
};

struct RenderReport {
  std::filesystem::path output;
  std::vector<std::string> warnings;
  std::vector<LayerReport> layers;
  double seconds_total = 0;
  double seconds_relief = 0;
  double seconds_contours = 0;
  double seconds_features = 0;
  double seconds_labels = 0;
  double seconds_finish = 0;
};

// Renders the project's sheet to `output` atomically (temporary file, then rename). Throws
// Error(input) for bad inputs; the output either appears complete or not at all.
RenderReport render_sheet(const project::Project& project, const style::Style& style,
                          const std::filesystem::path& output, const RenderOptions& options = {});

}  // namespace sheetmill::render
