#include "sheetmill/demo/relief_points.hpp"

#include <fmt/format.h>

#include <algorithm>
#include <cmath>

#include "sheetmill/demo/random.hpp"
#include "sheetmill/demo/shapes.hpp"

namespace sheetmill::demo {

Point snap_to_cell_centre(const GridSpec& spec, Point p) {
  return spec.centre(spec.col_clamped(p.x), spec.row_clamped(p.y));
}

std::vector<Summit> find_summits(const FloatGrid& dem, int count, double radius_m,
                                 NameMaker& names) {
  // The highest cell of each block of ~radius/2, then keep those highest within radius_m.
  const GridSpec& g = dem.spec;
  int block = std::max(1, static_cast<int>(radius_m / 2 / g.cell_m));
  struct Peak {
    float z;
    int col, row;
  };
  std::vector<Peak> peaks;
  for (int br = 0; br < g.height; br += block) {
    for (int bc = 0; bc < g.width; bc += block) {
      Peak best{-1e30f, 0, 0};
      for (int r = br; r < std::min(br + block, g.height); ++r) {
        for (int c = bc; c < std::min(bc + block, g.width); ++c) {
          if (dem.at(c, r) > best.z) best = {dem.at(c, r), c, r};
        }
      }
      // Not on the area's edge, where the true top may lie outside.
      if (best.col > 2 && best.row > 2 && best.col < g.width - 3 && best.row < g.height - 3) {
        peaks.push_back(best);
      }
    }
  }
  std::sort(peaks.begin(), peaks.end(), [](const Peak& a, const Peak& b) {
    return a.z > b.z || (a.z == b.z && (a.row < b.row || (a.row == b.row && a.col < b.col)));
  });
  std::vector<Summit> out;
  for (const Peak& p : peaks) {
    Point at = g.centre(p.col, p.row);
    // A summit must top every block that comes within radius_m of it.
    bool top = true;
    for (const Peak& q : peaks) {
      if (q.z <= p.z) break;  // sorted: the rest are lower
      double d = std::hypot((q.col - p.col) * g.cell_m, (q.row - p.row) * g.cell_m);
      if (d < radius_m) {
        top = false;
        break;
      }
    }
    bool near = false;
    for (const Summit& s : out) near = near || distance(s.at, at) < radius_m;
    if (!top || near) continue;
    out.push_back({at, names.summit(), static_cast<double>(p.z)});
    if (static_cast<int>(out.size()) >= count) break;
  }
  return out;
}

std::vector<ControlPoint> make_control_points(const FloatGrid& dem, const std::vector<Road>& roads,
                                              const std::vector<Summit>& summits, double spacing_m,
                                              std::uint64_t seed) {
  std::vector<ControlPoint> out;
  auto residual = [&](int k) {
    // A multiple of 0.01 m in [-0.04, 0.04].
    return (static_cast<int>(hash01(seed, 9001, k) * 9) - 4) / 100.0;
  };
  auto height_at = [&](Point p, int k) {
    double z = dem.at(dem.spec.col_clamped(p.x), dem.spec.row_clamped(p.y));
    return std::round(z * 100) / 100 + residual(k);
  };
  int number = 101;
  for (const Road& road : roads) {
    if (road.road_class == "minor") continue;
    double since = spacing_m / 2;
    for (std::size_t i = 1; i < road.line.size(); ++i) {
      since += distance(road.line[i - 1], road.line[i]);
      if (since < spacing_m) continue;
      since = 0;
      // Beside the road, on its cell centre.
      Point p = snap_to_cell_centre(dem.spec, road.line[i]);
      out.push_back({p, fmt::format("BM {}", number), "benchmark", height_at(p, number)});
      ++number;
    }
  }
  int trig = 1;
  for (const Summit& s : summits) {
    if (trig > 6) break;
    out.push_back({s.at, fmt::format("TP {}", trig), "trig", height_at(s.at, 5000 + trig)});
    ++trig;
  }
  return out;
}

}  // namespace sheetmill::demo
