#include "sheetmill/contours/generate.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <string>
#include <thread>

#include "contours/dem_sampling.hpp"
#include "contours/depression.hpp"
#include "contours/orient.hpp"
#include "sheetmill/contours/gdal_contours.hpp"
#include "sheetmill/contours/prepare.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::contours {

namespace {

// More levels than this across one sheet is a mistake (an interval in the wrong unit).
constexpr double kMaxLevels = 5000;

// Splits a half-interval line into the stretches where the slope stays gentle.
void append_gentle_pieces(const ContourLine& line, const detail::DemSampler& dem,
                          const ContourParams& params, std::vector<ContourLine>& out) {
  double max_tan = std::tan(params.supplementary_max_slope_deg * kDegToRad);
  double min_len = params.supplementary_min_mm * params.scale_denominator / 1000.0;
  const Polyline& p = line.ground;
  std::vector<char> gentle(p.size());
  bool all = true;
  for (std::size_t i = 0; i < p.size(); ++i) {
    auto g = dem.gradient(p[i]);
    gentle[i] = g && length(*g) <= max_tan;
    all = all && gentle[i];
  }
  if (all) {
    out.push_back(line);
    return;
  }
  // For a closed line start at a steep vertex so that no gentle run is split at the seam.
  std::size_t n = p.size(), start = 0;
  if (line.closed) start = std::find(gentle.begin(), gentle.end(), 0) - gentle.begin();
  std::size_t count = line.closed ? n + 1 : n;
  ContourLine piece = line;
  piece.closed = false;
  piece.ground.clear();
  auto flush = [&] {
    ContourLine candidate = piece;
    if (candidate.ground.size() >= 2 && dem.ground_length(candidate.ground, false) >= min_len)
      out.push_back(candidate);
    piece.ground.clear();
  };
  for (std::size_t k = 0; k < count; ++k) {
    std::size_t i = (start + k) % n;
    if (gentle[i]) {
      piece.ground.push_back(p[i]);
    } else {
      flush();
    }
  }
  flush();
}

}  // namespace

void validate(const ContourParams& params) {
  if (!(params.interval_m > 0) || !std::isfinite(params.interval_m)) {
    throw_input_error(SourceLocation{"", 0, 0, "contours.interval"},
                      "contour interval must be a number greater than 0, got " +
                          std::to_string(params.interval_m));
  }
  if (params.index_every < 1) {
    throw_input_error(SourceLocation{"", 0, 0, "contours.index_every"},
                      "index contour spacing must be a whole number >= 1");
  }
  if (!(params.scale_denominator > 0)) {
    throw_input_error(SourceLocation{"", 0, 0, "scale"}, "scale denominator must be > 0");
  }
  if (!std::isfinite(params.base_m)) {
    throw_input_error(SourceLocation{"", 0, 0, "contours.base"}, "contour base must be a number");
  }
}

void mark_depth(ContourLine& line, const ContourParams& params) {
  line.depth = line.coastline = false;
  line.depth_m = 0;
  if (!params.sea_level_m) return;
  const double below = *params.sea_level_m - line.elevation_m;
  // Levels are whole multiples of the interval: a millionth of it is "at" the sea level.
  if (std::abs(below) <= 1e-6 * params.interval_m) {
    line.coastline = true;
    line.depression = false;
  } else if (below > 0) {
    line.depth = true;
    line.depth_m = below;
    line.depression = false;
  }
}

long level_number(double elevation_m, const ContourParams& params) {
  return std::lround((elevation_m - params.base_m) / params.interval_m);
}

std::pair<double, double> elevation_range(const terrain::Dem& dem) {
  double lo = std::numeric_limits<double>::infinity(), hi = -lo;
  long n = static_cast<long>(dem.width()) * dem.height();
  for (long i = 0; i < n; ++i) {
    float v = dem.z[static_cast<std::size_t>(i)];
    if (std::isnan(v)) continue;
    lo = std::min(lo, static_cast<double>(v));
    hi = std::max(hi, static_cast<double>(v));
  }
  if (lo > hi) return {std::nan(""), std::nan("")};
  return {lo, hi};
}

namespace {

// Contour intervals in use on sheets in feet (common practice): 1, 2, 5, 10, 20, 25, 40, 50,
// 100 ft and their larger companions; not the metric 2.5 x 10^k steps.
constexpr double kFootIntervals[] = {1, 2, 5, 10, 20, 25, 40, 50, 80, 100, 200, 250, 500, 1000};

bool is_foot(double unit_m) {
  return std::abs(unit_m - kMetresPerFoot) < 1e-6 ||
         std::abs(unit_m - kMetresPerUsSurveyFoot) < 1e-6;
}

}  // namespace

