// Contour generation against analytic surfaces: a cone and a paraboloid have circular contours
// whose radius follows from the formula.
#include "sheetmill/contours/generate.hpp"

#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <set>

#include "contours/synthetic_dem.hpp"
#include "sheetmill/contours/prepare.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/units.hpp"

using namespace sheetmill;
using namespace sheetmill::contours;

namespace {

// Largest deviation of the line's distance from centre c from radius r.
double radius_error(const ContourLine& l, Point c, double r) {
  double worst = 0;
  for (const auto& p : l.ground) worst = std::max(worst, std::abs(distance(p, c) - r));
  return worst;
}

double signed_area(const Polyline& ring) {
  double a = 0;
  for (std::size_t i = 0; i < ring.size(); ++i) a += cross(ring[i], ring[(i + 1) % ring.size()]);
  return a / 2;
}

}  // namespace

TEST_CASE("cone: circles of radius (H - z) / k, right levels, every fifth an index", "[contours]") {
  // z = 500 - 0.5 r over a 400 x 400 grid of 10 m cells centred on (2000, 2000): the contour at
  // level z is the circle r = (500 - z) / 0.5 (analytic). The DEM samples the cone exactly at
  // cell centres; linear interpolation between centres errs by less than a cell near the apex
  // only, so half a cell is the tolerance (brief).
  const double cell = 10, H = 500, k = 0.5;
  const Point c{2000, 2000};
  auto dem = synthetic::make_dem(400, 400, cell, 0, 4000, [&](double x, double y) {
    return H - k * distance({x, y}, c);
  });
  ContourParams p;
  p.interval_m = 20;
  p.base_m = 0;
  p.index_every = 5;
  p.scale_denominator = 25000;
  for (bool prepared : {false, true}) {
    auto lines = prepared ? generate(dem, p) : generate_raw(dem, p);
    std::set<long> levels;
    for (const auto& l : lines) {
      if (!l.closed) continue;  // the corners of the grid cut the widest rings
      double r = (H - l.elevation_m) / k;
      if (r < 3 * cell) continue;  // the apex cell is a plateau in the sampled grid
      INFO("level " << l.elevation_m << " prepared " << prepared);
      CHECK(radius_error(l, c, r) <= cell / 2);
      CHECK(l.index == (level_number(l.elevation_m, p) % 5 == 0));
      // Higher ground (the centre) on the left: counter-clockwise, and not a depression.
      CHECK(signed_area(l.ground) > 0);
      CHECK_FALSE(l.depression);
      levels.insert(std::lround(l.elevation_m));
    }
    // Full circles fit while r <= 2000 - cell/2: levels 20 ... 480 (r from 40 to 960 m).
    for (long z = 20; z <= 480; z += 20) CHECK(levels.count(z) == 1);
  }
}

TEST_CASE("paraboloid pit: depression contours of radius sqrt(z / a)", "[contours]") {
  // z = a r^2 with a = 0.001: a bowl, so every closed contour surrounds lower ground and is a
  // depression, oriented clockwise (higher ground, outside, on the left). Radius sqrt(z / a).
  const double cell = 10, a = 0.001;
  const Point c{1500, 1500};
  auto dem = synthetic::make_dem(300, 300, cell, 0, 3000, [&](double x, double y) {
    double r = distance({x, y}, c);
    return a * r * r;
  });
  ContourParams p;
  p.interval_m = 50;
  p.index_every = 4;
  auto lines = generate(dem, p);
  int rings = 0;
  for (const auto& l : lines) {
    if (!l.closed) continue;
    double r = std::sqrt(l.elevation_m / a);
    if (r < 3 * cell) continue;
    INFO("level " << l.elevation_m);
    CHECK(radius_error(l, c, r) <= cell / 2);
    CHECK(l.depression);
    CHECK(signed_area(l.ground) < 0);
    CHECK(l.index == (std::lround(l.elevation_m / 50) % 4 == 0));
    ++rings;
  }
  // The outermost cell centres are 1495 m from the centre. Levels 50 ... 2200 have
  // r = 224 ... 1483 m, inside; 2250 would need r = 1500 m: 44 full rings (analytic).
  CHECK(rings == 44);
}

TEST_CASE("bad input gives one-line input errors", "[contours]") {
  auto dem = synthetic::make_dem(20, 20, 10, 0, 200, [](double x, double) { return x; });
  ContourParams p;
  p.interval_m = 0;
  try {
    generate(dem, p);
    FAIL("no error for interval 0");
  } catch (const Error& e) {
    CHECK(e.kind() == Error::Kind::input);
    CHECK(std::string(e.what()).find("contours.interval") != std::string::npos);
    CHECK(std::string(e.what()).find('\n') == std::string::npos);
  }
  p.interval_m = -5;
  CHECK_THROWS_AS(generate(dem, p), Error);
  p.interval_m = 10;
  auto flat = synthetic::make_dem(20, 20, 10, 0, 200, [](double, double) { return 42.0; });
  try {
    generate(flat, p);
    FAIL("no error for a flat DEM");
  } catch (const Error& e) {
    CHECK(e.kind() == Error::Kind::input);
    CHECK_THAT(e.what(), Catch::Contains("no relief"));
  }
}

