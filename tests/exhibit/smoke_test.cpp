#include <catch2/catch.hpp>

#include "exhibit_fixture.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/render_exhibit.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

TEST_CASE("an exhibit renders to PDF and PNG", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-smoke");
  fx::write_plane_dem(dir / "dem.tif", 100, 0.05, 50);
  sheetmill::test::write_text(dir / "x.yaml",
                              fx::exhibit_yaml(dir / "dem.tif", "ARCH D", false, 2, "  dpi: 30\n"));
  ExhibitProject p = load_exhibit_project(dir / "x.yaml");
  ExhibitReport r = render_exhibit(p, dir / "x.pdf");
  CHECK(std::filesystem::exists(dir / "x.pdf"));
  CHECK(r.relief_strips >= 1);
  ExhibitOptions o;
  o.format = ExhibitFormat::png;
  o.png_dpi = 20;
  render_exhibit(p, dir / "x.png", o);
  CHECK(std::filesystem::exists(dir / "x.png"));
}