double propose_interval_m(double scale_denominator, double relief_m, double unit_m) {
  double lo = scale_denominator / 5000, hi = scale_denominator / 2500;
  // A round number in the unit heights are shown in (a 20 ft interval, not 6.096 m).
  double ideal = std::clamp(relief_m / 40, lo, hi) / unit_m;
  // The nearest usual interval in ratio, not difference.
  double best = 1, best_err = std::numeric_limits<double>::infinity();
  auto consider = [&](double v) {
    double err = std::abs(std::log(v / ideal));
    if (err < best_err) best = v, best_err = err;
  };
  if (is_foot(unit_m)) {
    for (double v : kFootIntervals) consider(v);
    return best * unit_m;
  }
  // Metres (or another unit): 1, 2, 2.5, 5 x 10^k.
  int k0 = static_cast<int>(std::floor(std::log10(ideal)));
  for (int k = k0 - 1; k <= k0 + 1; ++k) {
    for (double m : {1.0, 2.0, 2.5, 5.0}) consider(m * std::pow(10.0, k));
  }
  return best * unit_m;
}

std::vector<ContourLine> generate_raw(const terrain::Dem& dem, const ContourParams& params) {
  validate(params);
  const std::string src;
  if (dem.z.size() != static_cast<std::size_t>(dem.width()) * dem.height() || dem.width() < 2 ||
      dem.height() < 2) {
    throw_input_error(src, "the DEM needs at least 2 x 2 cells to be contoured");
  }
  auto [lo, hi] = elevation_range(dem);
  if (std::isnan(lo)) throw_input_error(src, "the DEM has no data cells: nothing to contour");
  if (!(hi > lo)) {
    throw_input_error(src, "the DEM has no relief (every cell is " + std::to_string(lo) +
                               "): nothing to contour");
  }
  double step = params.supplementary ? params.interval_m / 2 : params.interval_m;
  if ((hi - lo) / step > kMaxLevels) {
    throw_input_error(SourceLocation{src, 0, 0, "contours.interval"},
                      "an interval of " + std::to_string(params.interval_m) + " gives more than " +
                          std::to_string(static_cast<long>(kMaxLevels)) + " levels across " +
                          std::to_string(hi - lo) + " of relief; choose a larger interval");
  }

  detail::DemSampler sampler(dem);
  std::vector<detail::RawContour> raw = detail::gdal_contours(dem, step, params.base_m);
  // Orientation samples the DEM along every raw vertex: done for all lines on both cores first.
  std::vector<ContourLine> all(raw.size());
  auto orient = [&](std::size_t begin, std::size_t end) {
    for (std::size_t i = begin; i < end; ++i) {
      ContourLine& line = all[i];
      line.elevation_m = raw[i].elevation_m;
      line.ground = std::move(raw[i].points);
      const std::size_t n = line.ground.size();
      if (n >= 4 && line.ground.front().x == line.ground.back().x &&
          line.ground.front().y == line.ground.back().y) {
        line.closed = true;
        line.ground.pop_back();
      }
      if (line.ground.size() < 2) continue;
      detail::orient_uphill_left(line, sampler);
      detail::classify_loop(line, dem, sampler);
      mark_depth(line, params);
    }
  };
  {
    // Split by vertex count, not line count: a few long lines hold most of the work.
    std::size_t total = 0, half = 0, cut = 0;
    for (const auto& r : raw) total += r.points.size();
    while (cut < raw.size() && 2 * half < total) half += raw[cut++].points.size();
    std::thread other(orient, cut, raw.size());
    orient(0, cut);
    other.join();
  }
  std::vector<ContourLine> lines;
  lines.reserve(all.size());
  std::vector<ContourLine> supplementary;
  for (auto& line : all) {
    if (line.ground.size() < 2) continue;
    long k = std::lround((line.elevation_m - params.base_m) / step);
    if (params.supplementary && (k % 2 != 0)) {
      line.supplementary = true;
      append_gentle_pieces(line, sampler, params, supplementary);
      continue;
    }
    long level = params.supplementary ? k / 2 : k;
    line.index = level % params.index_every == 0;
    lines.push_back(std::move(line));
  }
  for (auto& s : supplementary) lines.push_back(std::move(s));
  return lines;
}

std::vector<ContourLine> generate(const terrain::Dem& dem, const ContourParams& params) {
  auto lines = generate_raw(dem, params);
  detail::DemSampler sampler(dem);
  prepare_for_print(lines, params, sampler.cell_m());
  return lines;
}

}  // namespace sheetmill::contours
