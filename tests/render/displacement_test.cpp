// Line displacement on the demo's shared corridor: the valley's railway and main road, read with
// OGR from the demo GeoPackage, with the half-widths of the field style's symbols. Distances on
// the page are ground distances / 25 at 1:25 000 (a similarity: the sheet's transform only adds
// a translation and a flip).
#include <gdal_priv.h>
#include <ogrsf_frmts.h>

#include <catch2/catch.hpp>
#include <iomanip>
#include <sstream>

#include "render/render_support.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/features/displace.hpp"
#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

constexpr double kMmPerMetre = 1.0 / 25;  // 1:25 000

std::vector<Polyline> read_lines(GDALDataset& ds, const char* layer, const char* filter) {
  OGRLayer* l = ds.GetLayerByName(layer);
  REQUIRE(l);
  if (filter) l->SetAttributeFilter(filter);
  std::vector<Polyline> out;
  for (auto& f : *l) {
    const OGRLineString* ls = f->GetGeometryRef()->toLineString();
    Polyline p;
    for (int i = 0; i < ls->getNumPoints(); ++i)
      p.push_back({ls->getX(i) * kMmPerMetre, -ls->getY(i) * kMmPerMetre});
    out.push_back(std::move(p));
  }
  return out;
}

// Half the ink of a line symbol across its centre line: strokes (with offsets), ticks of marks
// with half their pen (docs/style.md, displacement).
double half_width_mm(const style::LineSymbol& s) {
  double w = 0;
  for (const auto& st : s.strokes) w = std::max(w, std::abs(st.offset_mm) + st.width_mm / 2);
  for (const auto& m : s.marks) w = std::max(w, m.length_mm + m.stroke.width_mm / 2);
  return w;
}

const style::Layer& layer_of(const style::Style& s, const std::string& id) {
  for (const auto& l : s.layers)
    if (l.id == id) return l;
  FAIL("no layer " << id);
  throw;
}

// Where two polylines cross (segment intersections at 30 degrees or more), page mm.
std::vector<Point> crossings(const Polyline& a, const Polyline& b) {
  std::vector<Point> out;
  for (std::size_t i = 0; i + 1 < a.size(); ++i)
    for (std::size_t j = 0; j + 1 < b.size(); ++j) {
      const Point r = a[i + 1] - a[i], s = b[j + 1] - b[j];
      const double den = cross(r, s);
      if (den == 0) continue;
      const double t = cross(b[j] - a[i], s) / den, u = cross(b[j] - a[i], r) / den;
      // Crossings at 30 degrees or more; shallower, the lines run together (docs/style.md).
      const double sin_angle = std::abs(den) / (length(r) * length(s));
      if (t >= 0 && t <= 1 && u >= 0 && u <= 1 && sin_angle >= 0.5) out.push_back(a[i] + r * t);
    }
  return out;
}

}  // namespace

