#pragma once
// The temporary files this process is writing, and the worker processes it has started, so that
// SIGINT and SIGTERM leave nothing behind: the handler unlinks every live temporary, asks each
// registered child to do the same (SIGTERM, then waits for it), restores the default action and
// re-raises the signal, so the exit status still says which signal ended the process.
//
// The handler only calls async-signal-safe functions (unlink, kill, waitpid, sigaction, raise)
// and reads a fixed table of slots; registering a path copies it into a free slot. When all
// slots are taken the path is still removed by its owner's destructor, only not on a signal.

#include <sys/types.h>

#include <filesystem>

namespace sheetmill {

// Installs the handler for SIGINT, SIGTERM and SIGHUP. Idempotent.
void install_temp_cleanup_on_signals();

// A slot number for unregister_temp(), or -1 when the table is full.
int register_temp(const std::filesystem::path& path);
void unregister_temp(int slot);

void register_child(pid_t pid);
void unregister_child(pid_t pid);

// In a freshly forked child: the parent's temporaries and children are not its own.
void forget_inherited_temps_and_children();

// The number of live registered temporaries (for tests).
int registered_temp_count();

}  // namespace sheetmill
