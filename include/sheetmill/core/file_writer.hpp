#pragma once
// Checked writes to a file: every write(2), the fsync and the close are checked, and a failure
// throws Error(input) naming the file as the user knows it and the system's reason in words
// ("no space left on device"). A short write is retried until the disk refuses.

#include <cstddef>
#include <filesystem>
#include <string>
#include <string_view>

namespace sheetmill {

// strerror(err) with a lower-case first letter, as it reads inside a sentence.
std::string errno_text(int err);

class FileWriter {
 public:
  // Opens `path` for writing, truncating it. `shown_as` names the file in messages (the target
  // the user asked for, not the temporary). Throws Error(input) when it cannot be opened.
  FileWriter(const std::filesystem::path& path, std::string shown_as);
  ~FileWriter();  // closes quietly when close() was not called (the caller is unwinding)
  FileWriter(const FileWriter&) = delete;
  FileWriter& operator=(const FileWriter&) = delete;

  void write(const void* data, std::size_t bytes);
  void write(std::string_view text) { write(text.data(), text.size()); }
  // fsync (unless `sync` is false, for scratch files) and close; after this the bytes are on
  // disk or an Error was thrown.
  void close(bool sync = true);
  std::size_t bytes_written() const { return bytes_; }
  const std::string& shown_as() const { return shown_as_; }

 private:
  int fd_ = -1;
  std::size_t bytes_ = 0;
  std::string shown_as_;
};

// Writes `text` to `target` atomically (AtomicOutput) with checked writes.
void write_file_atomically(const std::filesystem::path& target, std::string_view text);

// Why a library (GDAL, libtiff, SQLite) failed to write `target`: the system's reason when the
// library's own message carries one, else "no space left on device" when the target's
// filesystem has (almost) no room left, else the library's message. Libraries that write from
// their own threads do not hand back errno, so the filesystem is asked.
std::string library_write_failure(const std::filesystem::path& target,
                                  const std::string& library_message);

}  // namespace sheetmill
