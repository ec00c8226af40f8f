// `sheetmill shade`, `sheetmill slope`, `sheetmill tint`: relief rasters in the DEM's own grid.
// Thin: parse options, call the terrain stage, return 0.
#include <unistd.h>

#include <cstdio>
#include <memory>
#include <optional>
#include <string>

#include "app/commands.hpp"
#include "app/option_checks.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/file_format.hpp"
#include "sheetmill/terrain/raster_products.hpp"
#include "sheetmill/terrain/tint.hpp"

namespace sheetmill::app {

namespace {

struct DemInput {
  std::string dem;
  std::string out;
  std::string crs;
  std::string z_unit;
  std::string compression = "zstd";

  terrain::DemReadOptions read_options() const {
    terrain::DemReadOptions o;
    if (!crs.empty()) o.assumed_crs = crs;
    if (!z_unit.empty()) o.vertical_unit = z_unit;
    return o;
  }
};

void add_dem_options(CLI::App* cmd, DemInput& in) {
  cmd->add_option("DEM", in.dem, "Elevation raster (any GDAL raster, any CRS)")
      ->required()
      ->type_name("FILE");
  cmd->add_option("OUT", in.out, "Output GeoTIFF (.tif)")->required()->type_name("FILE");
  cmd->add_option("--dem-crs", in.crs, "The DEM's CRS when the file states none (e.g. EPSG:32633)")
      ->type_name("CRS");
  cmd->add_option("--z-unit", in.z_unit, "Elevation unit when the file does not say: m, ft, us-ft")
      ->check(one_of({"m", "ft", "us-ft"}))
      ->type_name("UNIT");
  cmd->add_option("--compression", in.compression,
                  "zstd (fast) or deflate (read by every TIFF reader)")
      ->check(one_of({"zstd", "deflate"}))
      ->type_name("NAME")
      ->capture_default_str();
}

struct ShadeInput {
  std::string method = "horn";
  double azimuth_deg = 315, altitude_deg = 45, exaggeration = 1;
  terrain::ShadeParams params() const {
    return {terrain::parse_shade_method(method), azimuth_deg, altitude_deg, exaggeration};
  }
};

void add_shade_options(CLI::App* cmd, ShadeInput& s) {
  cmd->add_option("--method", s.method,
                  "Gradient and lighting: horn, zevenbergen-thorne, multidirectional")
      ->check(one_of({"horn", "zevenbergen-thorne", "multidirectional"}))
      ->type_name("NAME")
      ->capture_default_str();
  cmd->add_option("--azimuth", s.azimuth_deg, "Light direction, degrees clockwise from north")
      ->check(number_from(0, 360, "a light direction", "degrees clockwise from north"))
      ->type_name("DEG")
      ->capture_default_str();
  cmd->add_option("--altitude", s.altitude_deg, "Light elevation above the horizon, degrees")
      ->check(number_from(0, 90, "a light elevation", "degrees above the horizon"))
      ->type_name("DEG")
      ->capture_default_str();
  cmd->add_option("--exaggeration", s.exaggeration, "Vertical exaggeration")
      ->check(positive_number("a vertical exaggeration"))
      ->type_name("FACTOR")
      ->capture_default_str();
}

// Percentages on one line while stderr is a terminal; nothing otherwise.
std::function<void(double)> progress_for(const char* what, const GlobalOptions& global) {
  if (global.quiet || !isatty(fileno(stderr))) return {};
  auto last = std::make_shared<int>(-1);
  return [what, last](double f) {
    int pct = static_cast<int>(f * 100);
    if (pct == *last) return;
    *last = pct;
    std::fprintf(stderr, "\r%s: %3d %%", what, pct);
    if (pct >= 100) std::fprintf(stderr, "\n");
    std::fflush(stderr);
  };
}

}  // namespace

void add_relief_commands(CLI::App& app, Action& action, const GlobalOptions& global) {
  {
    auto in = std::make_shared<DemInput>();
    auto shade = std::make_shared<ShadeInput>();
    CLI::App* cmd = app.add_subcommand("shade", "Hillshade a DEM into a Byte GeoTIFF (0 = nodata)");
    add_dem_options(cmd, *in);
    add_shade_options(cmd, *shade);
    cmd->callback([&action, &global, in, shade] {
      action = [&global, in, shade] {
        file_format_for(in->out, {FileFormat::geotiff});
        check_output_target(in->out);  // before the DEM is read
        terrain::ProductOptions o;
        o.read = in->read_options();
        o.compression = in->compression;
        o.progress = progress_for("shade", global);
        terrain::write_hillshade_raster(in->dem, in->out, shade->params(), o);
        return 0;
      };
    });
  }
  {
    auto in = std::make_shared<DemInput>();
    auto units = std::make_shared<std::string>("degrees");
    auto method = std::make_shared<std::string>("horn");
    CLI::App* cmd =
        app.add_subcommand("slope", "Slope of a DEM into a Float32 GeoTIFF (holes 0 and masked)");
    add_dem_options(cmd, *in);
    cmd->add_option("--units", *units, "degrees or percent")
        ->check(one_of({"degrees", "percent"}))
        ->type_name("UNIT")
        ->capture_default_str();
    cmd->add_option("--method", *method, "Gradient: horn or zevenbergen-thorne")
        ->check(one_of({"horn", "zevenbergen-thorne"}))
        ->type_name("NAME")
        ->capture_default_str();
    cmd->callback([&action, &global, in, units, method] {
      action = [&global, in, units, method] {
        file_format_for(in->out, {FileFormat::geotiff});
        check_output_target(in->out);  // before the DEM is read
        terrain::ProductOptions o;
        o.read = in->read_options();
        o.compression = in->compression;
        o.progress = progress_for("slope", global);
        terrain::SlopeParams p{terrain::parse_slope_units(*units), *method == "zevenbergen-thorne"};
        terrain::write_slope_raster(in->dem, in->out, p, o);
        return 0;
      };
    });
  }
  {
    auto in = std::make_shared<DemInput>();
    auto shade = std::make_shared<ShadeInput>();
    auto ramp = std::make_shared<std::string>();
    auto rgba = std::make_shared<bool>(false);
    auto strength = std::make_shared<double>(0.5);
    CLI::App* cmd = app.add_subcommand(
        "tint", "Hypsometric tint of a DEM, multiplied by its hillshade, into an RGB GeoTIFF");
    add_dem_options(cmd, *in);
    cmd->add_option("--ramp", *ramp, "Elevation ramp file (YAML, see docs/relief.md)")
        ->required()
        ->type_name("FILE");
    cmd->add_flag("--rgba", *rgba, "Write RGBA (alpha 0 in holes) instead of RGB with a mask");
    cmd->add_option("--shade-strength", *strength, "0 = tint only, 1 = full hillshade multiply")
        ->check(number_from(0, 1, "a shading strength", ""))
        ->type_name("0..1")
        ->capture_default_str();
    add_shade_options(cmd, *shade);
    cmd->callback([&action, &global, in, shade, ramp, rgba, strength] {
      action = [&global, in, shade, ramp, rgba, strength] {
        file_format_for(in->out, {FileFormat::geotiff});
        check_output_target(in->out);  // before the DEM or the ramp is read
        terrain::ReliefParams p;
        p.tint = true;
        p.ramp = terrain::load_ramp_file(*ramp);
        p.shade = *strength > 0;
        p.shade_strength = *strength;
        p.shading = shade->params();
        terrain::ProductOptions o;
        o.read = in->read_options();
        o.compression = in->compression;
        o.progress = progress_for("tint", global);
        terrain::write_tint_raster(in->dem, in->out, p, *rgba, o);
        return 0;
      };
    });
  }
}

}  // namespace sheetmill::app
