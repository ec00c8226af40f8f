// The scale bar and the north diagram as drawn: their geometry read back from a Cairo SVG
// recording (tests/sheet/svg_paths) and compared with the exact scale and with north values from
// PROJ and the WMM.
#include <catch2/catch.hpp>
#include <cmath>
#include <filesystem>

#include "sheetmill/core/units.hpp"
#include "sheetmill/geomag/model.hpp"
#include "sheetmill/sheet/layout.hpp"
#include "sheetmill/sheet/north_diagram.hpp"
#include "sheetmill/sheet/scale_bar.hpp"
#include "sheetmill/sheet/sheet_info.hpp"
#include "support/test_env.hpp"
#include "svg_paths.hpp"

using namespace sheetmill;
using namespace sheetmill::sheet;

namespace {

struct Rect {
  Box box;
  bool filled = false;
};

// The bar's segments: closed axis-aligned four-corner paths, by row (top y) then x.
std::vector<std::vector<Rect>> bar_rows(const std::vector<test::SvgPath>& paths) {
  std::vector<Rect> rects;
  for (const auto& p : paths) {
    for (const auto& sp : p.subpaths) {
      if (sp.size() != 4 || p.has_curves) continue;
      bool axis_aligned = true;
      for (std::size_t i = 0; i < 4; ++i) {
        Point a = sp[i], b = sp[(i + 1) % 4];
        axis_aligned = axis_aligned && (std::abs(a.x - b.x) < 1e-3 || std::abs(a.y - b.y) < 1e-3);
      }
      if (!axis_aligned) continue;
      Box b;
      for (Point q : sp) b.add(q);
      if (b.height() < 1 || b.height() > 2) continue;  // the bar is 1.6 mm tall
      rects.push_back({b, p.filled});
    }
  }
  std::sort(rects.begin(), rects.end(), [](const Rect& a, const Rect& b) {
    return std::abs(a.box.min_y - b.box.min_y) > 0.01 ? a.box.min_y < b.box.min_y
                                                      : a.box.min_x < b.box.min_x;
  });
  std::vector<std::vector<Rect>> rows;
  for (const auto& r : rects) {
    if (rows.empty() || std::abs(rows.back().front().box.min_y - r.box.min_y) > 0.01)
      rows.emplace_back();
    rows.back().push_back(r);
  }
  return rows;
}

// Metres per unit by definition: the international foot is 0.3048 m exactly and the mile
// 5280 ft = 1609.344 m (1959 international yard and pound agreement).
double metres_per(const std::string& unit) {
  return unit == "ft" ? 0.3048 : unit == "mi" ? 1609.344 : 1.0;
}

}  // namespace

// The definition of scale: L ground metres are L x 1000 / N mm at 1:N. Every segment edge of
// the drawn bar stands at the ground distance its figure states, within 0.1 mm.
TEST_CASE("scale bar segment edges at their ground distance", "[sheet][scale_bar]") {
  test::TempDir dir("scale_bar_geometry");
  style::Style style;
  text::FontCache fonts;
  const Box box = Box::of(10, 10, 310, 40);  // a band under a 300 mm frame
  for (double N : {10000.0, 24000.0, 25000.0, 50000.0, 63360.0, 250000.0}) {
    for (const std::string unit : {"m", "ft", "mi"}) {
      INFO("1:" << N << " in " << unit);
      auto paths = test::drawn_paths(
          320, 50, [&](cairo_t* cr) { draw_scale_panel(cr, box, N, {unit}, style, fonts); },
          (dir / "bar.svg").string());
      // What the bar states: its figures come from this plan.
      auto plan = plan_scale_bar(N, scale_bar_room_mm(box.width()), scale_unit(unit));
      auto rows = bar_rows(paths);
      REQUIRE(rows.size() == 1);
      const auto& r = rows.front();
      REQUIRE(r.size() == static_cast<std::size_t>(plan.subdivisions + plan.segments));
      double seg_mm = plan.segment_units * metres_per(unit) * 1000.0 / N;
      double zero = r[plan.subdivisions].box.min_x;
      for (int i = 0; i < plan.segments; ++i) {
        const Box& b = r[plan.subdivisions + i].box;
        CHECK(b.min_x - zero == Approx(i * seg_mm).margin(0.1));
        CHECK(b.max_x - zero == Approx((i + 1) * seg_mm).margin(0.1));
      }
      for (int j = 0; j < plan.subdivisions; ++j) {
        const Box& b = r[j].box;
        CHECK(zero - b.min_x ==
              Approx(seg_mm * (plan.subdivisions - j) / plan.subdivisions).margin(0.1));
      }
      // A visible zero: the pieces either side of 0 differ, and every piece alternates.
      CHECK(r[plan.subdivisions - 1].filled != r[plan.subdivisions].filled);
      for (std::size_t k = 1; k < r.size(); ++k) {
        if (static_cast<int>(k) == plan.subdivisions) continue;
        CHECK(r[k].filled != r[k - 1].filled);
      }
    }
  }
}

