#include "sheetmill/core/atomic_file.hpp"

#include <fcntl.h>
#include <signal.h>
#include <sys/stat.h>
#include <unistd.h>

#include <atomic>
#include <cerrno>
#include <cstring>
#include <fstream>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/core/temp_registry.hpp"

namespace sheetmill {

namespace fs = std::filesystem;

namespace {

fs::path folder_of(const fs::path& p) {
  return p.parent_path().empty() ? fs::path(".") : p.parent_path();
}

const char* kind_of(mode_t mode) {
  if (S_ISCHR(mode)) return "a character device";
  if (S_ISBLK(mode)) return "a block device";
  if (S_ISFIFO(mode)) return "a FIFO";
  if (S_ISSOCK(mode)) return "a socket";
  if (S_ISDIR(mode)) return "a folder";
  return "not a regular file";
}

// Throws unless `p` is absent or a regular file (a link is not followed).
void require_regular_or_absent(const fs::path& p, const std::string& shown_as) {
  struct stat st {};
  if (::lstat(p.c_str(), &st) != 0) {
    if (errno == ENOENT) return;
    throw_input_error(shown_as, "cannot check the output: " + errno_text(errno));
  }
  if (S_ISREG(st.st_mode)) return;
  if (S_ISLNK(st.st_mode)) {
    throw_input_error(shown_as,
                      "is a symbolic link; sheetmill replaces only regular files (render "
                      "--write-through-link writes to the file it points to)");
  }
  throw_input_error(shown_as, std::string("is ") + kind_of(st.st_mode) +
                                  ", not a regular file; sheetmill writes only regular files");
}

void fsync_folder(const fs::path& dir) {
  int fd = ::open(dir.c_str(), O_RDONLY | O_DIRECTORY | O_CLOEXEC);
  if (fd >= 0) {
    ::fsync(fd);  // best effort: the file is complete under its name either way
    ::close(fd);
  }
}

}  // namespace

fs::path resolve_output_target(const fs::path& target, LinkPolicy links) {
  const std::string shown = target.string();
  fs::path dir = folder_of(target);
  struct stat st {};
  if (::stat(dir.c_str(), &st) != 0) {
    if (errno == ENOENT)
      throw_input_error(shown, "the output folder " + dir.string() + " does not exist");
    throw_input_error(shown,
                      "cannot use the output folder " + dir.string() + ": " + errno_text(errno));
  }
  if (!S_ISDIR(st.st_mode)) throw_input_error(shown, dir.string() + " is not a folder");
  fs::path file = target;
  if (links == LinkPolicy::write_through && ::lstat(target.c_str(), &st) == 0 &&
      S_ISLNK(st.st_mode)) {
    std::error_code ec;
    file = fs::weakly_canonical(target, ec);
    if (ec) throw_input_error(shown, "cannot follow the symbolic link: " + ec.message());
    if (!fs::is_directory(folder_of(file), ec)) {
      throw_input_error(shown, "the symbolic link points into " + folder_of(file).string() +
                                   ", which is not a folder");
    }
    require_regular_or_absent(file, shown + " -> " + file.string());
    return file;
  }
  require_regular_or_absent(file, shown);
  return file;
}

void check_output_target(const fs::path& target, LinkPolicy links) {
  fs::path file = resolve_output_target(target, links);
  TempFile probe(sibling_temp_path(file, "probe"), target.string());
}

TempFile::TempFile(fs::path path, const std::string& shown_as) : path_(std::move(path)) {
  // Registered before it exists: a signal between the two must not leave it behind.
  slot_ = register_temp(path_);
  int fd = ::open(path_.c_str(), O_WRONLY | O_CREAT | O_EXCL | O_CLOEXEC, 0666);
  if (fd < 0) {
    int err = errno;
    unregister_temp(slot_);
    throw_input_error(shown_as,
                      "cannot write in " + folder_of(path_).string() + ": " + errno_text(err));
  }
  ::close(fd);
}

TempFile::~TempFile() {
  if (!released_) ::unlink(path_.c_str());
  unregister_temp(slot_);
}

void TempFile::release() {
  released_ = true;
  unregister_temp(slot_);
  slot_ = -1;
}

fs::path sibling_temp_path(const fs::path& target, const std::string& tag) {
  static std::atomic<unsigned> counter{0};
  fs::path dir = target.parent_path();
  std::string name = "." + target.filename().string() + "." + std::to_string(::getpid()) + "-" +
                     std::to_string(counter++) + "." + tag;
  return dir.empty() ? fs::path(name) : dir / name;
}

std::optional<pid_t> temp_owner_pid(const std::string& file_name) {
  if (file_name.size() < 2 || file_name[0] != '.') return std::nullopt;
  // From the right, the first ".PID-SERIAL." component: the outermost writer's (the tag may
  // itself contain dots, "part.gpkg").
  std::size_t end = file_name.size();
  while (end > 0) {
    std::size_t dot = file_name.rfind('.', end - 1);
    if (dot == std::string::npos || dot == 0) break;
    std::string part = file_name.substr(dot + 1, end - dot - 1);
    std::size_t dash = part.find('-');
    auto digits = [](const std::string& s) {
      return !s.empty() && s.find_first_not_of("0123456789") == std::string::npos;
    };
    if (dash != std::string::npos && digits(part.substr(0, dash)) &&
        digits(part.substr(dash + 1)) && dash <= 9) {
      return static_cast<pid_t>(std::stol(part.substr(0, dash)));
    }
    end = dot;
  }
  return std::nullopt;
}

bool process_alive(pid_t pid) {
  if (pid <= 0) return false;
  if (::kill(pid, 0) != 0 && errno != EPERM) return false;
  // A zombie (killed, not yet reaped: an orphaned batch worker under a container's init that
  // does not reap) answers kill() but writes nothing: state Z or X in /proc/PID/stat (proc(5)).
  std::ifstream stat("/proc/" + std::to_string(pid) + "/stat");
  std::string line;
  if (!std::getline(stat, line)) return true;
  std::size_t paren = line.rfind(')');
  char state = paren != std::string::npos && paren + 2 < line.size() ? line[paren + 2] : '?';
  return state != 'Z' && state != 'X';
}

int remove_stale_temps(const fs::path& target) {
  const std::string name = target.filename().string();
  int removed = 0;
  std::error_code ec;
  for (fs::directory_iterator it(folder_of(target), ec), end; !ec && it != end; it.increment(ec)) {
    std::string entry = it->path().filename().string();
    std::size_t start = entry.find_first_not_of('.');
    if (start == 0 || start == std::string::npos) continue;
    if (entry.compare(start, name.size() + 1, name + ".") != 0) continue;
    std::optional<pid_t> owner = temp_owner_pid(entry);
    std::error_code rm;
    if (owner && !process_alive(*owner) && it->is_regular_file(rm) && fs::remove(it->path(), rm)) {
      ++removed;
    }
  }
  return removed;
}

AtomicOutput::AtomicOutput(fs::path target, LinkPolicy links)
    : target_(std::move(target)),
      file_(resolve_output_target(target_, links)),
      temp_((remove_stale_temps(file_), sibling_temp_path(file_)), target_.string()) {}

void AtomicOutput::clear_temp_for_writer() {
  ::unlink(temp_.path().c_str());
}

void AtomicOutput::commit() {
  if (committed_) return;
  const std::string shown = target_.string();
  int fd = ::open(temp_.path().c_str(), O_RDONLY | O_CLOEXEC);
  if (fd < 0) throw_input_error(shown, "cannot write: " + errno_text(errno));
  if (::fsync(fd) != 0 && errno != EINVAL) {
    int err = errno;
    ::close(fd);
    throw_input_error(shown, "cannot write: " + errno_text(err));
  }
  ::close(fd);
  // Checked again: something may have been put there while the output was being made.
  require_regular_or_absent(file_, shown);
  if (::rename(temp_.path().c_str(), file_.c_str()) != 0) {
    throw_input_error(shown, "cannot write: " + errno_text(errno));
  }
  temp_.release();
  committed_ = true;
  fsync_folder(folder_of(file_));
}

}  // namespace sheetmill
