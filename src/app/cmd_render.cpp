#include <filesystem>

#include "app/commands.hpp"
#include "app/option_checks.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/file_format.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/plural.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/render/plates.hpp"
#include "sheetmill/render/render.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::app {

namespace {
struct RenderArgs {
  std::string project;
  std::string output;
  std::string sheet;
  std::string style;
  double dpi = 150;
  bool write_through_link = false;
  std::string print_profile;
  std::string plates;
  double plate_dpi = 300;
};
}  // namespace

void add_render_command(CLI::App& app, Action& action, const GlobalOptions&) {
  auto args = std::make_shared<RenderArgs>();
  CLI::App* cmd =
      app.add_subcommand("render", "Render one sheet of a project to PDF (or PNG/GeoTIFF)");
  cmd->add_option("project", args->project, "Project file (YAML)")->required()->type_name("FILE");
  cmd->add_option("-o,--output", args->output,
                  "Output file; its extension chooses the format: .pdf, .png, .tif or .tiff")
      ->required()
      ->type_name("FILE");
  cmd->add_option("--sheet", args->sheet,
                  "Render this tile-index sheet instead of the project's extent")
      ->type_name("ID");
  cmd->add_option("--style", args->style,
                  "Use this style file instead of the one the project names")
      ->type_name("FILE");
  cmd->add_option("--dpi", args->dpi, "Resolution of PNG/GeoTIFF output, dots per inch")
      ->check(number_from(20, 1200, "a resolution", "dots per inch"))
      ->type_name("DPI")
      ->capture_default_str();
  cmd->add_option("--print-profile", args->print_profile,
                  "Write the PDF as PDF/X-4 in CMYK for this ICC output profile (docs/print.md)")
      ->type_name("PROFILE.icc");
  cmd->add_option("--plates", args->plates,
                  "Also write one greyscale plate per ink of the style into this folder")
      ->type_name("DIR");
  cmd->add_option("--plate-dpi", args->plate_dpi, "Resolution of the plates, dots per inch")
      ->check(number_from(50, 2400, "a resolution", "dots per inch"))
      ->type_name("DPI")
      ->capture_default_str();
  cmd->add_flag("--write-through-link", args->write_through_link,
                "When the output is a symbolic link, replace the file it points to");
  cmd->callback([args, &action] {
    action = [args] {
      // The format and the target first: a bad output is refused before any data is read.
      check_output_target(
          args->output, args->write_through_link ? LinkPolicy::write_through : LinkPolicy::refuse);
      render::RenderOptions options;
      options.format =
          file_format_for(args->output, {FileFormat::pdf, FileFormat::png, FileFormat::geotiff});
      project::Project project = project::load_project(args->project);
      style::Style style = style::load_style(
          args->style.empty() ? project.style : std::filesystem::path(args->style));
      options.raster_dpi = args->dpi;
      options.write_through_link = args->write_through_link;
      if (!args->sheet.empty()) options.sheet_id = args->sheet;
      if (!args->print_profile.empty()) {
        if (options.format != FileFormat::pdf) {
          throw_input_error(args->output, "--print-profile writes PDF/X: expected a .pdf output");
        }
        options.print_profile = args->print_profile;
      }
      render::RenderReport report = render::render_sheet(project, style, args->output, options);
      for (const auto& layer : report.layers) {
        log::info("layer {}: {}, {} placed, {} dropped", layer.layer,
                  counted(layer.features, "feature"), counted(layer.labels_placed, "label"),
                  layer.labels_dropped);
      }
      if (!args->plates.empty()) {
        auto plates = render::render_plates(project, style, args->plates, args->plate_dpi, options);
        log::info("wrote {} plates to {}", plates.size(), args->plates);
      }
      log::info(
          "wrote {} in {:.2f} s (relief {:.2f} s, contours {:.2f} s, features {:.2f} s, "
          "labels {:.2f} s, finish {:.2f} s)",
          report.output.string(), report.seconds_total, report.seconds_relief,
          report.seconds_contours, report.seconds_features, report.seconds_labels,
          report.seconds_finish);
      return 0;
    };
  });
}

}  // namespace sheetmill::app
