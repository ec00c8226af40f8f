#pragma once
// Each subcommand lives in its own file (cmd_NAME.cpp) and registers itself on the parser with
// add_NAME_command(). The action it stores runs after parsing succeeds and returns an exit code.

#include <CLI/CLI.hpp>
#include <functional>

namespace sheetmill::app {

using Action = std::function<int()>;

// The options every command shares.
struct GlobalOptions {
  bool verbose = false;
  bool quiet = false;
};

void add_render_command(CLI::App& app, Action& action, const GlobalOptions& global);
void add_check_command(CLI::App& app, Action& action, const GlobalOptions& global);
void add_symbols_command(CLI::App& app, Action& action, const GlobalOptions& global);
void add_relief_commands(CLI::App& app, Action& action, const GlobalOptions& global);
void add_contours_command(CLI::App& app, Action& action, const GlobalOptions& global);
void add_declination_command(CLI::App& app, Action& action, const GlobalOptions& global);
void add_index_command(CLI::App& app, Action& action, const GlobalOptions& global);
void add_batch_command(CLI::App& app, Action& action, const GlobalOptions& global);
void add_exhibit_command(CLI::App& app, Action& action, const GlobalOptions& global);
void add_demo_area_command(CLI::App& app, Action& action, const GlobalOptions& global);
void add_accuracy_command(CLI::App& app, Action& action, const GlobalOptions& global);

}  // namespace sheetmill::app
