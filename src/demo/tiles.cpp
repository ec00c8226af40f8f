#include "sheetmill/demo/tiles.hpp"

#include <cmath>
#include <set>

#include "sheetmill/demo/scenario.hpp"

namespace sheetmill::demo {

std::vector<SheetTile> make_sheet_tiles(const DemoFeatures& features, NameMaker& names) {
  const int cols = static_cast<int>(std::lround(kAreaWidthM / kSheetSizeM));
  const int rows = static_cast<int>(std::lround(kAreaHeightM / kSheetSizeM));
  auto id = [&](int row, int col) -> std::string {
    if (row < 1 || row > rows || col < 1 || col > cols) return "";
    return "HV-" + std::to_string(row) + "-" + std::to_string(col);
  };
  std::vector<SheetTile> out;
  std::set<std::string> used;
  for (int row = 1; row <= rows; ++row) {
    for (int col = 1; col <= cols; ++col) {
      SheetTile t;
      t.row = row;
      t.col = col;
      t.sheet_id = id(row, col);
      double x0 = kAreaWest + (col - 1) * kSheetSizeM;
      double y1 = kAreaSouth + kAreaHeightM - (row - 1) * kSheetSizeM;
      t.ground = Box::of(x0, y1 - kSheetSizeM, x0 + kSheetSizeM, y1);
      t.n = id(row - 1, col);
      t.s = id(row + 1, col);
      t.e = id(row, col + 1);
      t.w = id(row, col - 1);
      t.ne = id(row - 1, col + 1);
      t.nw = id(row - 1, col - 1);
      t.se = id(row + 1, col + 1);
      t.sw = id(row + 1, col - 1);
      // Half-open footprints, so a point on a shared edge belongs to one sheet only.
      auto inside = [&](Point p) {
        return p.x >= t.ground.min_x && p.x < t.ground.max_x && p.y >= t.ground.min_y &&
               p.y < t.ground.max_y;
      };
      const Place* best = nullptr;
      for (const Place& p : features.places) {
        if (p.kind == "locality" || !inside(p.at) || used.count(p.name)) continue;
        if (!best || p.population > best->population) best = &p;
      }
      if (best) {
        t.name = best->name;
      } else {
        const Summit* top = nullptr;
        for (const Summit& s : features.summits) {
          if (inside(s.at) && !used.count(s.name) && (!top || s.elevation_m > top->elevation_m)) {
            top = &s;
          }
        }
        t.name = top ? top->name : names.locality();
      }
      used.insert(t.name);
      out.push_back(std::move(t));
    }
  }
  return out;
}

}  // namespace sheetmill::demo
