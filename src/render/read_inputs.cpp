// Phase 1, read: what the sheet opens once (render/phases.hpp).

#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/render/phases.hpp"

namespace sheetmill::render {

SheetInputs read_inputs(const project::Project& project, const style::Style& style,
                        const RenderOptions& options) {
  gdal_init();
  SheetInputs in;
  in.project = &project;
  in.style = &style;
  in.sheet_id = options.sheet_id;
  in.fonts = options.fonts;
  if (!in.fonts) in.fonts = (in.own_fonts = std::make_unique<text::FontCache>()).get();
  // Both the layout and the diagrams need the index: read it once (or take the batch's).
  in.tile_index = options.tile_index;
  if (!in.tile_index && (options.sheet_id || project.extent.sheet_id) && project.tile_index) {
    in.own_tile_index = std::make_unique<sheet::TileIndexContents>(
        sheet::read_tile_index(*project.tile_index, project.crs));
    in.tile_index = in.own_tile_index.get();
  }
  // The DEM is opened here once, before any feature is read: a bad path or format is the one
  // line the user sees, not preceded by warnings from preparing a sheet that cannot be drawn.
  if (!project.elevation.dem.empty()) open_raster(project.elevation.dem);
  // A stated declination needs no model; a named model file is read here, once.
  in.magnetic_model = options.magnetic_model;
  if (!in.magnetic_model && !project.magnetic.declination_deg && project.magnetic.model_file) {
    in.own_magnetic_model =
        std::make_unique<geomag::Model>(geomag::Model::load(*project.magnetic.model_file));
    in.magnetic_model = in.own_magnetic_model.get();
  }
  return in;
}

}  // namespace sheetmill::render
