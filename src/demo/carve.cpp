#include "sheetmill/demo/carve.hpp"

#include <algorithm>
#include <cmath>

#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

namespace {

double trough_rise(double d, const ChannelProfile& p) {
  double beyond = d - p.floor_half_width_m;
  if (beyond <= 0) return 0;
  if (beyond <= p.bank_width_m) return p.bank_height_m * beyond / p.bank_width_m;
  return p.bank_height_m + (beyond - p.bank_width_m) * p.side_slope;
}

}  // namespace

void carve_channel(FloatGrid& dem, const Polyline& line, const std::vector<double>& bed_m,
                   const ChannelProfile& profile) {
  const GridSpec& g = dem.spec;
  for (std::size_t i = 1; i < line.size(); ++i) {
    Point a = line[i - 1];
    Point b = line[i];
    Box box = Box::of(a.x, a.y, b.x, b.y).expanded(profile.reach_m);
    int c0 = std::max(0, static_cast<int>(std::floor(g.col_of(box.min_x))));
    int c1 = std::min(g.width - 1, static_cast<int>(std::ceil(g.col_of(box.max_x))));
    int r0 = std::max(0, static_cast<int>(std::floor(g.row_of(box.max_y))));
    int r1 = std::min(g.height - 1, static_cast<int>(std::ceil(g.row_of(box.min_y))));
    for (int row = r0; row <= r1; ++row) {
      for (int col = c0; col <= c1; ++col) {
        double t = 0;
        double d = distance_to_segment(g.centre(col, row), a, b, &t);
        if (d > profile.reach_m) continue;
        double bed = bed_m[i - 1] + t * (bed_m[i] - bed_m[i - 1]);
        float z = static_cast<float>(bed + trough_rise(d, profile));
        float& cell = dem.at(col, row);
        if (z < cell) cell = z;
      }
    }
  }
}

int enforce_downhill(FloatGrid& dem, const std::vector<Polyline>& lines,
                     const std::function<bool(int, int)>& frozen) {
  const GridSpec& g = dem.spec;
  int lowered = 0;
  for (int pass = 0; pass < 50; ++pass) {
    int changed = 0;
    for (const Polyline& line : lines) {
      double prev = sample(dem, line.front());
      for (std::size_t k = 1; k < line.size(); ++k) {
        double z = sample(dem, line[k]);
        if (z > prev + 0.01) {
          // The four cells bilinear interpolation reads at this vertex.
          double fc = std::clamp(g.col_of(line[k].x), 0.0, g.width - 1.0);
          double fr = std::clamp(g.row_of(line[k].y), 0.0, g.height - 1.0);
          int c0 = std::min(static_cast<int>(fc), std::max(0, g.width - 2));
          int r0 = std::min(static_cast<int>(fr), std::max(0, g.height - 2));
          for (int r = r0; r <= std::min(r0 + 1, g.height - 1); ++r) {
            for (int c = c0; c <= std::min(c0 + 1, g.width - 1); ++c) {
              float& cell = dem.at(c, r);
              if (cell > prev && !frozen(c, r)) {
                cell = static_cast<float>(prev);
                ++changed;
              }
            }
          }
          z = sample(dem, line[k]);
        }
        prev = std::min(prev, z);
      }
    }
    lowered += changed;
    if (changed == 0) break;
  }
  return lowered;
}

}  // namespace sheetmill::demo
