#pragma once
// The command-line front end as a library call, so tests reach every command without spawning
// a process. run() parses arguments, runs one subcommand, and turns the one error type into an
// exit code: 0 done, 2 input error (one line on stderr), 1 internal fault.

namespace sheetmill::app {

int run(int argc, const char* const* argv);

}  // namespace sheetmill::app
