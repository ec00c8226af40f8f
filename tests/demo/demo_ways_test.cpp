// Roads, settlement and survey points of the full-size demo area against its DEM.
#include <catch2/catch.hpp>
#include <cmath>
#include <set>

#include "demo/demo_test_support.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

TEST_CASE("roads keep gentle grades between consecutive vertices", "[demo]") {
  fs::path area = test::demo_area();
  test::DemArray dem = test::read_dem(area / "dem.tif");
  DatasetPtr ds = open_vector((area / "features.gpkg").string());
  std::vector<double> grades;
  std::set<std::string> classes;
  for (auto& f : test::read_layer(*ds, "roads")) {
    classes.insert(f->GetFieldAsString("class"));
    auto p = test::line_points(*f);
    for (std::size_t k = 1; k < p.size(); ++k) {
      double run = std::hypot(p[k].x - p[k - 1].x, p[k].y - p[k - 1].y);
      if (run < 1e-6) continue;
      double rise = dem.bilinear(p[k].x, p[k].y) - dem.bilinear(p[k - 1].x, p[k - 1].y);
      grades.push_back(std::fabs(rise) / run);
    }
  }
  REQUIRE(grades.size() > 200);
  CHECK(classes == std::set<std::string>{"main", "secondary", "minor"});
  // Brief: grades mostly below 12 %, the 95th percentile below 10 %.
  double p95 = test::percentile(grades, 0.95);
  INFO("95th percentile grade " << p95 << ", median " << test::percentile(grades, 0.5));
  CHECK(p95 < 0.10);
}

TEST_CASE("summits and control points carry the DEM's heights", "[demo]") {
  fs::path area = test::demo_area();
  test::DemArray dem = test::read_dem(area / "dem.tif");
  DatasetPtr ds = open_vector((area / "features.gpkg").string());
  auto cell_value = [&](const OGRFeature& f) {
    const OGRPoint* p = f.GetGeometryRef()->toPoint();
    int c = static_cast<int>(std::floor((p->getX() - dem.gt[0]) / dem.gt[1]));
    int r = static_cast<int>(std::floor((p->getY() - dem.gt[3]) / dem.gt[5]));
    return static_cast<double>(dem.at(c, r));
  };
  auto summits = test::read_layer(*ds, "summits");
  REQUIRE(summits.size() >= 5);
  for (auto& s : summits) {
    CHECK(s->GetFieldAsDouble("elevation_m") == Approx(cell_value(*s)).margin(1e-3));
    CHECK(std::string(s->GetFieldAsString("name")).size() > 2);
  }
  auto points = test::read_layer(*ds, "control_points");
  REQUIRE(points.size() >= 5);
  std::set<std::string> ids;
  for (auto& p : points) {
    ids.insert(p->GetFieldAsString("id"));
    double e = p->GetFieldAsDouble("elevation_m");
    // Brief: the DEM value rounded to 0.01 m plus a residual under 0.05 m.
    CHECK(std::fabs(e - cell_value(*p)) < 0.05 + 0.005);
    CHECK(std::fabs(e * 100 - std::round(e * 100)) < 1e-6);
  }
  CHECK(ids.size() == points.size());
}

TEST_CASE("buildings stand on dry, gentle ground, clustered in villages", "[demo]") {
  fs::path area = test::demo_area();
  test::DemArray dem = test::read_dem(area / "dem.tif");
  DatasetPtr ds = open_vector((area / "features.gpkg").string());
  const OGRGeometry* lake = nullptr;
  auto water = test::read_layer(*ds, "water_areas");
  for (const auto& a : water) {
    if (std::string(a->GetFieldAsString("kind")) == "lake") lake = a->GetGeometryRef();
  }
  REQUIRE(lake != nullptr);
  auto buildings = test::read_layer(*ds, "buildings");
  REQUIRE(buildings.size() > 100);
  int wet = 0, steep = 0;
  for (auto& b : buildings) {
    OGRPoint c;
    b->GetGeometryRef()->Centroid(&c);
    if (lake->Contains(&c)) ++wet;
    double d = 10;
    double gx = dem.bilinear(c.getX() + d, c.getY()) - dem.bilinear(c.getX() - d, c.getY());
    double gy = dem.bilinear(c.getX(), c.getY() + d) - dem.bilinear(c.getX(), c.getY() - d);
    if (std::hypot(gx, gy) / (2 * d) > 0.25) ++steep;
  }
  CHECK(wet == 0);
  CHECK(steep == 0);
  // Most buildings lie within 1 km of a village.
  std::vector<OGRPoint> villages;
  for (auto& p : test::read_layer(*ds, "places")) {
    if (std::string(p->GetFieldAsString("kind")) == "village")
      villages.push_back(*p->GetGeometryRef()->toPoint());
  }
  CHECK(villages.size() >= 2);
  int near = 0;
  for (auto& b : buildings) {
    OGRPoint c;
    b->GetGeometryRef()->Centroid(&c);
    for (const OGRPoint& v : villages) {
      if (c.Distance(&v) < 1000) {
        ++near;
        break;
      }
    }
  }
  CHECK(near > 0.5 * buildings.size());
}
