#pragma once
// One sheet in five explicit phases (docs/DESIGN sketch; render_sheet() is their sequence):
//
//   read_inputs -> SheetInputs     what is opened or loaded once: fonts, the tile index, the
//                                  magnetic model, the DEM and vector sources as resolved by
//                                  the project; a batch worker keeps one across its sheets
//   prepare     -> PreparedSheet   layout and frame, features in page mm, contours and spot
//                                  heights, legend rules, collar facts (SheetInfo)
//   place       -> Placement       every label against one collision index
//   draw                           plain values onto a LayeredCanvas; opens no file itself
//                                  (the relief layer reads its DEM windows through the terrain
//                                  stage while it paints: the streamed-relief work replaces it)
//   finish                         PDF, PNG or GeoTIFF through the canvas's finishers, atomic
//
// Each result is a plain struct a test can build by hand.

#include <filesystem>
#include <map>
#include <memory>
#include <string>
#include <vector>

#include "sheetmill/geomag/model.hpp"
#include "sheetmill/labels/candidate.hpp"
#include "sheetmill/pdf/layered_canvas.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/render/feature_layers.hpp"
#include "sheetmill/render/render.hpp"
#include "sheetmill/render/sheet_contours.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "sheetmill/sheet/tile_index.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::render {

// What the sheet reads, opened once. Non-owning pointers are the caller's (a batch worker's);
// the owned members hold what read_inputs() had to open itself. Moving keeps the pointers
// valid (owned objects live on the heap).
struct SheetInputs {
  const project::Project* project = nullptr;
  const style::Style* style = nullptr;
  text::FontCache* fonts = nullptr;
  const sheet::TileIndexContents* tile_index = nullptr;  // null: the sheet needs none
  const geomag::Model* magnetic_model = nullptr;         // null: none named, or stated declination
  std::optional<std::string> sheet_id;                   // an index sheet instead of the extent

  std::unique_ptr<text::FontCache> own_fonts;
  std::unique_ptr<sheet::TileIndexContents> own_tile_index;
  std::unique_ptr<geomag::Model> own_magnetic_model;
};

// Opens what `options` does not already carry. Throws Error(input) for a tile index or magnetic
// model that cannot be read. The project and style must outlive the result.
SheetInputs read_inputs(const project::Project& project, const style::Style& style,
                        const RenderOptions& options);

struct PreparedSheet {
  sheet::Layout layout;
  PreparedLayers layers;         // features in page mm, per style layer
  FeatureLayersResult features;  // reports, legend rules, name candidates, obstacles
  SheetContours contours;
  sheet::SheetInfo info;         // collar facts (north, neighbours, datums, legend contents)
  std::vector<Box> grid_labels;  // page mm: labels the grid sets inside the frame
  double seconds_features = 0, seconds_contours = 0;
};

PreparedSheet prepare(const SheetInputs& inputs);

struct Placement {
  std::vector<labels::Candidate> names;           // feature names, chosen placements set
  std::vector<labels::Candidate> contour_labels;  // contour values and spot heights
  std::map<std::string, labels::LayerCount> counts;
};

// Places every name and contour label of `sheet` against one collision index; consumes the
// sheet's candidates (moves them out of `sheet`).
Placement place(PreparedSheet& sheet);

struct DrawReport {
  bool relief_drawn = true;  // false: no relief under the frame
  double seconds_relief = 0;
  // Seconds the relief strips take while the output is written (render/relief_layer.hpp).
  std::shared_ptr<double> strip_seconds = std::make_shared<double>(0);
};

// Draws `sheet` and `placement` onto `canvas` in the style's order, each layer in its group.
DrawReport draw(pdf::LayeredCanvas& canvas, const SheetInputs& inputs, const PreparedSheet& sheet,
                const Placement& placement);

// Writes `canvas` to `output` in `options.format`, whole or not at all.
void finish(pdf::LayeredCanvas& canvas, const project::Project& project, const style::Style& style,
            const MapFrame& frame, const std::filesystem::path& output,
            const RenderOptions& options);

}  // namespace sheetmill::render
