#include "sheetmill/app/app.hpp"

#include <cstdio>
#include <exception>

#include "app/commands.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/temp_registry.hpp"

namespace sheetmill::app {

int run(int argc, const char* const* argv) {
  CLI::App cli{"sheetmill: compile topographic map sheets and render them as print-ready PDF",
               "sheetmill"};
  cli.require_subcommand(1);
  cli.set_version_flag("--version", std::string("sheetmill ") + SHEETMILL_VERSION);
  GlobalOptions global;
  cli.add_flag("-v,--verbose", global.verbose, "More detail in the log");
  cli.add_flag("-q,--quiet", global.quiet, "Only errors");

  Action action;
  add_render_command(cli, action, global);
  add_relief_commands(cli, action, global);
  add_contours_command(cli, action, global);
  add_declination_command(cli, action, global);
  add_index_command(cli, action, global);
  add_batch_command(cli, action, global);
  add_exhibit_command(cli, action, global);
  add_demo_area_command(cli, action, global);

  try {
    cli.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    // Help and version are "errors" to CLI11 with exit code 0.
    if (e.get_exit_code() == 0) return cli.exit(e);
    std::fprintf(stderr, "sheetmill: %s (see sheetmill --help)\n", e.what());
    return 2;
  }
  log::set_level(global.quiet     ? log::Level::error
                 : global.verbose ? log::Level::debug
                                  : log::Level::info);
  // An interrupted render or batch removes its temporaries (core/temp_registry.hpp).
  install_temp_cleanup_on_signals();
  try {
    return action ? action() : 0;
  } catch (const Error& e) {
    std::fprintf(stderr, "sheetmill: %s%s\n",
                 e.kind() == Error::Kind::internal ? "internal error: " : "", e.what());
    return e.exit_code();
  } catch (const std::exception& e) {
    std::fprintf(stderr, "sheetmill: internal error: %s\n", e.what());
    return 1;
  }
}

}  // namespace sheetmill::app
