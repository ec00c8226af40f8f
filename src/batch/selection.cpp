#include "sheetmill/batch/selection.hpp"

#include <algorithm>
#include <charconv>
#include <cstdlib>
#include <numeric>
#include <set>

#include "sheetmill/batch/output_name.hpp"
#include "sheetmill/core/error.hpp"

namespace sheetmill::batch {

namespace {

std::optional<long> parse_long(std::string_view s) {
  long v = 0;
  auto [p, ec] = std::from_chars(s.data(), s.data() + s.size(), v);
  if (ec != std::errc() || p != s.data() + s.size() || s.empty()) return std::nullopt;
  return v;
}

std::optional<long> env_long(const char* name) {
  const char* v = std::getenv(name);
  if (!v) return std::nullopt;
  return parse_long(v);
}

}  // namespace

Shard parse_shard(const std::string& text, const std::string& where) {
  std::size_t slash = text.find('/');
  if (slash == std::string::npos) {
    throw_input_error(where,
                      "expected a shard as K/N with K from 1 to N (for example 1/4), or auto/N, "
                      "got \"" +
                          text + "\"");
  }
  std::string k_text = text.substr(0, slash);
  auto n = parse_long(std::string_view(text).substr(slash + 1));
  if (!n || *n < 1 || *n > 1000000) {
    throw_input_error(where, "expected a number of shards N of at least 1 in \"" + text + "\"");
  }
  // K counts from 1 as people count; the scheduler's array index counts from 0 (after
  // subtracting the array's first index), so auto adds 1.
  std::optional<long> k;
  if (k_text == "auto") {
    if (auto slurm = env_long("SLURM_ARRAY_TASK_ID")) {
      k = *slurm - env_long("SLURM_ARRAY_TASK_MIN").value_or(0) + 1;
    } else if (auto indexed = env_long("JOB_COMPLETION_INDEX")) {
      k = *indexed + 1;
    } else {
      throw_input_error(where,
                        "--shard auto/N needs SLURM_ARRAY_TASK_ID or JOB_COMPLETION_INDEX in the "
                        "environment");
    }
  } else {
    k = parse_long(k_text);
    if (!k) throw_input_error(where, "expected a shard number K in \"" + text + "\"");
  }
  if (*k < 1 || *k > *n) {
    throw_input_error(where, "shard " + std::to_string(*k) + " is not between 1 and " +
                                 std::to_string(*n) + " (shards count from 1)");
  }
  return Shard{static_cast<int>(*k - 1), static_cast<int>(*n)};
}

std::vector<SheetJob> select_sheets(const std::vector<SheetJob>& jobs, const Selection& selection,
                                    const std::string& where) {
  std::set<std::string> wanted(selection.ids.begin(), selection.ids.end());
  if (!wanted.empty()) {
    std::set<std::string> known;
    for (const auto& j : jobs) known.insert(j.id);
    for (const auto& id : wanted) {
      if (!known.count(id)) {
        throw_input_error(where,
                          "sheet \"" + sanitise_component(id) + "\" is not in the tile index");
      }
    }
  }
  if (selection.field && !jobs.empty() && *selection.field != "id" && *selection.field != "name" &&
      !jobs.front().fields.count(*selection.field)) {
    throw_input_error(where, "the tile index has no field \"" + *selection.field + "\"");
  }
  std::vector<SheetJob> out;
  for (const auto& j : jobs) {
    if (!wanted.empty() && !wanted.count(j.id)) continue;
    if (selection.field) {
      const std::string& f = *selection.field;
      std::string v = f == "id" ? j.id : f == "name" ? j.name : j.fields.at(f);
      if (v != selection.value) continue;
    }
    if (selection.box && !selection.box->intersects(j.footprint)) continue;
    out.push_back(j);
  }
  return out;
}

std::vector<SheetJob> shard_sheets(const std::vector<SheetJob>& jobs, const Shard& shard) {
  std::vector<std::size_t> order(jobs.size());
  std::iota(order.begin(), order.end(), 0);
  // Ties (duplicate IDs) are an error later; break them by position so the order is total.
  std::sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
    return jobs[a].id != jobs[b].id ? jobs[a].id < jobs[b].id : a < b;
  });
  std::vector<bool> keep(jobs.size(), false);
  for (std::size_t pos = static_cast<std::size_t>(shard.index); pos < order.size();
       pos += static_cast<std::size_t>(shard.count)) {
    keep[order[pos]] = true;
  }
  std::vector<SheetJob> out;
  for (std::size_t i = 0; i < jobs.size(); ++i) {
    if (keep[i]) out.push_back(jobs[i]);
  }
  return out;
}

}  // namespace sheetmill::batch
