#pragma once
// An output file that appears whole or not at all. The content goes to a temporary file in the
// target's own folder (so the final rename is atomic on POSIX); commit() flushes it to disk and
// renames it over the target. Destroyed without commit(), the temporary is removed, and a
// signal removes it too (core/temp_registry.hpp), so a failed or interrupted render never leaves
// a half-written file under the target's name, nor a temporary beside it.
//
// Only regular files are ever replaced: a device node, a FIFO, a folder or a socket at the
// target is refused, and so is a symbolic link unless the caller asks to write through it (then
// the file the link points to is replaced and the link stays).

#include <sys/types.h>

#include <filesystem>
#include <optional>
#include <string>

namespace sheetmill {

enum class LinkPolicy { refuse, write_through };

// The file a write to `target` replaces: `target` itself, or the file a symbolic link points to
// under LinkPolicy::write_through. Throws Error(input) with the path and the reason when the
// folder is missing or not a folder, or the target is not a regular file.
std::filesystem::path resolve_output_target(const std::filesystem::path& target,
                                            LinkPolicy links = LinkPolicy::refuse);

// resolve_output_target() and a probe file created and removed in the folder: the up-front
// check that an output can be written at all, before any data is read. Throws Error(input)
// naming the folder and the reason ("read-only file system", "permission denied").
void check_output_target(const std::filesystem::path& target,
                         LinkPolicy links = LinkPolicy::refuse);

// A temporary file created exclusively (O_EXCL) and empty, registered for removal on SIGINT
// and SIGTERM; removed when destroyed unless release()d. Throws Error(input) naming `shown_as`
// when the folder refuses it.
class TempFile {
 public:
  TempFile(std::filesystem::path path, const std::string& shown_as);
  ~TempFile();
  TempFile(const TempFile&) = delete;
  TempFile& operator=(const TempFile&) = delete;
  const std::filesystem::path& path() const { return path_; }
  // The file was renamed away or is someone else's to remove now.
  void release();

 private:
  std::filesystem::path path_;
  int slot_ = -1;
  bool released_ = false;
};

class AtomicOutput {
 public:
  explicit AtomicOutput(std::filesystem::path target, LinkPolicy links = LinkPolicy::refuse);
  ~AtomicOutput() = default;
  AtomicOutput(const AtomicOutput&) = delete;
  AtomicOutput& operator=(const AtomicOutput&) = delete;

  // Where to write: an empty file that exists already; writers truncate or replace it.
  const std::filesystem::path& temp_path() const { return temp_.path(); }
  // Removes the empty temporary for a writer that insists on creating its file itself (GDAL's
  // GeoPackage driver); the name stays this output's, and is still removed on failure.
  void clear_temp_for_writer();
  // The path as the caller named it (for messages).
  const std::filesystem::path& target() const { return target_; }

  // fsyncs the temporary (a failure names its errno), checks again that the file it replaces
  // is regular, renames the temporary over it and fsyncs the folder. Throws Error(input).
  void commit();

 private:
  std::filesystem::path target_;
  std::filesystem::path file_;  // what the rename replaces
  TempFile temp_;
  bool committed_ = false;
};

// A unique temporary path next to `target`: ".NAME.PID-SERIAL.TAG", e.g.
// "out/.demo-sheet.pdf.4711-3.part". The PID says whose it is (temp_owner_pid).
std::filesystem::path sibling_temp_path(const std::filesystem::path& target,
                                        const std::string& tag = "part");

// The process that made a temporary named by sibling_temp_path (also nested, a temporary of a
// temporary: the outermost writer), or nullopt when `file_name` is not such a name.
std::optional<pid_t> temp_owner_pid(const std::string& file_name);

// Whether a process with this id runs on this machine (kill(pid, 0)).
bool process_alive(pid_t pid);

// Removes the temporaries of `target` (".NAME.*" as above) whose writer is no longer alive, so a
// killed render's leftovers go with the next write of the same file. Returns how many.
int remove_stale_temps(const std::filesystem::path& target);

}  // namespace sheetmill
