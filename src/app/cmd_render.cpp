// PLACEHOLDER: replaced by the stage that owns this command.
#include "app/commands.hpp"

namespace sheetmill::app {

void add_render_command(CLI::App&, Action&, const GlobalOptions&) {}

}  // namespace sheetmill::app
