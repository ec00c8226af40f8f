#pragma once
// The command-line front end as a library call, so tests reach every command without spawning
// a process. run() parses arguments, runs one subcommand, and turns the one error type into an
// exit code: 0 done, 2 input error (one line on stderr), 1 internal fault.

#include <map>
#include <string>
#include <vector>

namespace sheetmill::app {

int run(int argc, const char* const* argv);

// Every subcommand with the names of its options ("--output", "-o") and its positional
// arguments (by their help names, "project"), as the parser knows them. The documentation test
// holds docs/commands.md against this list.
std::map<std::string, std::vector<std::string>> command_options();

}  // namespace sheetmill::app
