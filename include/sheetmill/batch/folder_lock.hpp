#pragma once
// An advisory lock (flock(2)) on a batch's output folder, held for the whole batch, so two
// batches never render the same sheets at once, delete each other's temporaries or overwrite
// each other's report. A whole batch locks ".sheetmill-batch.lock" exclusively. A shard locks it
// shared (the shards of one job array run side by side) and its own
// ".sheetmill-batch-K-of-N.lock" exclusively. The holder writes who it is (pid, host, start
// time) into the file it holds exclusively; a batch that finds the lock taken names the holder
// and throws Error(input) (exit 2), or with `wait` blocks until the holder ends.
//
// flock locks are released by the kernel when the holder dies, so a killed batch never leaves a
// stale lock. Over NFS, Linux maps flock onto the server's byte-range locks (nfs(5)).

#include <filesystem>
#include <optional>
#include <string>

#include "sheetmill/batch/selection.hpp"

namespace sheetmill::batch {

class FolderLock {
 public:
  FolderLock(const std::filesystem::path& dir, const std::optional<Shard>& shard, bool wait);
  ~FolderLock();
  FolderLock(const FolderLock&) = delete;
  FolderLock& operator=(const FolderLock&) = delete;

 private:
  int folder_fd_ = -1;
  int shard_fd_ = -1;
};

// "pid 4711 on host h since 2026-12-02T14:00:00Z (whole batch)", from a lock file's text.
std::string describe_lock_holder(const std::string& lock_file_text);

}  // namespace sheetmill::batch
