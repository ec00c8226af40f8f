#pragma once
// The invented demo area: a DEM, vector features and a sheet index for the Harrowmere Valley, a
// scenario of our own (no real place), generated deterministically from a seed.
//
// generate_demo_area() writes into OUTDIR.part/ and renames it to OUTDIR only when every file,
// ending with OUTDIR/.complete, is written, so an interrupted run never leaves a half area under
// OUTDIR. An existing OUTDIR is replaced only if it is empty or itself a finished demo area;
// anything else is an input error (we never delete a folder we did not make).

#include <cstdint>
#include <filesystem>

namespace sheetmill::demo {

inline constexpr std::uint64_t kDefaultSeed = 20261201;

struct DemoAreaOptions {
  std::uint64_t seed = kDefaultSeed;
  // 1 = the full 4000 x 3000 grid at 5 m; smaller = coarser cells over the same ground (tests).
  double size_scale = 1.0;
};

struct DemoAreaSummary {
  int width = 0;
  int height = 0;
  double cell_m = 0;
  double min_elevation_m = 0;
  double max_elevation_m = 0;
  int water_line_count = 0;
  int road_count = 0;
  int building_count = 0;
};

DemoAreaSummary generate_demo_area(const std::filesystem::path& outdir,
                                   const DemoAreaOptions& options = {});

}  // namespace sheetmill::demo
