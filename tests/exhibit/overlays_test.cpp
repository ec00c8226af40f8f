// Overlays on the rasterised exhibit: the veil outside the area of interest is a white layer at
// the stated opacity (source-over compositing, Porter and Duff 1984), and the area itself is not
// veiled. The DEM is a plane without shading, so the relief colour under every pixel is known.
#include <fmt/format.h>

#include <catch2/catch.hpp>
#include <cmath>

#include "exhibit_fixture.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/render_exhibit.hpp"
#include "sheetmill/terrain/tint.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

TEST_CASE("the veil dims outside the focus area and not inside it", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-veil");
  fx::write_plane_dem(dir / "dem.tif", 100, 0.05, 50);
  // A focus rectangle over the western third of the extent.
  const double e0 = fx::kE0 + 500, e1 = fx::kE0 + 4000, n0 = fx::kN0 + 2000, n1 = fx::kN0 + 7000;
  const std::string areas = fmt::format(
      "areas:\n  - label: Test basin\n    ring: [[{0}, {2}], [{1}, {2}], [{1}, {3}], [{0}, {3}]]\n"
      "dim_outside: 50%\n",
      e0, e1, n0, n1);
  sheetmill::test::write_text(
      dir / "x.yaml",
      fx::exhibit_yaml(dir / "dem.tif", "ARCH D", false, 1,
                       "  shading: 0\n  compression: lossless\n  dpi: 50\n", areas));
  ExhibitReport rep = render_exhibit(load_exhibit_project(dir / "x.yaml"), dir / "x.pdf");
  const double dpi = 100;
  fx::Raster page = fx::rasterise(dir / "x.pdf", dpi, dir.path());
  auto sample = [&](double e, double n) {
    Point p = rep.layout.frame.to_page({e, n});
    return page.at(static_cast<int>(p.x / kMmPerInch * dpi),
                   static_cast<int>(p.y / kMmPerInch * dpi));
  };
  auto level = [](double c) { return static_cast<int>(std::lround(c * 255)); };
  const double n_mid = (n0 + n1) / 2;
  // Inside: the tint itself.
  {
    const double e = (e0 + e1) / 2;
    Colour t = terrain::tint_colour(rep.ramp, 100 + 0.05 * (e - fx::kE0));
    fx::Rgb got = sample(e, n_mid);
    CHECK(std::abs(got.r - level(t.r)) <= 4);
    CHECK(std::abs(got.g - level(t.g)) <= 4);
    CHECK(std::abs(got.b - level(t.b)) <= 4);
  }
  // Outside: half-way to white.
  {
    const double e = fx::kE0 + 8000;
    Colour t = terrain::tint_colour(rep.ramp, 100 + 0.05 * (e - fx::kE0));
    fx::Rgb got = sample(e, n_mid);
    CHECK(std::abs(got.r - level(0.5 * t.r + 0.5)) <= 4);
    CHECK(std::abs(got.g - level(0.5 * t.g + 0.5)) <= 4);
    CHECK(std::abs(got.b - level(0.5 * t.b + 0.5)) <= 4);
  }
}