// Common practice (our own reading of field sheets): at 1:25 000 a bar of several kilometres.
TEST_CASE("scale bar length suits the scale", "[sheet][scale_bar]") {
  auto m = plan_scale_bar(25000, scale_bar_room_mm(300), scale_unit("m"));
  CHECK(m.segment_units * m.segments >= 3000);
  auto small = plan_scale_bar(250000, scale_bar_room_mm(300), scale_unit("m"));
  CHECK(small.segment_units * small.segments >= 20000);
  // Feet heights bring an imperial bar; at 1:25 000 in 160 mm (4 km, 2.49 mi) two whole miles
  // fit, at 1:10 000 (1.6 km, 0.99 mi) they do not.
  CHECK(scale_bar_units({}, 1.0, 25000, 160) == std::vector<std::string>{"m"});
  CHECK(scale_bar_units({}, kMetresPerFoot, 25000, 160) == std::vector<std::string>{"m", "mi"});
  CHECK(scale_bar_units({}, kMetresPerFoot, 10000, 160) == std::vector<std::string>{"m", "ft"});
  CHECK(scale_bar_units({"m", "ft"}, 1.0, 25000, 160) == std::vector<std::string>{"m", "ft"});
}

TEST_CASE("metric and feet bars share one zero", "[sheet][scale_bar]") {
  test::TempDir dir("scale_bar_two");
  style::Style style;
  text::FontCache fonts;
  const Box box = Box::of(10, 10, 310, 40);
  auto paths = test::drawn_paths(
      320, 50,
      [&](cairo_t* cr) {
        draw_scale_panel(cr, box, 24000, {"m", "ft"}, style, fonts);
      },
      (dir / "bars.svg").string());
  auto rows = bar_rows(paths);
  REQUIRE(rows.size() == 2);
  auto pm = plan_scale_bar(24000, scale_bar_room_mm(box.width()), scale_unit("m"));
  auto pf = plan_scale_bar(24000, scale_bar_room_mm(box.width()), scale_unit("ft"));
  double zero_m = rows[0][pm.subdivisions].box.min_x;
  double zero_f = rows[1][pf.subdivisions].box.min_x;
  CHECK(zero_m == Approx(zero_f).margin(0.01));
  // 2 000 ft is one inch at 1:24 000 (common practice, the 7.5-minute quadrangle scale).
  CHECK(pf.segment_units * 0.3048 * 1000 / 24000 ==
        Approx(rows[1][pf.subdivisions].box.width()).margin(0.1));
}