TEST_CASE("proposed interval follows the scale and the relief", "[contours]") {
  // Common practice: about 5-10 m at 1:25 000 and 10-20 m at 1:50 000.
  CHECK(propose_interval_m(25000, 100) == 5);
  CHECK(propose_interval_m(25000, 2000) == 10);
  CHECK(propose_interval_m(50000, 100) == 10);
  CHECK(propose_interval_m(50000, 3000) == 20);
  double mid = propose_interval_m(25000, 300);  // 300 / 40 = 7.5 -> nearest of 5, 10 by ratio
  CHECK((mid == 5 || mid == 10));
}

TEST_CASE("proposed interval in feet is one of the usual foot intervals", "[contours]") {
  // Common practice on sheets in feet: 1, 2, 5, 10, 20, 25, 40, 50, 100 ft and on up (200, 250,
  // 500, 1000); never the metric rule's 2.5 ft.
  const std::vector<double> usual = {1, 2, 5, 10, 20, 25, 40, 50, 80, 100, 200, 250, 500, 1000};
  for (double unit : {kMetresPerFoot, kMetresPerUsSurveyFoot}) {
    for (double scale : {1200.0, 2400.0, 4800.0, 12000.0, 24000.0, 62500.0, 100000.0, 250000.0}) {
      for (double relief_ft : {20.0, 100.0, 400.0, 1000.0, 3000.0, 10000.0}) {
        double ft = propose_interval_m(scale, relief_ft * unit, unit) / unit;
        INFO("1:" << scale << ", " << relief_ft << " ft of relief: " << ft << " ft");
        CHECK(std::find_if(usual.begin(), usual.end(),
                           [&](double v) { return std::abs(v - ft) < 1e-9; }) != usual.end());
      }
    }
  }
  // Worked cases of the rule (relief / 40 within [N/5000, N/2500] m, nearest in ratio):
  // 1:24 000 and 1000 ft: 25 ft exactly; 1:50 000 and 500 m: 12.5 m = 41 ft -> 40 ft (the metric
  // steps would give 50); 1:12 000 and 100 ft: 2.4 m = 7.9 ft -> 10 ft.
  CHECK(propose_interval_m(24000, 1000 * kMetresPerFoot, kMetresPerFoot) / kMetresPerFoot ==
        Approx(25));
  CHECK(propose_interval_m(50000, 500, kMetresPerFoot) / kMetresPerFoot == Approx(40));
  CHECK(propose_interval_m(12000, 100 * kMetresPerFoot, kMetresPerFoot) / kMetresPerFoot ==
        Approx(10));
}

// Supplementary (half-interval) contours appear only where the ground is gentle. The surface
// rises 1 m per 50 m west of x = 2000 (slope 1.15 deg) and 1 m per 5 m east of it (11.3 deg),
// with a slight northward tilt so the lines are not grid-aligned; the style's limit is 3 deg.
TEST_CASE("half-interval contours only in gentle ground, at half-interval levels", "[contours]") {
  auto z = [](double x, double y) {
    double east = x < 2000 ? 0.02 * x : 40 + 0.2 * (x - 2000);
    return 100 + east + 0.001 * y;
  };
  auto dem = synthetic::make_dem(400, 300, 10, 0, 3000, z);
  ContourParams p;
  p.interval_m = 10;
  p.supplementary = true;
  p.supplementary_max_slope_deg = 3;
  auto lines = generate(dem, p);
  int supplementary = 0, regular_east = 0;
  for (const auto& l : lines) {
    double level = (l.elevation_m - p.base_m) / p.interval_m;
    if (!l.supplementary) {
      CHECK(level == Approx(std::round(level)).margin(1e-9));
      for (Point q : l.ground) regular_east += q.x > 2100;
      continue;
    }
    ++supplementary;
    INFO("supplementary line at " << l.elevation_m);
    // At a half level (k + 0.5) x interval, never an index line, and only in the gentle west
    // (the analytic slope there is 0.02; the smoothed line may lean a cell into the bend).
    CHECK(level - std::floor(level) == Approx(0.5).margin(1e-9));
    CHECK_FALSE(l.index);
    for (Point q : l.ground) CHECK(q.x < 2000 + 20);
  }
  // West of the bend: 40 m of rise = 4 half levels (105 ... 135); east: none, although there
  // are regular lines there.
  CHECK(supplementary >= 4);
  CHECK(regular_east > 0);
  // Without the option: none at all.
  p.supplementary = false;
  for (const auto& l : generate(dem, p)) CHECK_FALSE(l.supplementary);
}
