#include "sheetmill/batch/selection.hpp"

#include <catch2/catch.hpp>
#include <cstdlib>
#include <map>
#include <string>

#include "sheetmill/core/error.hpp"

using namespace sheetmill::batch;

namespace {
std::vector<SheetJob> jobs(int n) {
  std::vector<SheetJob> out;
  // Scrambled order: the shards must not depend on the order features come in.
  for (int i = 0; i < n; ++i) {
    SheetJob j;
    int k = (i * 7919) % n;
    j.id = "S" + std::to_string(k);
    j.fields["zone"] = k % 3 == 0 ? "north" : "south";
    j.footprint = sheetmill::Box::of(k * 10.0, 0, k * 10.0 + 10, 10);
    out.push_back(j);
  }
  return out;
}
}  // namespace

TEST_CASE("shards together cover every sheet exactly once", "[batch]") {
  for (int total : {1, 5, 40, 101}) {
    auto all = jobs(total);
    for (int n : {1, 2, 3, 4, 7, 40, 150}) {
      std::map<std::string, int> seen;
      std::size_t largest = 0, smallest = all.size();
      for (int k = 0; k < n; ++k) {
        auto share = shard_sheets(all, Shard{k, n});
        largest = std::max(largest, share.size());
        smallest = std::min(smallest, share.size());
        for (const auto& j : share) ++seen[j.id];
      }
      INFO("sheets " << total << ", shards " << n);
      CHECK(seen.size() == all.size());
      for (const auto& [id, count] : seen) CHECK(count == 1);
      CHECK(largest - smallest <= 1);
    }
  }
  // Deterministic: the same share from a differently ordered index.
  auto a = jobs(40);
  auto b = a;
  std::reverse(b.begin(), b.end());
  auto sa = shard_sheets(a, {2, 4}), sb = shard_sheets(b, {2, 4});
  std::vector<std::string> ia, ib;
  for (auto& j : sa) ia.push_back(j.id);
  for (auto& j : sb) ib.push_back(j.id);
  std::sort(ia.begin(), ia.end());
  std::sort(ib.begin(), ib.end());
  CHECK(ia == ib);
}

TEST_CASE("shards 1/N to N/N, as written on the command line, cover every sheet once", "[batch]") {
  const std::vector<SheetJob> all = jobs(37);
  for (int n : {1, 2, 3, 6, 37, 50}) {
    std::map<std::string, int> seen;
    for (int k = 1; k <= n; ++k) {
      Shard s = parse_shard(std::to_string(k) + "/" + std::to_string(n), "--shard");
      CHECK(s.number() == k);
      for (const auto& j : shard_sheets(all, s)) ++seen[j.id];
    }
    INFO("shards " << n);
    CHECK(seen.size() == all.size());
    for (const auto& [id, times] : seen) CHECK(times == 1);
  }
}

TEST_CASE("the shard number comes from K/N or the scheduler's array index", "[batch]") {
  // K counts from 1 as people count: 1/4 is the first share, 4/4 the last.
  CHECK(parse_shard("1/4", "t").index == 0);
  CHECK(parse_shard("1/4", "t").number() == 1);
  CHECK(parse_shard("4/4", "t").index == 3);
  CHECK(parse_shard("3/4", "t").count == 4);
  CHECK_THROWS_AS(parse_shard("0/4", "t"), sheetmill::Error);
  CHECK_THROWS_AS(parse_shard("5/4", "t"), sheetmill::Error);
  CHECK_THROWS_AS(parse_shard("-1/4", "t"), sheetmill::Error);
  CHECK_THROWS_AS(parse_shard("1/0", "t"), sheetmill::Error);
  CHECK_THROWS_AS(parse_shard("x", "t"), sheetmill::Error);
  ::unsetenv("SLURM_ARRAY_TASK_ID");
  ::unsetenv("SLURM_ARRAY_TASK_MIN");
  ::setenv("JOB_COMPLETION_INDEX", "2", 1);
  CHECK(parse_shard("auto/3", "t").index == 2);  // the third share, shown as 3 of 3
  CHECK(parse_shard("auto/3", "t").number() == 3);
  // An array declared as --array=1-4 numbers its tasks from 1.
  ::setenv("SLURM_ARRAY_TASK_ID", "4", 1);
  ::setenv("SLURM_ARRAY_TASK_MIN", "1", 1);
  CHECK(parse_shard("auto/4", "t").index == 3);
  ::unsetenv("SLURM_ARRAY_TASK_ID");
  ::unsetenv("SLURM_ARRAY_TASK_MIN");
  ::unsetenv("JOB_COMPLETION_INDEX");
  CHECK_THROWS_AS(parse_shard("auto/4", "t"), sheetmill::Error);
}

TEST_CASE("sheets are selected by ID list, attribute or box", "[batch]") {
  auto all = jobs(10);
  Selection by_id;
  by_id.ids = {"S3", "S4"};
  CHECK(select_sheets(all, by_id, "t").size() == 2);
  by_id.ids = {"S3", "nope"};
  CHECK_THROWS_AS(select_sheets(all, by_id, "t"), sheetmill::Error);
  Selection by_field;
  by_field.field = "zone";
  by_field.value = "north";
  CHECK(select_sheets(all, by_field, "t").size() == 4);  // k = 0, 3, 6, 9
  by_field.field = "nosuch";
  CHECK_THROWS_AS(select_sheets(all, by_field, "t"), sheetmill::Error);
  Selection by_box;
  by_box.box = sheetmill::Box::of(15, 0, 25, 5);  // meets S1 (10..20) and S2 (20..30)
  CHECK(select_sheets(all, by_box, "t").size() == 2);
}