namespace {

// The three lines of the drawn north diagram, clockwise from page up: grid, true, magnetic (in
// the order they are drawn: two-point stroked paths from one base).
std::vector<double> drawn_north_deg(const NorthInfo& n, const test::TempDir& dir) {
  style::Style style;
  style.furniture.ink = {0, 0, 0, 1};
  style.furniture.accent = {0.7, 0.1, 0.1, 1};
  text::FontCache fonts;
  auto paths = test::drawn_paths(
      100, 60, [&](cairo_t* cr) { draw_north_diagram(cr, Box::of(0, 0, 90, 50), n, style, fonts); },
      (dir / "north.svg").string());
  std::vector<double> out;
  for (const auto& p : paths) {
    if (p.filled || !p.stroked || p.subpaths.size() != 1 || p.subpaths[0].size() != 2) continue;
    Point a = p.subpaths[0][0], b = p.subpaths[0][1];
    out.push_back(std::atan2(b.x - a.x, a.y - b.y) / kDegToRad);
  }
  return out;
}

int sign(double v, double eps = 1e-9) {
  return v > eps ? 1 : v < -eps ? -1 : 0;
}

}  // namespace

// True values from PROJ (grid convergence at the sheet centre) and from the WMM file or the
// project's stated declination; the drawing must keep every line on its true side of grid north
// and of each other, and keep lines that differ at least 10 degrees apart.
TEST_CASE("north diagram keeps order and sign of the true angles", "[sheet][north]") {
  test::TempDir dir("north_geometry");
  auto wmm = test::shared_dir() / "data" / "wmm" / "WMM2025.COF";
  struct Case {
    std::string crs;
    Box extent;
    std::optional<double> declination;  // stated; otherwise from the WMM
  };
  std::vector<Case> cases = {
      {"EPSG:32633", Box::of(500000, 5200000, 510000, 5208000), std::nullopt},
      {"EPSG:32632", Box::of(476000, 5193000, 486000, 5201000), std::nullopt},
      {"EPSG:32617", Box::of(300000, 4500000, 310000, 4508000), std::nullopt},
      {"EPSG:32633", Box::of(500000, 5200000, 510000, 5208000), 0.0},
      // Stated declinations (the demo's 3.1 E; a west value), so the test runs without the file.
      {"EPSG:32632", Box::of(476000, 5193000, 486000, 5201000), 3.1},
      {"EPSG:32617", Box::of(300000, 4500000, 310000, 4508000), -9.5},
  };
  for (const auto& c : cases) {
    project::Project p;
    p.crs = c.crs;
    p.scale = 25000;
    p.paper = {"A1", 841, 594};
    p.extent.box = c.extent;
    p.magnetic.date = "2026-06-01";
    if (c.declination) {
      p.magnetic.declination_deg = c.declination;
    } else {
      if (!std::filesystem::exists(wmm)) {
        WARN("WMM2025.COF not found; skipped");
        continue;
      }
      p.magnetic.model_file = wmm.string();
    }
    style::Style style;
    auto L = compute_layout(p, style, std::nullopt);
    NorthInfo base = describe_sheet(p, L).north;
    // The true values, then the same sheet with declinations just beside convergence, where
    // magnetic and true north nearly coincide and grid north lies between or outside them.
    for (double offset : {999.0, 0.004, -0.004, 0.0}) {
      NorthInfo n = base;
      if (offset != 999.0) n.declination_deg = n.grid_convergence_deg + offset;
      double t = -n.grid_convergence_deg, m = *n.grid_magnetic_angle_deg();
      INFO(c.crs << " convergence " << n.grid_convergence_deg << " declination "
                 << *n.declination_deg);
      auto d = drawn_north_deg(n, dir);
      REQUIRE(d.size() == 3);
      CHECK(d[0] == Approx(0).margin(0.01));  // grid north straight up
      CHECK(sign(d[1], 0.01) == sign(t));
      CHECK(sign(d[2], 0.01) == sign(m));
      CHECK(sign(d[2] - d[1], 0.01) == sign(m - t));
      if (sign(t) != 0) CHECK(std::abs(d[1]) >= 10 - 0.01);
      if (sign(m) != 0) CHECK(std::abs(d[2]) >= 10 - 0.01);
      if (sign(m - t) != 0) CHECK(std::abs(d[2] - d[1]) >= 10 - 0.01);
    }
  }
}
