// Heights below the sea level: an analytic island in a sea with a hollow in the sea floor. The
// sea floor lies 42.5 m below the sea level (between two 5 m levels), the island rises to 25 m
// above it; its coastline is the circle where 67.5 exp(-r^2 / s^2) = 42.5 (analytic).
#include <catch2/catch.hpp>
#include <cmath>

#include "contours/synthetic_dem.hpp"
#include "sheetmill/contours/contour_labels.hpp"
#include "sheetmill/contours/generate.hpp"

using namespace sheetmill;
using namespace sheetmill::contours;

namespace {

const Point kIsland{1000, 1000}, kHollow{1600, 400};
const double kS = 300, kHollowS = 80;

double island(double x, double y) {
  double r2 = (x - kIsland.x) * (x - kIsland.x) + (y - kIsland.y) * (y - kIsland.y);
  double h2 = (x - kHollow.x) * (x - kHollow.x) + (y - kHollow.y) * (y - kHollow.y);
  // The hollow is 12 m deep: closed lines at -45 and -50 m around it.
  return -42.5 + 67.5 * std::exp(-r2 / (kS * kS)) - 12 * std::exp(-h2 / (kHollowS * kHollowS));
}

ContourParams params() {
  ContourParams p;
  p.interval_m = 5;
  p.index_every = 2;
  p.base_m = 0;
  p.sea_level_m = 0;
  return p;
}

}  // namespace

TEST_CASE("below the sea level: depth contours, a coastline, no ticks", "[contours][depths]") {
  auto dem = synthetic::make_dem(200, 200, 10, 0, 2000, island);
  auto lines = generate_raw(dem, params());
  const double coast_r = kS * std::sqrt(std::log(67.5 / 42.5));  // analytic
  int coastlines = 0, depth_lines = 0, hollow_loops = 0;
  for (const auto& l : lines) {
    INFO("line at " << l.elevation_m);
    CHECK(l.depth == (l.elevation_m < 0));
    CHECK(l.coastline == (l.elevation_m == 0));
    if (l.depth) {
      ++depth_lines;
      CHECK(l.depth_m == Approx(-l.elevation_m));
      CHECK_FALSE(l.depression);  // never ticks below the sea level
      if (l.closed && distance(l.ground[0], kHollow) < 3 * kHollowS) ++hollow_loops;
    }
    if (l.coastline) {
      ++coastlines;
      REQUIRE(l.closed);
      for (const auto& p : l.ground) CHECK(std::abs(distance(p, kIsland) - coast_r) <= 5);
    }
  }
  CHECK(coastlines == 1);
  CHECK(depth_lines >= 7);   // -5 ... -35 around the island
  CHECK(hollow_loops == 2);  // -45 and -50 around the hollow
  // Without a sea, the same hollow's loops are depressions: the flag is the sea's doing.
  ContourParams dry = params();
  dry.sea_level_m.reset();
  int ticked = 0;
  for (const auto& l : generate_raw(dem, dry)) ticked += l.depression;
  CHECK(ticked == 2);
}

TEST_CASE("depth figures read as depths or as negative heights", "[contours][depths]") {
  auto dem = synthetic::make_dem(200, 200, 10, 0, 2000, island);
  style::ContourStyle style;
  style.label.text_template = "{elevation_m}";
  bool seen = false;
  for (const auto& l : generate_raw(dem, params())) {
    if (!l.depth || l.elevation_m != -20) continue;
    seen = true;
    CHECK(l.index);  // every second level from 0: -20 is an index line with figures
    style.depths.figures_as_depth = true;
    CHECK(contour_label_text(l, style) == "20");
    style.depths.figures_as_depth = false;
    CHECK(contour_label_text(l, style) == "-20");
  }
  CHECK(seen);
}
