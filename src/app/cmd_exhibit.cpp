// `sheetmill exhibit EXHIBIT.yaml -o OUT.pdf|OUT.png [--dpi N]`: a large shaded-relief exhibit
// (docs/exhibit.md). Thin: parses options and calls sheetmill::exhibit::render_exhibit().
#include <memory>
#include <optional>
#include <string>

#include "app/commands.hpp"
#include "app/option_checks.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/render_exhibit.hpp"

namespace sheetmill::app {

namespace {
struct ExhibitArgs {
  std::string project;
  std::string output;
  std::optional<double> dpi;
};
}  // namespace

void add_exhibit_command(CLI::App& app, Action& action, const GlobalOptions&) {
  auto args = std::make_shared<ExhibitArgs>();
  CLI::App* cmd = app.add_subcommand(
      "exhibit", "Render a large shaded-relief exhibit (PDF, or PNG for slides and web pages)");
  cmd->add_option("project", args->project, "Exhibit project file (YAML)")
      ->required()
      ->type_name("FILE");
  cmd->add_option("-o,--output", args->output, "Output file: .pdf or .png")
      ->required()
      ->type_name("FILE");
  cmd->add_option("--dpi", args->dpi,
                  "PNG: image resolution (default 150); PDF: relief resolution (default: the "
                  "project's)")
      ->check(number_from(20, 1200, "a resolution", "dots per inch"))
      ->type_name("DPI");
  cmd->callback([args, &action] {
    action = [args] {
      exhibit::ExhibitProject project = exhibit::load_exhibit_project(args->project);
      exhibit::ExhibitOptions options;
      options.format = exhibit::format_for_path(args->output);
      if (options.format == exhibit::ExhibitFormat::png) {
        options.png_dpi = args->dpi.value_or(150);
      } else {
        options.relief_dpi = args->dpi;
      }
      exhibit::ExhibitReport r = exhibit::render_exhibit(project, args->output, options);
      log::info("wrote {} ({}, 1:{:.0f}) in {:.1f} s: relief {} x {} px in {} strips",
                r.output.string(), r.layout.paper_name, r.layout.frame.scale_denominator, r.seconds,
                r.relief_width_px, r.relief_height_px, r.relief_strips);
      return 0;
    };
  });
}

}  // namespace sheetmill::app
