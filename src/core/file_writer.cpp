#include "sheetmill/core/file_writer.hpp"

#include <fcntl.h>
#include <sys/statvfs.h>
#include <unistd.h>

#include <cctype>
#include <cerrno>
#include <cstring>

#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"

namespace sheetmill {

std::string errno_text(int err) {
  std::string s = std::strerror(err);
  if (!s.empty()) s[0] = static_cast<char>(std::tolower(static_cast<unsigned char>(s[0])));
  return s;
}

FileWriter::FileWriter(const std::filesystem::path& path, std::string shown_as)
    : shown_as_(std::move(shown_as)) {
  fd_ = ::open(path.c_str(), O_WRONLY | O_CREAT | O_TRUNC | O_CLOEXEC, 0666);
  if (fd_ < 0) throw_input_error(shown_as_, "cannot create the file: " + errno_text(errno));
}

FileWriter::~FileWriter() {
  if (fd_ >= 0) ::close(fd_);
}

void FileWriter::write(const void* data, std::size_t bytes) {
  if (fd_ < 0) throw_internal_error("FileWriter::write after close: " + shown_as_);
  const char* p = static_cast<const char*>(data);
  while (bytes > 0) {
    ssize_t n = ::write(fd_, p, bytes);
    if (n < 0) {
      if (errno == EINTR) continue;
      throw_input_error(shown_as_, "cannot write: " + errno_text(errno));
    }
    if (n == 0) throw_input_error(shown_as_, "cannot write: " + errno_text(ENOSPC));
    p += n;
    bytes -= static_cast<std::size_t>(n);
    bytes_ += static_cast<std::size_t>(n);
  }
}

void FileWriter::close(bool sync) {
  if (fd_ < 0) return;
  int fd = fd_;
  fd_ = -1;
  // On NFS and with delayed allocation a full disk may show only here.
  if (sync && ::fsync(fd) != 0 && errno != EINVAL) {
    int err = errno;
    ::close(fd);
    throw_input_error(shown_as_, "cannot write: " + errno_text(err));
  }
  if (::close(fd) != 0 && errno != EINTR) {
    throw_input_error(shown_as_, "cannot write: " + errno_text(errno));
  }
}

void write_file_atomically(const std::filesystem::path& target, std::string_view text) {
  AtomicOutput out(target);
  FileWriter f(out.temp_path(), target.string());
  f.write(text);
  f.close();
  out.commit();
}

std::string library_write_failure(const std::filesystem::path& target,
                                  const std::string& library_message) {
  for (int err : {ENOSPC, EDQUOT, EFBIG, EIO, EROFS, EACCES}) {
    std::string text = std::strerror(err);
    if (library_message.find(text) != std::string::npos ||
        library_message.find(errno_text(err)) != std::string::npos) {
      return errno_text(err) + " (" + library_message + ")";
    }
  }
  // SQLite's words for SQLITE_FULL (its sqlite3ErrStr table).
  if (library_message.find("database or disk is full") != std::string::npos) {
    return errno_text(ENOSPC) + " (" + library_message + ")";
  }
  std::filesystem::path dir = target.parent_path().empty() ? "." : target.parent_path();
  struct statvfs fs {};
  // Less than 1 MiB and under 5 % free after a failed write: the disk is full (a failed tile or
  // page write leaves at most its own size unused).
  constexpr double kFullBytes = 1024.0 * 1024.0, kFullFraction = 0.05;
  if (::statvfs(dir.c_str(), &fs) == 0 && fs.f_blocks > 0 &&
      double(fs.f_bavail) * double(fs.f_frsize) < kFullBytes &&
      double(fs.f_bavail) < kFullFraction * double(fs.f_blocks)) {
    return errno_text(ENOSPC) + (library_message.empty() ? "" : " (" + library_message + ")");
  }
  return library_message.empty() ? std::string("the library gave no reason") : library_message;
}

}  // namespace sheetmill
