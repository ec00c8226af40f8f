// `sheetmill demo-area OUTDIR [--seed N]`: generates the invented demo area (see
// docs/demo-area.md). Thin: parses options and calls sheetmill::demo::generate_demo_area().
#include <memory>
#include <string>

#include "app/commands.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/demo/demo_area.hpp"

namespace sheetmill::app {

void add_demo_area_command(CLI::App& app, Action& action, const GlobalOptions&) {
  struct Args {
    std::string outdir;
    demo::DemoAreaOptions options;
  };
  auto args = std::make_shared<Args>();
  CLI::App* cmd = app.add_subcommand(
      "demo-area", "Generate the invented demo area (DEM, features, sheet index) into OUTDIR");
  cmd->add_option("OUTDIR", args->outdir, "Folder to create (replaced if it holds a demo area)")
      ->required();
  cmd->add_option("--seed", args->options.seed, "Seed; the same seed gives the same area")
      ->capture_default_str();
  // Hidden: a coarser grid over the same ground, for fast tests.
  cmd->add_option("--size-scale", args->options.size_scale, "")->group("");
  cmd->callback([&action, args] {
    action = [args] {
      demo::DemoAreaSummary s = demo::generate_demo_area(args->outdir, args->options);
      log::info("demo-area: wrote {} ({} x {} cells at {} m, {:.0f}-{:.0f} m)", args->outdir,
                s.width, s.height, s.cell_m, s.min_elevation_m, s.max_elevation_m);
      return 0;
    };
  });
}

}  // namespace sheetmill::app
