// The relief and the colour bar on the rasterised exhibit (poppler's pdftoppm as the oracle):
// the bar labels exactly the ramp's stops, the bar shows the ramp's colour at each label, the
// map shows that colour where the ground is at that elevation, and relief strips join without
// a seam. The DEM is a plane z = 100 m + 0.05 (E - E0), so every elevation's place is known.
#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>
#include <cstdlib>

#include "exhibit_fixture.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/render_exhibit.hpp"
#include "sheetmill/terrain/tint.hpp"
#include "support/pdf_words.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

namespace {
constexpr double kZ0 = 100, kSlope = 0.05;

int px(double mm, double dpi) {
  return static_cast<int>(std::floor(mm / kMmPerInch * dpi));
}

int max_channel_diff(const fx::Rgb& a, const Colour& c) {
  return std::max({std::abs(a.r - static_cast<int>(std::lround(c.r * 255))),
                   std::abs(a.g - static_cast<int>(std::lround(c.g * 255))),
                   std::abs(a.b - static_cast<int>(std::lround(c.b * 255)))});
}
}  // namespace

TEST_CASE("colour bar labels and colours match the ramp and the relief", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-bar");
  fx::write_plane_dem(dir / "dem.tif", kZ0, kSlope, 50);
  // No shading, so the relief's colour is the tint alone; lossless, so nothing blurs it.
  sheetmill::test::write_text(
      dir / "x.yaml", fx::exhibit_yaml(dir / "dem.tif", "ARCH D", false, 1,
                                       "  shading: 0\n  compression: lossless\n  dpi: 50\n"));
  ExhibitReport rep = render_exhibit(load_exhibit_project(dir / "x.yaml"), dir / "x.pdf");
  const terrain::TintRamp& ramp = rep.ramp;
  const ColourBarReport& bar = rep.colour_bar;

  // 1. The labelled values are the ramp's stops, and pdftotext finds exactly those numbers
  //    under the bar.
  std::vector<double> stops;
  for (const auto& s : ramp.stops) stops.push_back(s.first);
  CHECK(bar.values_m == stops);
  std::vector<double> printed;
  const Box& box = rep.layout.colour_bar_box_mm;
  for (const test::PdfWord& w : test::pdf_words(dir / "x.pdf")) {
    const double y_mm = w.box_mm().min_y, x_mm = w.box_mm().centre().x;
    if (y_mm < bar.bar_bottom_mm || y_mm > box.max_y || x_mm < box.min_x || x_mm > box.max_x) {
      continue;
    }
    char* end = nullptr;
    const double v = std::strtod(w.text.c_str(), &end);
    if (end && *end == '\0') printed.push_back(v);
  }
  std::sort(printed.begin(), printed.end());
  CHECK(printed == stops);

  // 2. The bar's colour at each label's tick is the ramp's colour there, and 3. the map's
  //    colour where the plane has that elevation is the same.
  const double dpi = 100;
  fx::Raster page = fx::rasterise(dir / "x.pdf", dpi, dir.path());
  const double y_bar = (bar.bar_top_mm + bar.bar_bottom_mm) / 2;
  const MapFrame& frame = rep.layout.frame;
  int map_checked = 0;
  for (std::size_t k = 0; k < bar.values_m.size(); ++k) {
    INFO("stop " << bar.values_m[k] << " m");
    // At the ends, sample just inside the bar; expect the ramp's colour at that point.
    double x = bar.x_mm[k];
    if (k == 0) x += 0.6;
    if (k + 1 == bar.values_m.size()) x -= 0.6;
    const double z_at_x = bar.values_m.front() + (x - bar.x_mm.front()) /
                                                     (bar.x_mm.back() - bar.x_mm.front()) *
                                                     (bar.values_m.back() - bar.values_m.front());
    CHECK(max_channel_diff(page.at(px(x, dpi), px(y_bar, dpi)),
                           terrain::tint_colour(ramp, z_at_x)) <= 4);

    const double e = fx::kE0 + (bar.values_m[k] - kZ0) / kSlope;
    const Point p = frame.to_page({e, frame.ground.centre().y});
    if (p.x < rep.layout.map_box_mm.min_x + 1 || p.x > rep.layout.map_box_mm.max_x - 1) continue;
    CHECK(max_channel_diff(page.at(px(p.x, dpi), px(p.y, dpi)),
                           terrain::tint_colour(ramp, bar.values_m[k])) <= 4);
    ++map_checked;
  }
  CHECK(map_checked >= 3);
}

TEST_CASE("relief strips join without a seam", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-seam");
  fx::write_plane_dem(dir / "dem.tif", kZ0, kSlope, 50);
  for (std::string compression : {"lossless", "jpeg"}) {
    INFO(compression);
    sheetmill::test::write_text(
        dir / "x.yaml", fx::exhibit_yaml(dir / "dem.tif", "ARCH D", false, 1,
                                         "  compression: " + compression + "\n  dpi: 60\n"));
    ExhibitOptions o;
    o.max_strip_pixels = 20000;  // many thin strips
    ExhibitReport rep = render_exhibit(load_exhibit_project(dir / "x.yaml"), dir / "x.pdf", o);
    REQUIRE(rep.relief_strips >= 20);
    // Rasterised at a resolution unrelated to the strips' so their joins fall between pixels.
    const double dpi = 137;
    fx::Raster page = fx::rasterise(dir / "x.pdf", dpi, dir.path());
    const Box& map = rep.layout.map_box_mm;
    // The plane's colour is constant down every column: any strip join would show as a row
    // that differs from the column's median.
    for (double fx_ : {0.3, 0.5, 0.7}) {
      const int x = px(map.min_x + fx_ * map.width(), dpi);
      std::vector<int> g;
      for (int y = px(map.min_y, dpi) + 3; y < px(map.max_y, dpi) - 3; ++y)
        g.push_back(page.at(x, y).g);
      std::vector<int> sorted = g;
      std::nth_element(sorted.begin(), sorted.begin() + sorted.size() / 2, sorted.end());
      const int median = sorted[sorted.size() / 2];
      int worst = 0;
      for (int v : g) worst = std::max(worst, std::abs(v - median));
      CHECK(worst <= (compression == "jpeg" ? 4 : 1));
    }
  }
}
