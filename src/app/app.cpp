#include "sheetmill/app/app.hpp"

#include <cstdio>
#include <exception>

#include "app/commands.hpp"
#include "app/option_checks.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/temp_registry.hpp"

namespace sheetmill::app {

namespace {

// The whole command line: every subcommand registered on `cli`.
void add_commands(CLI::App& cli, Action& action, GlobalOptions& global) {
  cli.require_subcommand(1);
  cli.set_version_flag("--version", std::string("sheetmill ") + SHEETMILL_VERSION);
  cli.add_flag("-v,--verbose", global.verbose, "More detail in the log");
  cli.add_flag("-q,--quiet", global.quiet, "Only errors");
  add_render_command(cli, action, global);
  add_check_command(cli, action, global);
  add_symbols_command(cli, action, global);
  add_relief_commands(cli, action, global);
  add_contours_command(cli, action, global);
  add_declination_command(cli, action, global);
  add_index_command(cli, action, global);
  add_batch_command(cli, action, global);
  add_exhibit_command(cli, action, global);
  add_demo_area_command(cli, action, global);
  add_accuracy_command(cli, action, global);
}

constexpr const char* kDescription =
    "sheetmill: compile topographic map sheets and render them as print-ready PDF";

}  // namespace

std::map<std::string, std::vector<std::string>> command_options() {
  CLI::App cli{kDescription, "sheetmill"};
  Action action;
  GlobalOptions global;
  add_commands(cli, action, global);
  std::map<std::string, std::vector<std::string>> out;
  for (const CLI::App* sub : cli.get_subcommands([](const CLI::App*) { return true; })) {
    if (sub->get_group().empty()) continue;  // hidden
    std::vector<std::string>& names = out[sub->get_name()];
    for (const CLI::Option* opt : sub->get_options()) {
      if (opt->get_group().empty()) continue;  // hidden options are not documented
      for (const auto& l : opt->get_lnames()) names.push_back("--" + l);
      for (const auto& s : opt->get_snames()) names.push_back("-" + s);
      if (opt->get_positional()) names.push_back(opt->get_name());
    }
  }
  return out;
}

int run(int argc, const char* const* argv) {
  CLI::App cli{kDescription, "sheetmill"};
  GlobalOptions global;
  Action action;
  add_commands(cli, action, global);

  try {
    cli.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    // Help and version are "errors" to CLI11 with exit code 0.
    if (e.get_exit_code() == 0) return cli.exit(e);
    auto used = cli.get_subcommands();
    const std::string command = used.empty() ? "" : used.front()->get_name();
    std::fprintf(stderr, "sheetmill: %s\n", describe_parse_error(e, command).c_str());
    return 2;
  }
  log::set_level(global.quiet     ? log::Level::error
                 : global.verbose ? log::Level::debug
                                  : log::Level::info);
  // An interrupted render or batch removes its temporaries (core/temp_registry.hpp).
  install_temp_cleanup_on_signals();
  try {
    gdal_init();  // from here on GDAL's own messages go through the log
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
