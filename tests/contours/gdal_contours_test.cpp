// The two-thread contour generator against GDAL's generator run once over the whole grid (the
// oracle): cutting the grid at its middle row and joining the pieces must give the same lines.
#include "sheetmill/contours/gdal_contours.hpp"

#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>

#include "contours/synthetic_dem.hpp"

using namespace sheetmill;
using namespace sheetmill::contours;

namespace {

// A line as comparable data: level, closed or not, length, and its vertices sorted (a loop may
// start anywhere and a line may run either way).
struct Shape {
  double elevation = 0;
  bool closed = false;
  double length = 0;
  std::vector<std::pair<double, double>> vertices;
};

Shape shape_of(const detail::RawContour& c) {
  Shape s;
  s.elevation = c.elevation_m;
  const Polyline& p = c.points;
  s.closed = p.size() >= 4 && p.front().x == p.back().x && p.front().y == p.back().y;
  for (std::size_t i = 1; i < p.size(); ++i) s.length += distance(p[i - 1], p[i]);
  std::size_t n = s.closed ? p.size() - 1 : p.size();
  for (std::size_t i = 0; i < n; ++i) s.vertices.push_back({p[i].x, p[i].y});
  std::sort(s.vertices.begin(), s.vertices.end());
  return s;
}

std::vector<Shape> shapes(const std::vector<detail::RawContour>& lines) {
  std::vector<Shape> out;
  for (const auto& l : lines) out.push_back(shape_of(l));
  std::sort(out.begin(), out.end(), [](const Shape& a, const Shape& b) {
    return std::tie(a.elevation, a.vertices) < std::tie(b.elevation, b.vertices);
  });
  return out;
}

void check_same(const terrain::Dem& dem, double step) {
  auto whole = shapes(detail::contour_rows(dem, 0, dem.height(), step, 0));
  // The cut made by hand (whatever the machine's core count), and as the generator makes it.
  const int seam = dem.height() / 2;
  auto upper = detail::contour_rows(dem, 0, seam + 1, step, 0);
  auto lower = detail::contour_rows(dem, seam, dem.height(), step, 0);
  REQUIRE(upper.size() + lower.size() > whole.size());  // lines were really cut
  auto joined = shapes(detail::join_at_seam(upper, lower, dem.grid.geotransform, seam));
  CHECK(shapes(detail::gdal_contours(dem, step, 0)).size() == whole.size());
  REQUIRE(joined.size() == whole.size());
  for (std::size_t i = 0; i < whole.size(); ++i) {
    INFO("line " << i << " at " << whole[i].elevation);
    CHECK(joined[i].elevation == whole[i].elevation);
    CHECK(joined[i].closed == whole[i].closed);
    CHECK(joined[i].length == Approx(whole[i].length).epsilon(1e-9));
    REQUIRE(joined[i].vertices.size() == whole[i].vertices.size());
    for (std::size_t k = 0; k < whole[i].vertices.size(); ++k) {
      CHECK(joined[i].vertices[k].first == Approx(whole[i].vertices[k].first).margin(1e-6));
      CHECK(joined[i].vertices[k].second == Approx(whole[i].vertices[k].second).margin(1e-6));
    }
  }
}

}  // namespace

TEST_CASE("contours cut at the middle row and joined equal GDAL's over the whole grid",
          "[contours]") {
  // 300 x 400 cells of 10 m from (0, 4000): the seam row is row 200, centres at y = 1995.
  SECTION("a cone centred on the seam: every loop crosses it twice") {
    auto dem = synthetic::make_dem(300, 400, 10, 0, 4000, [](double x, double y) {
      return 500 - 0.1 * std::hypot(x - 1500, y - 1995);
    });
    check_same(dem, 5);
  }
  SECTION("a tilted, rippled plane: open lines across the seam") {
    auto dem = synthetic::make_dem(300, 400, 10, 0, 4000, [](double x, double y) {
      return 100 + 0.05 * y + 0.02 * x + 8 * std::sin(x / 170) * std::cos(y / 230);
    });
    check_same(dem, 2);
  }
  SECTION("a hole across the seam and knolls beside it") {
    auto dem = synthetic::make_dem(300, 400, 10, 0, 4000, [](double x, double y) {
      return 200 + 30 * std::sin(x / 300) * std::sin(y / 250) + 0.01 * y;
    });
    for (int r = 180; r < 230; ++r)
      for (int c = 100; c < 160; ++c) dem.z[r * 300 + c] = NAN;
    check_same(dem, 3);
  }
}
