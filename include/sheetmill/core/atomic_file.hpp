#pragma once
// An output file that appears whole or not at all. The content goes to a temporary file in the
// target's own folder (so the final rename is atomic on POSIX); commit() flushes it to disk and
// renames it over the target. Destroyed without commit(), the temporary is removed, so a failed
// or interrupted render never leaves a half-written file under the target's name.

#include <filesystem>
#include <string>

namespace sheetmill {

class AtomicOutput {
 public:
  explicit AtomicOutput(std::filesystem::path target);
  ~AtomicOutput();
  AtomicOutput(const AtomicOutput&) = delete;
  AtomicOutput& operator=(const AtomicOutput&) = delete;

  // Where to write. The file does not exist yet; writers create it.
  const std::filesystem::path& temp_path() const { return temp_; }
  const std::filesystem::path& target() const { return target_; }

  // fsyncs the temporary, renames it to the target and fsyncs the folder. Throws Error(input)
  // when the folder cannot be written.
  void commit();

 private:
  std::filesystem::path target_;
  std::filesystem::path temp_;
  bool committed_ = false;
};

// A unique temporary path next to `target`, e.g. "out/.demo-sheet.pdf.4711-3.part".
std::filesystem::path sibling_temp_path(const std::filesystem::path& target,
                                        const std::string& tag = "part");

}  // namespace sheetmill
