// Preparation for print: smoothing and generalisation never make two contours cross or touch,
// cut the vertex count, and move lines by no more than the stated tolerance.
#include "sheetmill/contours/prepare.hpp"

#include <ogr_geometry.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <random>

#include "contours/synthetic_dem.hpp"
#include "sheetmill/contours/generate.hpp"

using namespace sheetmill;
using namespace sheetmill::contours;

namespace {

// Rough, noisy ground: a few long waves plus cell-scale noise, so contours bunch, wiggle and
// come close to each other. Deterministic seed.
terrain::Dem rough_dem(int w, int h, double cell) {
  std::mt19937 rng(7);
  std::normal_distribution<double> noise(0, 0.6);
  auto d = synthetic::make_dem(w, h, cell, 0, h * cell, [&](double x, double y) {
    return 200 + 60 * std::sin(x / 700) * std::cos(y / 500) + 25 * std::sin((x + 2 * y) / 230) +
           0.02 * x + noise(rng);
  });
  return d;
}

// Independent oracle: GDAL's own geometry predicate (OGR, backed by GEOS) on every pair of
// lines whose boxes meet. Returns the number of intersecting pairs.
int ogr_intersecting_pairs(const std::vector<ContourLine>& lines) {
  std::vector<OGRLineString> geoms(lines.size());
  std::vector<OGREnvelope> env(lines.size());
  for (std::size_t i = 0; i < lines.size(); ++i) {
    for (const auto& p : lines[i].ground) geoms[i].addPoint(p.x, p.y);
    if (lines[i].closed) geoms[i].addPoint(lines[i].ground[0].x, lines[i].ground[0].y);
    geoms[i].getEnvelope(&env[i]);
  }
  int n = 0;
  for (std::size_t i = 0; i < lines.size(); ++i)
    for (std::size_t j = i + 1; j < lines.size(); ++j)
      if (env[i].Intersects(env[j]) && geoms[i].Intersects(&geoms[j])) ++n;
  return n;
}

}  // namespace

TEST_CASE("prepared contours never cross or touch (GEOS via OGR as the oracle)", "[contours]") {
  if (!OGRGeometryFactory::haveGEOS()) {
    WARN("GDAL built without GEOS: no independent intersection oracle");
    return;
  }
  auto dem = rough_dem(180, 150, 20);
  ContourParams p;
  p.interval_m = 2;  // dense: contours a few cells apart, often closer
  p.scale_denominator = 50000;
  p.smoothing_mm = 0.5;  // strong smoothing to provoke conflicts
  auto raw = generate_raw(dem, p);
  // The raw lines of one surface do not cross (the oracle agrees with GDAL's generator).
  REQUIRE(ogr_intersecting_pairs(raw) == 0);
  auto lines = raw;
  auto stats = prepare_for_print(lines, p, 20);
  CHECK(stats.vertices_out < stats.vertices_in);
  CHECK(ogr_intersecting_pairs(lines) == 0);
  // No line crosses itself (OGR: a simple line has no self-intersection).
  for (const auto& l : lines) {
    OGRLineString g;
    for (const auto& q : l.ground) g.addPoint(q.x, q.y);
    if (l.closed) g.addPoint(l.ground[0].x, l.ground[0].y);
    CHECK(g.IsSimple());
  }
  CHECK(find_crossings(lines).empty());
}

TEST_CASE("smoothing moves lines by less than the tolerance and thins the vertices", "[contours]") {
  auto dem = rough_dem(150, 150, 10);
  ContourParams p;
  p.interval_m = 10;
  p.scale_denominator = 25000;
  auto raw = generate_raw(dem, p);
  auto lines = raw;
  auto stats = prepare_for_print(lines, p, 10);
  REQUIRE(stats.loops_dropped + static_cast<long>(lines.size()) == static_cast<long>(raw.size()));
  // Largest displacement: max(0.25 mm x 25 m/mm, half a cell) = 6.25 m, plus the
  // simplification's 0.05 mm (1.25 m): every prepared vertex lies that close to its raw line.
  double bound = 6.25 + 1.25 + 1e-6;
  std::vector<OGRLineString> raw_geoms(raw.size());
  for (std::size_t i = 0; i < raw.size(); ++i) {
    for (const auto& q : raw[i].ground) raw_geoms[i].addPoint(q.x, q.y);
    if (raw[i].closed) raw_geoms[i].addPoint(raw[i].ground[0].x, raw[i].ground[0].y);
  }
  double worst = 0;
  for (const auto& l : lines) {
    for (const auto& q : l.ground) {
      OGRPoint pt(q.x, q.y);
      double d = 1e300;
      for (std::size_t i = 0; i < raw.size(); ++i)
        if (raw[i].elevation_m == l.elevation_m) d = std::min(d, raw_geoms[i].Distance(&pt));
      worst = std::max(worst, d);
    }
  }
  CHECK(worst <= bound);
  double cm = stats.length_out_m / 250;  // 1 cm on paper = 250 m at 1:25 000
  INFO("vertices per cm of line: raw " << stats.vertices_in / cm << ", kept "
                                       << stats.vertices_out / cm);
  CHECK(stats.vertices_out < stats.vertices_in);
}
