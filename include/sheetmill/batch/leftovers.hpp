#pragma once
// Temporaries a killed batch left behind: ".NAME.<tag>" next to an output NAME (the pattern of
// core/atomic_file.hpp, also nested: "..NAME.<tag>.<tag>"), for this batch's outputs and stamps
// only, so shards sharing a folder never touch each other's files, and only those whose writer
// (the PID in the name) is no longer alive on this machine. Returns how many were removed.

#include <vector>

#include "sheetmill/batch/sheet_job.hpp"

namespace sheetmill::batch {

int remove_leftovers(const std::vector<SheetJob>& jobs);

}  // namespace sheetmill::batch
