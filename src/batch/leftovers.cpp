#include "sheetmill/batch/leftovers.hpp"

#include <map>
#include <optional>
#include <set>

#include "sheetmill/core/atomic_file.hpp"

namespace sheetmill::batch {

namespace fs = std::filesystem;

int remove_leftovers(const std::vector<SheetJob>& jobs) {
  // Folder -> the file names of this batch's outputs and stamps in it.
  std::map<fs::path, std::set<std::string>> outputs;
  for (const auto& j : jobs) {
    outputs[j.output.parent_path()].insert(j.output.filename().string());
    outputs[j.output.parent_path()].insert(j.output.filename().string() + ".stamp");
  }
  int removed = 0;
  for (const auto& [dir, names] : outputs) {
    std::error_code ec;
    for (fs::directory_iterator it(dir, ec), end; !ec && it != end; it.increment(ec)) {
      std::string entry = it->path().filename().string();
      if (entry.size() < 3 || entry[0] != '.') continue;
      // ".NAME.<tag>", or a temporary of a temporary ("..NAME.<tag>.<tag>", as the PDF
      // writer makes for its page groups): skip the leading dots, then try every later dot
      // as the end of NAME.
      std::size_t start = entry.find_first_not_of('.');
      bool ours = false;
      for (std::size_t dot = start == std::string::npos ? start : entry.find('.', start);
           dot != std::string::npos && !ours; dot = entry.find('.', dot + 1)) {
        ours = names.count(entry.substr(start, dot - start)) > 0;
      }
      // Only a dead writer's: a live process (a render of the same file started by hand, or
      // a batch that does not hold the folder lock) keeps its temporary.
      std::optional<pid_t> owner = temp_owner_pid(entry);
      if (ours && owner && process_alive(*owner)) ours = false;
      std::error_code rm;
      if (ours && it->is_regular_file(rm) && fs::remove(it->path(), rm)) ++removed;
    }
  }
  return removed;
}

}  // namespace sheetmill::batch
