// Water in the full-size demo area, checked against the DEM as GDAL reads it: streams run
// downhill and end somewhere water can go, the lake is flat, a closed depression is kept.
#include <gdal_alg.h>

#include <catch2/catch.hpp>
#include <cmath>
#include <queue>

#include "demo/demo_test_support.hpp"
#include "support/test_env.hpp"

namespace fs = std::filesystem;
using namespace sheetmill;

namespace {

double seg_distance(OGRRawPoint p, OGRRawPoint a, OGRRawPoint b) {
  double dx = b.x - a.x, dy = b.y - a.y;
  double len2 = dx * dx + dy * dy;
  double t = len2 > 0 ? std::clamp(((p.x - a.x) * dx + (p.y - a.y) * dy) / len2, 0.0, 1.0) : 0;
  return std::hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy));
}

// Cells of the DEM grid whose centre GDAL's rasteriser puts inside the polygon (GDAL as the
// oracle for "inside the lake").
std::vector<unsigned char> rasterize(const test::DemArray& dem, OGRGeometry* poly) {
  GDALDriver* mem = GetGDALDriverManager()->GetDriverByName("MEM");
  DatasetPtr ds(mem->Create("", dem.width, dem.height, 1, GDT_Byte, nullptr));
  double gt[6];
  std::copy(dem.gt, dem.gt + 6, gt);
  ds->SetGeoTransform(gt);
  int band = 1;
  double burn = 1;
  OGRGeometryH g = OGRGeometry::ToHandle(poly);
  GDALRasterizeGeometries(GDALDataset::ToHandle(ds.get()), 1, &band, 1, &g, nullptr, nullptr, &burn,
                          nullptr, nullptr, nullptr);
  std::vector<unsigned char> mask(dem.z.size());
  if (ds->GetRasterBand(1)->RasterIO(GF_Read, 0, 0, dem.width, dem.height, mask.data(), dem.width,
                                     dem.height, GDT_Byte, 0, 0) != CE_None) {
    mask.clear();
  }
  return mask;
}

}  // namespace

TEST_CASE("every water line runs downhill in the DEM and ends where water can go", "[demo]") {
  fs::path area = test::demo_area();
  test::DemArray dem = test::read_dem(area / "dem.tif");
  DatasetPtr ds = open_vector((area / "features.gpkg").string());
  auto lines = test::read_layer(*ds, "water_lines");
  auto areas = test::read_layer(*ds, "water_areas");
  REQUIRE(lines.size() > 50);
  const OGRGeometry* lake = nullptr;
  for (const auto& a : areas) {
    if (std::string(a->GetFieldAsString("kind")) == "lake") lake = a->GetGeometryRef();
  }
  REQUIRE(lake != nullptr);
  std::vector<std::vector<OGRRawPoint>> pts;
  for (const auto& f : lines) pts.push_back(test::line_points(*f));
  double x0 = dem.gt[0], y1 = dem.gt[3];
  double x1 = x0 + dem.width * dem.gt[1], y0 = y1 + dem.height * dem.gt[5];
  double cell = dem.gt[1];
  int rivers = 0, uphill = 0, stranded = 0;
  for (std::size_t i = 0; i < lines.size(); ++i) {
    const auto& p = pts[i];
    REQUIRE(p.size() >= 2);
    bool river = std::string(lines[i]->GetFieldAsString("kind")) == "river";
    rivers += river;
    // Brief: every vertex no higher (DEM, bilinear) than the one upstream, within 0.5 m.
    for (std::size_t k = 1; k < p.size(); ++k) {
      double up = dem.bilinear(p[k - 1].x, p[k - 1].y);
      double down = dem.bilinear(p[k].x, p[k].y);
      if (down > up + 0.5) {
        ++uphill;
        UNSCOPED_INFO("line " << i << " vertex " << k << " rises " << down - up << " m");
      }
    }
    if (river) continue;  // the river's ends are the area edge and the lake, checked below
    // Brief: the last vertex is on another water line, in the lake, or within 2 cells of the
    // area's edge.
    OGRRawPoint end = p.back();
    bool ok = end.x - x0 <= 2 * cell || x1 - end.x <= 2 * cell || end.y - y0 <= 2 * cell ||
              y1 - end.y <= 2 * cell;
    OGRPoint end_pt(end.x, end.y);
    ok = ok || lake->Contains(&end_pt);
    for (std::size_t j = 0; !ok && j < lines.size(); ++j) {
      if (j == i) continue;
      for (std::size_t k = 1; k < pts[j].size() && !ok; ++k) {
        ok = seg_distance(end, pts[j][k - 1], pts[j][k]) < 0.01;
      }
    }
    if (!ok) {
      ++stranded;
      UNSCOPED_INFO("line " << i << " ends at " << end.x << " " << end.y);
    }
  }
  CHECK(rivers >= 1);
  CHECK(uphill == 0);
  CHECK(stranded == 0);
}

