#include "sheetmill/demo/demo_area.hpp"

#include <fcntl.h>
#include <unistd.h>

#include <algorithm>
#include <fstream>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/demo/buildings.hpp"
#include "sheetmill/demo/carve.hpp"
#include "sheetmill/demo/drainage.hpp"
#include "sheetmill/demo/hollows.hpp"
#include "sheetmill/demo/hydrography.hpp"
#include "sheetmill/demo/landcover.hpp"
#include "sheetmill/demo/names.hpp"
#include "sheetmill/demo/power.hpp"
#include "sheetmill/demo/relief_points.hpp"
#include "sheetmill/demo/scenario.hpp"
#include "sheetmill/demo/settlements.hpp"
#include "sheetmill/demo/terrain.hpp"
#include "sheetmill/demo/tiles.hpp"
#include "sheetmill/demo/writers.hpp"

namespace sheetmill::demo {

namespace fs = std::filesystem;

namespace {

fs::path with_suffix(const fs::path& dir, const std::string& suffix) {
  fs::path clean = dir;
  if (!clean.has_filename()) clean = clean.parent_path();  // "out/" -> "out"
  return clean.parent_path() / (clean.filename().string() + suffix);
}

void check_replaceable(const fs::path& outdir) {
  std::error_code ec;
  if (!fs::exists(outdir, ec)) return;
  if (!fs::is_directory(outdir, ec)) {
    throw_input_error(outdir.string(), "exists and is not a folder");
  }
  if (fs::is_empty(outdir, ec) || fs::exists(outdir / ".complete", ec)) return;
  throw_input_error(outdir.string(),
                    "exists and is not a demo area; choose an empty or new folder");
}

void fsync_path(const fs::path& p, int flags) {
  int fd = ::open(p.c_str(), flags);
  if (fd >= 0) {
    ::fsync(fd);
    ::close(fd);
  }
}

// Moves the finished scratch folder into place; an old demo area there is removed after.
void publish(const fs::path& part, const fs::path& outdir) {
  std::error_code ec;
  fs::path old;
  if (fs::exists(outdir, ec)) {
    old = with_suffix(outdir, ".old-" + std::to_string(::getpid()));
    fs::rename(outdir, old, ec);
    if (ec) throw_input_error(outdir.string(), "cannot replace: " + ec.message());
  }
  fs::rename(part, outdir, ec);
  if (ec) throw_input_error(outdir.string(), "cannot create: " + ec.message());
  fs::path parent = outdir.parent_path();
  fsync_path(parent.empty() ? fs::path(".") : parent, O_RDONLY | O_DIRECTORY);
  if (!old.empty()) fs::remove_all(old, ec);
}

// Named places without people: the plateau, the southern hills, the floodplain meadows and
// the foothills, each at a point in the middle of its ground.
void add_localities(const Scenario& s, DemoFeatures& f, NameMaker& names) {
  double xm = kAreaWest + 0.5 * kAreaWidthM;
  double x1 = kAreaWest + 0.3 * kAreaWidthM;
  double x2 = kAreaWest + 0.7 * kAreaWidthM;
  const Point at[4] = {
      {xm, 0.5 * (s.escarpment_y(xm) + kAreaSouth + kAreaHeightM)},
      {x1, kAreaSouth + 1200},
      {kAreaWest + 0.08 * kAreaWidthM, s.valley_axis_y(kAreaWest + 0.08 * kAreaWidthM)},
      {x2, 0.5 * (s.escarpment_y(x2) + s.valley_axis_y(x2)) + 400}};
  for (const Point& p : at) f.places.push_back({p, names.locality(), "locality", 0});
}

}  // namespace

DemoAreaSummary generate_demo_area(const fs::path& outdir_arg, const DemoAreaOptions& options) {
  fs::path outdir = outdir_arg;
  if (!outdir.has_filename()) outdir = outdir.parent_path();
  Scenario scenario = make_scenario(options.seed, options.size_scale);  // validates options
  check_replaceable(outdir);
  fs::path part = with_suffix(outdir, ".part");
  std::error_code ec;
  fs::remove_all(part, ec);  // a previous interrupted run
  fs::create_directories(part, ec);
  if (ec) throw_input_error(part.string(), "cannot create the folder: " + ec.message());

  log::info("demo-area: {} x {} cells at {} m, seed {}", scenario.dem.width, scenario.dem.height,
            scenario.dem.cell_m, options.seed);
  FloatGrid dem = synthesize_terrain(scenario);
  NameMaker names(options.seed);
  DemoFeatures features;
  Hydrography water = carve_hydrography(scenario, dem, names);
  // Pits the noise left off the drainage lines are filled (they become marsh); the deliberate
  // hollows come after, so they stay.
  std::vector<float> before_fill = dem.values;
  fill_depressions(dem, {});
  std::vector<char> wet(dem.values.size());
  for (std::size_t i = 0; i < wet.size(); ++i) wet[i] = dem.values[i] - before_fill[i] > 0.3f;
  std::vector<float>().swap(before_fill);
  std::vector<Polyline> water_lines;
  for (const WaterLine& w : water.lines) water_lines.push_back(w.line);
  dig_sinkholes(scenario, dem, water_lines, 3);
  std::vector<char> lake = lake_mask(scenario, dem.spec);
  int lowered = enforce_downhill(dem, water_lines,
                                 [&](int col, int row) { return lake[dem.index(col, row)] != 0; });
  log::debug("demo-area: {} cells lowered so that every water line runs downhill", lowered);

  features.summits = find_summits(dem, 14, 600, names);
  Settlements settled = lay_out_settlements(scenario, dem, water, features.summits, names);
  std::vector<Polyline> keep_clear = water_lines;
  for (const Road& r : settled.roads) keep_clear.push_back(r.line);
  for (const Track& t : settled.tracks) keep_clear.push_back(t.line);
  for (const Railway& r : settled.railways) keep_clear.push_back(r.line);
  std::vector<WaterArea> ponds = dig_ponds(scenario, dem, settled.places, keep_clear, 3);
  features.buildings = place_buildings(scenario, dem, water, settled);
  features.landcover = classify_landcover(scenario, dem, wet, settled.places);
  features.power_lines = string_power_lines(scenario, settled.places);
  features.control_points =
      make_control_points(dem, settled.roads, features.summits, 1500, options.seed);
  features.places = std::move(settled.places);
  features.roads = std::move(settled.roads);
  features.tracks = std::move(settled.tracks);
  features.railways = std::move(settled.railways);
  features.water_lines = std::move(water.lines);
  features.water_areas = std::move(water.areas);
  features.water_areas.insert(features.water_areas.end(), ponds.begin(), ponds.end());
  add_localities(scenario, features, names);

  DemoAreaSummary summary;
  summary.width = dem.spec.width;
  summary.height = dem.spec.height;
  summary.cell_m = dem.spec.cell_m;
  summary.water_line_count = static_cast<int>(features.water_lines.size());
  summary.road_count = static_cast<int>(features.roads.size());
  summary.building_count = static_cast<int>(features.buildings.size());
  auto [lo, hi] = std::minmax_element(dem.values.begin(), dem.values.end());
  summary.min_elevation_m = *lo;
  summary.max_elevation_m = *hi;

  write_dem_geotiff(part / "dem.tif", dem);
  write_features_gpkg(part / "features.gpkg", features);
  write_tiles_gpkg(part / "tiles.gpkg", make_sheet_tiles(features, names));
  {
    std::ofstream done(part / ".complete");
    done << "sheetmill demo area\nseed " << options.seed << "\nsize_scale " << options.size_scale
         << "\n";
    if (!done) throw_input_error((part / ".complete").string(), "cannot write");
  }
  fsync_path(part / ".complete", O_RDONLY);
  publish(part, outdir);
  return summary;
}

}  // namespace sheetmill::demo
