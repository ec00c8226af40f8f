#include <filesystem>

#include "app/commands.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/render/render.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::app {

namespace {
struct RenderArgs {
  std::string project;
  std::string output;
  std::string sheet;
  double dpi = 150;
  bool write_through_link = false;
};

render::OutputFormat format_for(const std::filesystem::path& out) {
  std::string ext = out.extension().string();
  if (ext == ".png") return render::OutputFormat::png;
  if (ext == ".tif" || ext == ".tiff") return render::OutputFormat::geotiff;
  return render::OutputFormat::pdf;
}
}  // namespace

void add_render_command(CLI::App& app, Action& action, const GlobalOptions&) {
  auto args = std::make_shared<RenderArgs>();
  CLI::App* cmd =
      app.add_subcommand("render", "Render one sheet of a project to PDF (or PNG/GeoTIFF)");
  cmd->add_option("project", args->project, "Project file (YAML)")->required();
  cmd->add_option("-o,--output", args->output, "Output file: .pdf, .png or .tif")->required();
  cmd->add_option("--sheet", args->sheet,
                  "Render this tile-index sheet instead of the project's extent");
  cmd->add_option("--dpi", args->dpi, "Resolution of PNG/GeoTIFF output")
      ->check(CLI::Range(20.0, 1200.0));
  cmd->add_flag("--write-through-link", args->write_through_link,
                "When the output is a symbolic link, replace the file it points to");
  cmd->callback([args, &action] {
    action = [args] {
      // Before the project is read: a bad output path is found at once.
      check_output_target(
          args->output, args->write_through_link ? LinkPolicy::write_through : LinkPolicy::refuse);
      project::Project project = project::load_project(args->project);
      style::Style style = style::load_style(project.style);
      render::RenderOptions options;
      options.format = format_for(args->output);
      options.raster_dpi = args->dpi;
      options.write_through_link = args->write_through_link;
      if (!args->sheet.empty()) options.sheet_id = args->sheet;
      render::RenderReport report = render::render_sheet(project, style, args->output, options);
      for (const auto& layer : report.layers) {
        log::info("layer {}: {} features, {} labels placed, {} dropped", layer.layer,
                  layer.features, layer.labels_placed, layer.labels_dropped);
      }
      log::info(
          "wrote {} in {:.1f} s (relief {:.1f} s, contours {:.1f} s, features {:.1f} s, "
          "labels {:.1f} s, finish {:.1f} s)",
          report.output.string(), report.seconds_total, report.seconds_relief,
          report.seconds_contours, report.seconds_features, report.seconds_labels,
          report.seconds_finish);
      return 0;
    };
  });
}

}  // namespace sheetmill::app