TEST_CASE("the lake surface is exactly flat at its level", "[demo]") {
  fs::path area = test::demo_area();
  test::DemArray dem = test::read_dem(area / "dem.tif");
  DatasetPtr ds = open_vector((area / "features.gpkg").string());
  int lakes = 0;
  for (auto& a : test::read_layer(*ds, "water_areas")) {
    if (std::string(a->GetFieldAsString("kind")) != "lake") continue;
    ++lakes;
    double level = a->GetFieldAsDouble("level_m");
    std::vector<unsigned char> inside = rasterize(dem, a->GetGeometryRef());
    REQUIRE(inside.size() == dem.z.size());
    int cells = 0, off = 0;
    for (std::size_t i = 0; i < inside.size(); ++i) {
      if (!inside[i]) continue;
      ++cells;
      if (std::fabs(dem.z[i] - level) > 1e-3) ++off;  // brief: equal within 1e-3
    }
    CHECK(cells > 10000);  // a lake of some km^2 at 5 m cells, not a speck
    CHECK(off == 0);
    // The lake is the lowest ground around it only at its outlet: most shore cells just
    // outside stand above the level (checked on the cells 1-3 cells outside the polygon).
    int above = 0, shore = 0;
    for (int r = 1; r + 1 < dem.height; ++r) {
      for (int c = 1; c + 1 < dem.width; ++c) {
        std::size_t i = static_cast<std::size_t>(r) * dem.width + c;
        if (inside[i]) continue;
        bool next_to =
            inside[i - 1] || inside[i + 1] || inside[i - dem.width] || inside[i + dem.width];
        if (!next_to) continue;
        ++shore;
        above += dem.z[i] >= level;
      }
    }
    CHECK(above > 0.95 * shore);
  }
  CHECK(lakes == 1);
}

TEST_CASE("a closed depression deeper than 5 m survives away from the lake", "[demo]") {
  fs::path area = test::demo_area();
  test::DemArray dem = test::read_dem(area / "dem.tif");
  DatasetPtr ds = open_vector((area / "features.gpkg").string());
  const OGRGeometry* lake = nullptr;
  auto areas = test::read_layer(*ds, "water_areas");
  for (const auto& a : areas) {
    if (std::string(a->GetFieldAsString("kind")) == "lake") lake = a->GetGeometryRef();
  }
  REQUIRE(lake != nullptr);
  // Priority-Flood (Barnes, Lehman & Mulla 2014), written here independently of the
  // generator: flood from the edge in order of height; a cell's fill is the highest level met.
  const int w = dem.width, h = dem.height;
  std::vector<float> fill(dem.z);
  std::vector<char> seen(fill.size(), 0);
  using E = std::pair<float, int>;
  std::priority_queue<E, std::vector<E>, std::greater<E>> q;
  for (int c = 0; c < w; ++c)
    for (int r : {0, h - 1}) q.push({fill[r * w + c], r * w + c}), seen[r * w + c] = 1;
  for (int r = 1; r + 1 < h; ++r)
    for (int c : {0, w - 1}) q.push({fill[r * w + c], r * w + c}), seen[r * w + c] = 1;
  while (!q.empty()) {
    auto [z, i] = q.top();
    q.pop();
    int c = i % w, r = i / w;
    for (int dr = -1; dr <= 1; ++dr) {
      for (int dc = -1; dc <= 1; ++dc) {
        int cc = c + dc, rr = r + dr;
        if (cc < 0 || rr < 0 || cc >= w || rr >= h) continue;
        int n = rr * w + cc;
        if (seen[n]) continue;
        seen[n] = 1;
        fill[n] = std::max(fill[n], z);
        q.push({fill[n], n});
      }
    }
  }
  double deepest = 0;
  OGREnvelope lake_box;
  lake->getEnvelope(&lake_box);
  for (int r = 0; r < h; ++r) {
    for (int c = 0; c < w; ++c) {
      double depth = fill[r * w + c] - dem.at(c, r);
      if (depth <= deepest) continue;
      double x = dem.cell_x(c), y = dem.cell_y(r);
      // Away from the lake: outside its bounding box grown by 200 m.
      if (x > lake_box.MinX - 200 && x < lake_box.MaxX + 200 && y > lake_box.MinY - 200 &&
          y < lake_box.MaxY + 200) {
        continue;
      }
      deepest = depth;
    }
  }
  CHECK(deepest > 5.0);  // brief: filled depth > 5 m away from the lake
}
