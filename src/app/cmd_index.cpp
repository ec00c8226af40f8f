// `sheetmill index`: plan a tile index over an area and write it as a GeoPackage layer.
#include <algorithm>
#include <cstdio>
#include <memory>

#include "app/commands.hpp"
#include "sheetmill/batch/index_plan.hpp"
#include "sheetmill/batch/option_values.hpp"
#include "sheetmill/batch/tile_index_io.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/plural.hpp"

namespace sheetmill::app {

namespace {
struct IndexOptions {
  std::string output;
  std::string layer = "sheets";
  std::string crs;
  std::string scale;
  std::string frame;
  std::string overlap = "0";
  std::string snap = "1km";
  std::string graticule;
  std::string extent;
  std::string area;
  std::string area_layer;
  std::string id_template = "{row_a}{col:2}";
  std::string name_template = "Sheet {id}";
};
}  // namespace

void add_index_command(CLI::App& app, Action& action, const GlobalOptions&) {
  auto opt = std::make_shared<IndexOptions>();
  CLI::App* cmd = app.add_subcommand(
      "index", "Plan the sheets covering an area and write them as a tile index (GeoPackage)");
  cmd->add_option("output", opt->output, "GeoPackage to write (replaced whole)")->required();
  cmd->add_option("--layer", opt->layer, "Layer name")->capture_default_str();
  cmd->add_option("--crs", opt->crs, "Sheet CRS, e.g. EPSG:32633")->required();
  cmd->add_option("--scale", opt->scale, "Scale, e.g. 25000 or 1:25000")->required();
  cmd->add_option("--frame", opt->frame, "Map frame on paper, e.g. 400x300mm (grid alignment)");
  cmd->add_option("--overlap", opt->overlap, "Overlap between neighbours on paper, e.g. 10mm")
      ->capture_default_str();
  cmd->add_option("--snap", opt->snap, "Frame corners fall on multiples of this ground length")
      ->capture_default_str();
  cmd->add_option("--graticule", opt->graticule,
                  "Sheets bounded by meridians and parallels, cell size in minutes, e.g. 7.5x7.5");
  cmd->add_option("--extent", opt->extent, "Area of interest as minx,miny,maxx,maxy in the CRS");
  cmd->add_option("--area", opt->area, "Area of interest as a polygon layer (any CRS)");
  cmd->add_option("--area-layer", opt->area_layer, "Layer of --area (default: the first)");
  cmd->add_option("--id-template", opt->id_template,
                  "Sheet ID: {row} {col} {row:2} {row_a} {col_a} {e_km} {n_km} {lon} {lat}")
      ->capture_default_str();
  cmd->add_option("--name-template", opt->name_template, "Sheet name; may use {id} too")
      ->capture_default_str();
  cmd->callback([opt, &action] {
    action = [opt] {
      batch::IndexSpec spec;
      spec.crs = opt->crs;
      spec.scale_denominator = batch::parse_scale(opt->scale, "--scale");
      if (!opt->graticule.empty()) {
        if (!opt->frame.empty()) throw_input_error("--frame", "use either --frame or --graticule");
        spec.alignment = batch::IndexAlignment::graticule;
        auto [w, h] = batch::parse_minutes(opt->graticule, "--graticule");
        spec.cell_width_min = w;
        spec.cell_height_min = h;
      } else {
        if (opt->frame.empty()) throw_input_error("--frame", "give --frame (or --graticule)");
        auto [w, h] = batch::parse_frame_mm(opt->frame, "--frame");
        spec.frame_width_mm = w;
        spec.frame_height_mm = h;
        spec.overlap_mm = batch::parse_paper_length_mm(opt->overlap, "--overlap");
        spec.snap_m = batch::parse_ground_length_m(opt->snap, "--snap");
      }
      if (!opt->area.empty()) {
        batch::AreaOfInterest a = batch::read_area_polygons(opt->area, opt->area_layer, opt->crs);
        spec.area = a.box;
        spec.area_polygons_wkt = std::move(a.polygons_wkt);
      }
      if (!opt->extent.empty()) {
        Box box = batch::parse_box(opt->extent, "--extent");
        // With both, the box narrows the polygons' area.
        spec.area = spec.area.empty() ? box
                                      : Box::of(std::max(box.min_x, spec.area.min_x),
                                                std::max(box.min_y, spec.area.min_y),
                                                std::min(box.max_x, spec.area.max_x),
                                                std::min(box.max_y, spec.area.max_y));
      }
      if (opt->area.empty() && opt->extent.empty()) {
        throw_input_error("--extent", "give the area of interest with --extent or --area");
      }
      spec.id_template = opt->id_template;
      spec.name_template = opt->name_template;
      batch::IndexPlan plan = batch::plan_tile_index(spec);
      batch::write_tile_index(plan, opt->output, opt->layer);
      int rows = 0, cols = 0;
      for (const auto& s : plan.sheets) {
        rows = std::max(rows, s.row);
        cols = std::max(cols, s.col);
      }
      log::info("index: {} in {} and {} written to {} (layer {})",
                counted(static_cast<long long>(plan.sheets.size()), "sheet"), counted(rows, "row"),
                counted(cols, "column"), opt->output, opt->layer);
      return 0;
    };
  });
}

}  // namespace sheetmill::app
