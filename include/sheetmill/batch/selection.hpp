#pragma once
// Which sheets of a tile index a batch renders: an explicit list, an attribute match or a box,
// and then a deterministic share of them for one task of a job array.

#include <optional>
#include <string>
#include <vector>

#include "sheetmill/batch/sheet_job.hpp"
#include "sheetmill/core/geometry.hpp"

namespace sheetmill::batch {

struct Selection {
  std::vector<std::string> ids;      // empty = no restriction; unknown ID = input error
  std::optional<std::string> field;  // with `value`: keep sheets whose field == value
  std::string value;
  std::optional<Box> box;  // index CRS: keep sheets whose envelope meets it
};

// Task `index` of `count` (0 <= index < count).
// Share `index` (0-based, for arithmetic) of `count`; people see number() = index + 1.
struct Shard {
  int index = 0;
  int count = 1;
  int number() const { return index + 1; }
};

// Parses "K/N" (0-based K). K may be "auto": then it comes from the scheduler's array index,
// SLURM_ARRAY_TASK_ID (minus SLURM_ARRAY_TASK_MIN when set, so --array=1-4 works) or
// JOB_COMPLETION_INDEX. Throws Error(input) naming `where` when malformed or out of range.
Shard parse_shard(const std::string& text, const std::string& where);

// Keeps the selected sheets, in the order of `jobs`. Throws Error(input) for an ID not in the
// index or a field the index lacks.
std::vector<SheetJob> select_sheets(const std::vector<SheetJob>& jobs, const Selection& selection,
                                    const std::string& where);

// The shard's share: sheets sorted by ID, every count-th one from position index. The shares of
// index 0..count-1 are disjoint, cover the input exactly once, and differ in size by at most
// one, whatever order the index returns its features in.
std::vector<SheetJob> shard_sheets(const std::vector<SheetJob>& jobs, const Shard& shard);

}  // namespace sheetmill::batch
