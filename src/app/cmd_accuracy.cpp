// `sheetmill accuracy DEM POINTS`: test a DEM against surveyed check points (NSSDA, ASPRS 2014,
// NMAS 1947). Thin: options into an AccuracyRequest, the library does the rest.
#include <cstdio>
#include <memory>

#include "app/commands.hpp"
#include "app/option_checks.hpp"
#include "sheetmill/accuracy/check_points.hpp"
#include "sheetmill/accuracy/run.hpp"

namespace sheetmill::app {

namespace {

struct AccuracyInput {
  accuracy::AccuracyRequest request;
  std::string points_crs, height_unit = "m", dem_crs, z_unit, vegetated;
  std::string map_positions, map_layer, map_id_field;
};

std::vector<std::string> split_commas(const std::string& s) {
  std::vector<std::string> out;
  std::size_t from = 0;
  while (from <= s.size()) {
    std::size_t to = s.find(',', from);
    if (to == std::string::npos) to = s.size();
    if (to > from) out.push_back(s.substr(from, to - from));
    from = to + 1;
  }
  return out;
}

}  // namespace

void add_accuracy_command(CLI::App& app, Action& action, const GlobalOptions& global) {
  auto in = std::make_shared<AccuracyInput>();
  auto& r = in->request;
  CLI::App* cmd =
      app.add_subcommand("accuracy",
                         "Test a DEM against surveyed check points: RMSE, NSSDA 95 % accuracy, the "
                         "finest contour interval it supports");
  cmd->add_option("DEM", r.dem, "Elevation raster (any GDAL raster, any CRS)")
      ->required()
      ->type_name("FILE");
  cmd->add_option("POINTS", r.points.path, "Check points with surveyed heights (any OGR source)")
      ->required()
      ->type_name("FILE");
  cmd->add_option("--layer", r.points.layer, "Layer of POINTS (default: the first point layer)");
  cmd->add_option("--height-field", r.points.height_field,
                  "Field of surveyed heights (default: elevation_m, elevation, height_m, height "
                  "or z)");
  cmd->add_option("--id-field", r.points.id_field, "Field naming each point (default: id)");
  cmd->add_option("--points-crs", in->points_crs, "The points' CRS when the file states none");
  cmd->add_option("--height-unit", in->height_unit, "Unit of the surveyed heights: m, ft, us-ft")
      ->check(one_of({"m", "ft", "us-ft"}))
      ->type_name("UNIT")
      ->capture_default_str();
  cmd->add_option("--dem-crs", in->dem_crs, "The DEM's CRS when the file states none");
  cmd->add_option("--z-unit", in->z_unit, "The DEM's height unit when the file does not say")
      ->check(one_of({"m", "ft", "us-ft"}))
      ->type_name("UNIT");
  cmd->add_option("--cover-field", r.points.cover_field,
                  "Field of land-cover classes (splits vegetated and non-vegetated ground)");
  cmd->add_option("--vegetated", in->vegetated,
                  "Comma-separated land-cover classes that are vegetated (with --cover-field)");
  cmd->add_option("--map-positions", in->map_positions,
                  "The same points as the map shows them (matched by ID): horizontal accuracy");
  cmd->add_option("--map-layer", in->map_layer, "Layer of --map-positions");
  cmd->add_option("--map-id-field", in->map_id_field,
                  "ID field of --map-positions (default: the --id-field)");
  cmd->add_option("--residuals", r.residuals_out, "Write the residuals: .csv or .gpkg");
  cmd->add_option("--report", r.report_out, "Write a one-page report: .pdf or .png");
  cmd->add_option("--date", r.options.date, "Date of the test for the statement (YYYY-MM-DD)");
  cmd->callback([&action, &global, in] {
    action = [&global, in] {
      auto& req = in->request;
      if (!in->points_crs.empty()) req.points.crs = in->points_crs;
      req.points.height_unit_m = accuracy::height_unit_metres(in->height_unit, "--height-unit");
      if (!in->dem_crs.empty()) req.options.dem.assumed_crs = in->dem_crs;
      if (!in->z_unit.empty()) req.options.dem.vertical_unit = in->z_unit;
      req.options.vegetated_classes = split_commas(in->vegetated);
      if (!in->map_positions.empty()) {
        accuracy::CheckPointSource m;
        m.path = in->map_positions;
        m.layer = in->map_layer;
        m.id_field = in->map_id_field.empty() ? req.points.id_field : in->map_id_field;
        m.crs = req.points.crs;
        req.map_positions = m;
      }
      accuracy::AccuracyOutcome out = accuracy::run_accuracy(req);
      if (!global.quiet) std::fputs(out.summary.c_str(), stdout);
      return 0;
    };
  });
}

}  // namespace sheetmill::app
