// PLACEHOLDER: replaced by the stage that owns this command.
#include "app/commands.hpp"

namespace sheetmill::app {

void add_relief_commands(CLI::App&, Action&, const GlobalOptions&) {}

}  // namespace sheetmill::app