TEST_CASE("the demo's road gives way to the railway until their symbols touch",
          "[render][displace]") {
  gdal_init();
  const style::Style style = style::load_style(test::source_dir() / "styles/field.yaml");
  const style::Layer& rail_layer = layer_of(style, "railways");
  const style::Layer& road_layer = layer_of(style, "roads");
  REQUIRE(rail_layer.displacement);
  REQUIRE(road_layer.displacement);
  REQUIRE(road_layer.rules[0].filter.values == std::vector<std::string>{"main"});
  const double rail_half = half_width_mm(*rail_layer.rules[0].line);
  const double road_half = half_width_mm(*road_layer.rules[0].line);
  const double clearance = rail_half + road_half;
  const double limit = road_layer.displacement->max_shift_mm;
  CHECK(rail_half == Approx(1.4));   // sleeper ticks 1.3 mm either side, 0.2 mm pen
  CHECK(road_half == Approx(0.55));  // the 1.1 mm casing

  DatasetPtr ds(GDALDataset::Open((test::demo_area() / "features.gpkg").c_str(), GDAL_OF_VECTOR));
  REQUIRE(ds);
  const std::vector<Polyline> rails = read_lines(*ds, "railways", nullptr);
  const std::vector<Polyline> roads = read_lines(*ds, "roads", "class = 'main'");
  REQUIRE(rails.size() == 1);
  REQUIRE(roads.size() == 1);
  const Polyline& rail = rails[0];
  const Polyline road = roads[0];

  // Crossing zones: within 10 clearances of a place where the road crosses the railway, overlap
  // is the crossing (docs/style.md: held for up to 2 clearances, then freed over the transition
  // for a shift of one clearance, 8 of them).
  std::vector<Point> crossing = crossings(road, rail);
  auto near_crossing = [&](Point p) {
    for (Point c : crossing)
      if (distance(p, c) < 10 * clearance) return true;
    return false;
  };
  // The corridor: points of the road every 0.25 mm that run beside the railway closer than the
  // symbols allow, away from crossings.
  Polyline samples;
  for (std::size_t i = 0; i + 1 < road.size(); ++i)
    for (double t = 0; t < 1; t += 0.25 / std::max(0.25, distance(road[i], road[i + 1])))
      samples.push_back(road[i] + (road[i + 1] - road[i]) * t);
  int overlapping_before = 0;
  for (Point p : samples)
    if (!near_crossing(p) && features::distance_to_polyline(p, rail) < clearance)
      ++overlapping_before;
  INFO(overlapping_before << " road points of 0.25 mm overlapping the railway before");
  REQUIRE(overlapping_before > 100);  // the demo's shared corridor: more than 25 mm of it

  std::vector<features::DisplacedLine> lines{
      {rail, rail_half, rail_layer.displacement->priority, rail_layer.displacement->max_shift_mm,
       1},
      {road, road_half, road_layer.displacement->priority, limit, 2}};
  const auto conflicts = features::displace_lines(lines);
  CHECK(conflicts.empty());
  const Polyline& moved = lines[1].line_mm;
  // A stretch moved across the railway crosses it there, steeply: a crossing of its own.
  for (Point c : crossings(moved, rail)) crossing.push_back(c);
  CHECK(lines[0].line_mm.size() == rail.size());  // the railway keeps its place

  // After: the centre lines are at least the sum of the half-widths apart (measured both ways:
  // the closest approach of two polylines is at a vertex of one of them), except at crossings.
  double closest = 1e9, moved_most = 0;
  Point closest_at;
  for (Point p : moved) {
    const double d = features::distance_to_polyline(p, rail);
    if (!near_crossing(p) && d < closest) {
      closest = d;
      closest_at = p;
    }
    moved_most = std::max(moved_most, features::distance_to_polyline(p, road));
  }
  for (Point p : rail) {
    const double d = features::distance_to_polyline(p, moved);
    if (!near_crossing(p) && d < closest) {
      closest = d;
      closest_at = p;
    }
  }
  std::ostringstream where;
  where << std::fixed << std::setprecision(0) << "closest near E " << closest_at.x / kMmPerMetre
        << " N " << -closest_at.y / kMmPerMetre << "; conflicts:";
  for (const auto& c : conflicts)
    where << " E " << c.at_mm.x / kMmPerMetre << " N " << -c.at_mm.y / kMmPerMetre;
  INFO(where.str());
  CHECK(closest >= clearance - 1e-6);
  // No vertex moved more than the style's limit (every output vertex lies on the original road
  // moved by its shift, so its distance from the original line bounds the shift from below), and
  // the corridor did move.
  CHECK(moved_most <= limit + 1e-9);
  CHECK(moved_most > 0.3);
}

// What displacement leaves overlapping is a warning, seen without --verbose: the render of the
// demo sheet logs the same conflict lines at the default level as at --verbose (issue 13; before,
// they were only at --verbose, and the demo's one near E 475100 N 5195260 went unseen).
TEST_CASE("conflicts left by displacement are warnings", "[render][displace]") {
  test::TempDir dir("displace-warn");
  const auto project = test::write_demo_project(dir);
  auto conflict_lines = [](const std::string& err) {
    std::vector<std::string> out;
    std::istringstream in(err);
    for (std::string line; std::getline(in, line);)
      if (line.find("' overlap by ") != std::string::npos) out.push_back(line);
    return out;
  };
  auto plain = test::run_sheetmill({"render", project.string(), "-o", (dir / "a.pdf").string()});
  auto verbose = test::run_sheetmill(
      {"--verbose", "render", project.string(), "-o", (dir / "b.pdf").string()});
  REQUIRE(plain.exit_code == 0);
  REQUIRE(verbose.exit_code == 0);
  const auto seen = conflict_lines(plain.err), all = conflict_lines(verbose.err);
  INFO(verbose.err);
  CHECK(seen == all);
  for (const auto& l : seen) CHECK(l.find("warning: ") != std::string::npos);
}
