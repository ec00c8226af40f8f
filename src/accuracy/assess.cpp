#include "sheetmill/accuracy/assess.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <map>
#include <set>

#include "sheetmill/accuracy/dem_sampler.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"

namespace sheetmill::accuracy {

const char* status_name(PointStatus status) {
  switch (status) {
    case PointStatus::used:
      return "used";
    case PointStatus::outside:
      return "outside the DEM";
    case PointStatus::nodata:
      return "on nodata";
    case PointStatus::duplicate:
      return "duplicate";
    case PointStatus::no_height:
      return "no height";
  }
  return "?";
}

namespace {

std::string today_utc() {
  auto now = std::chrono::system_clock::now();
  std::chrono::year_month_day ymd{std::chrono::floor<std::chrono::days>(now)};
  return fmt::format("{:04d}-{:02d}-{:02d}", static_cast<int>(ymd.year()),
                     static_cast<unsigned>(ymd.month()), static_cast<unsigned>(ymd.day()));
}

// Two points on the same spot (within a millimetre) or with the same ID are one check point
// measured twice; counting both would weigh it double. The first one read is kept.
struct DuplicateFilter {
  std::set<std::string> ids;
  std::set<std::pair<long long, long long>> spots;
  bool seen(const CheckPoint& p) {
    auto spot = std::pair{std::llround(p.xy.x * 1000), std::llround(p.xy.y * 1000)};
    bool dup = !ids.insert(p.id).second;
    dup = !spots.insert(spot).second || dup;
    return dup;
  }
};

void summarise(Assessment& a, const AssessOptions& options) {
  std::vector<double> all, veg, bare;
  std::vector<std::size_t> used_index;
  for (std::size_t i = 0; i < a.residuals.size(); ++i) {
    Residual& r = a.residuals[i];
    if (r.status != PointStatus::used) continue;
    all.push_back(r.error_m);
    used_index.push_back(i);
    if (a.has_cover) {
      r.vegetated = std::find(options.vegetated_classes.begin(), options.vegetated_classes.end(),
                              r.cover) != options.vegetated_classes.end();
      (r.vegetated ? veg : bare).push_back(r.error_m);
    }
  }
  a.all = vertical_stats(all);
  if (a.has_cover) {
    a.vegetated = vertical_stats(veg);
    a.non_vegetated = vertical_stats(bare);
  }
  for (std::size_t k : outliers_beyond_3sd(all, a.all)) {
    Residual& r = a.residuals[used_index[k]];
    r.outlier = true;
    a.outlier_ids.push_back(r.id);
  }
}

}  // namespace

Assessment assess_vertical(const std::string& dem_path, const CheckPointSource& points,
                           const AssessOptions& options) {
  DemSampler dem(dem_path, options.dem);
  Assessment a;
  a.dem_path = dem_path;
  a.date = options.date.empty() ? today_utc() : options.date;
  a.points_path = points.path;
  a.dem_grid = dem.source().grid();
  a.dem_unit_m = terrain::vertical_unit_m(dem_path, options.dem);
  a.has_cover = !points.cover_field.empty();
  CheckPointSet set = read_check_points(points, &dem.source().crs());
  a.points_layer = set.layer_name;
  a.height_field = set.height_field;

  // Sampled north to south, so points on the same rows share one read of them.
  std::vector<std::size_t> order(set.points.size());
  for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
  std::stable_sort(order.begin(), order.end(), [&](std::size_t i, std::size_t j) {
    return set.points[i].xy.y > set.points[j].xy.y;
  });
  std::vector<std::optional<double>> sampled(set.points.size());
  for (std::size_t i : order) sampled[i] = dem.at(set.points[i].xy);

  DuplicateFilter dups;
  for (std::size_t i = 0; i < set.points.size(); ++i) {
    const CheckPoint& p = set.points[i];
    Residual r;
    r.id = p.id;
    r.xy = p.xy;
    r.cover = p.cover;
    r.z_dem_m = std::nan("");
    if (!p.z_m) {
      r.status = PointStatus::no_height;
      ++a.no_height;
      a.residuals.push_back(r);
      continue;
    }
    r.z_check_m = *p.z_m;
    const std::optional<double>& z = sampled[i];
    if (!z) {
      r.status = PointStatus::outside;
      ++a.outside;
    } else if (std::isnan(*z)) {
      r.status = PointStatus::nodata;
      ++a.nodata;
    } else if (dups.seen(p)) {
      r.status = PointStatus::duplicate;
      ++a.duplicate;
    } else {
      r.z_dem_m = *z;
      r.error_m = *z - *p.z_m;
      ++a.used;
    }
    a.residuals.push_back(r);
  }
  if (a.used == 0) {
    Box b = a.dem_grid.bounds();
    throw_input_error(
        points.path,
        fmt::format("none of the {} check points can be tested: {} outside the DEM {} "
                    "(extent {:.0f} {:.0f} to {:.0f} {:.0f} in its CRS), {} on nodata, {} without "
                    "a height; are the points and the DEM of the same area and CRS?",
                    set.points.size(), a.outside, dem_path, b.min_x, b.min_y, b.max_x, b.max_y,
                    a.nodata, a.no_height));
  }
  summarise(a, options);
  if (a.used < kNssdaMinimumPoints) {
    log::warn("{}: {} check points used; NSSDA asks for at least {}", points.path, a.used,
              kNssdaMinimumPoints);
  }
  return a;
}

HorizontalAssessment assess_horizontal(const std::string& dem_path,
                                       const CheckPointSource& surveyed,
                                       const CheckPointSource& mapped,
                                       const AssessOptions& options) {
  terrain::DemSource dem(dem_path, options.dem);
  OGRSpatialReference target = dem.crs();
  if (!target.IsProjected()) {
    throw_input_error(dem_path,
                      "horizontal accuracy needs a projected CRS (metres on the ground); "
                      "the DEM's CRS is geographic");
  }
  CheckPointSource s = surveyed, m = mapped;
  s.heights_required = false;
  m.heights_required = false;
  CheckPointSet truth = read_check_points(s, &target);
  CheckPointSet map = read_check_points(m, &target);
  double unit_m = target.GetLinearUnits();
  std::map<std::string, Point> by_id;
  for (const auto& p : map.points) by_id.emplace(p.id, p.xy);

  HorizontalAssessment h;
  h.crs_name = target.GetName() ? target.GetName() : "the DEM's CRS";
  std::set<std::string> done;
  std::vector<double> dx, dy;
  for (const auto& p : truth.points) {
    if (!done.insert(p.id).second) continue;
    auto it = by_id.find(p.id);
    if (it == by_id.end()) {
      ++h.unmatched;
      continue;
    }
    PositionPair pair{p.id, p.xy, it->second, (it->second.x - p.xy.x) * unit_m,
                      (it->second.y - p.xy.y) * unit_m};
    dx.push_back(pair.dx_m);
    dy.push_back(pair.dy_m);
    h.pairs.push_back(pair);
  }
  if (h.pairs.empty()) {
    throw_input_error(mapped.path, fmt::format("no map position shares an ID with the {} check "
                                               "points of {}; are the ID fields the same?",
                                               truth.points.size(), surveyed.path));
  }
  h.stats = horizontal_stats(dx, dy);
  return h;
}

}  // namespace sheetmill::accuracy
