// `sheetmill contours DEM OUT.gpkg --interval I [--base B] [--index-every N] [--dem-crs CRS]`:
// contour lines prepared for print, written to a GeoPackage with elevation, index, depression and
// supplementary fields. Thin: parses options and calls sheetmill::contours::contour_file().
#include <memory>
#include <optional>
#include <string>

#include "app/commands.hpp"
#include "app/option_checks.hpp"
#include "sheetmill/contours/contour_layer.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/plural.hpp"
#include "sheetmill/core/scale_text.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::app {

void add_contours_command(CLI::App& app, Action& action, const GlobalOptions&) {
  struct Args {
    std::string dem;
    std::string out;
    contours::ContourParams params;
    bool raw = false;
    bool labels = false;
    std::string units = "auto";
    std::string scale = "1:25000";
    std::string dem_crs;
    std::optional<double> sea_level;
  };
  auto args = std::make_shared<Args>();
  args->params.interval_m = 0;  // 0: proposed from the scale and the relief
  CLI::App* cmd = app.add_subcommand(
      "contours", "Contour lines from a DEM, prepared for print, into a GeoPackage");
  cmd->add_option("DEM", args->dem, "Elevation raster (any GDAL raster)")
      ->required()
      ->type_name("FILE");
  cmd->add_option("OUT", args->out, "Output GeoPackage (.gpkg)")->required()->type_name("FILE");
  cmd->add_option("--interval", args->params.interval_m,
                  "Contour interval, in --units (default: proposed from the scale and relief)")
      ->check(positive_number("a contour interval"))
      ->type_name("HEIGHT");
  cmd->add_option("--base", args->params.base_m, "Level the intervals count from, in --units")
      ->check(number_from(-20000, 20000, "a base level", "(in --units)"))
      ->type_name("HEIGHT")
      ->capture_default_str();
  cmd->add_option("--units", args->units,
                  "Unit of the interval, base, elevation field and labels: auto (the DEM's "
                  "vertical unit), m, ft or us-ft")
      ->check(one_of({"auto", "m", "ft", "us-ft"}))
      ->type_name("UNIT")
      ->capture_default_str();
  cmd->add_option("--dem-crs", args->dem_crs,
                  "The DEM's CRS when the file states none (for example EPSG:4326); a CRS the "
                  "file states wins")
      ->type_name("CRS");
  cmd->add_option("--sea-level", args->sea_level,
                  "Sea (or water surface) level in --units: lines below it are depth contours "
                  "(field depth), the line at it the coastline (field coastline)")
      ->check(number_from(-40000, 40000, "a sea level", "(in --units)"))
      ->type_name("HEIGHT");
  cmd->add_option("--index-every", args->params.index_every, "Every Nth line is an index contour")
      ->check(whole_number_from(1, "the index-contour step"))
      ->type_name("N")
      ->capture_default_str();
  cmd->add_option("--scale", args->scale,
                  "Scale the lines are prepared for: 1:25000, 1:25 000 or 25000")
      ->check(scale_text())
      ->type_name("1:N")
      ->capture_default_str();
  cmd->add_option("--smoothing", args->params.smoothing_mm, "Generalisation tolerance, mm on paper")
      ->check(number_from(0, 10, "a smoothing tolerance", "mm on paper"))
      ->type_name("MM")
      ->capture_default_str();
  cmd->add_option("--min-loop", args->params.min_loop_mm,
                  "Closed loops shorter than this on paper are dropped, mm")
      ->check(number_from(0, 1000, "a shortest loop", "mm on paper"))
      ->type_name("MM")
      ->capture_default_str();
  cmd->add_flag("--half-interval", args->params.supplementary,
                "Add half-interval lines where the ground is gentle");
  cmd->add_flag("--raw", args->raw, "Write the generator's lines without smoothing or thinning");
  cmd->add_flag("--labels", args->labels,
                "Also place index-contour labels at --scale (layer contour_labels: elevation, "
                "text, angle_deg, up_deg)");
  cmd->callback([&action, args] {
    action = [args] {
      check_output_target(args->out);  // before the DEM is read
      args->params.scale_denominator = *parse_scale_denominator(args->scale);
      contours::ContourFileOptions options;
      options.prepare = !args->raw;
      options.labels = args->labels;
      if (!args->dem_crs.empty()) options.dem_crs = args->dem_crs;
      args->params.sea_level_m = args->sea_level;
      if (args->units == "m") options.unit_m = 1.0;
      if (args->units == "ft") options.unit_m = kMetresPerFoot;
      if (args->units == "us-ft") options.unit_m = kMetresPerUsSurveyFoot;
      auto r = contours::contour_file(args->dem, args->out, args->params, options);
      log::info("contours: wrote {} ({} at {:g} {}, {} closed, {}, {:.1f} km on the ground, {})",
                args->out, counted(r.lines, "line"), r.interval, r.unit.symbol, r.closed,
                counted(r.vertices, "vertex", "vertices"), r.length_m / 1000,
                counted(r.labels, "label"));
      return 0;
    };
  });
}

}  // namespace sheetmill::app
