#include "batch/demo_project.hpp"

#include <catch2/catch.hpp>

#include "support/test_env.hpp"

namespace sheetmill::test {

DemoProject make_demo_project(const std::filesystem::path& dir, const std::string& extent) {
  std::filesystem::path demo = demo_area();
  DemoProject p;
  p.index = dir / "tiles.gpkg";
  CommandResult r =
      run_sheetmill({"-q", "index", p.index.string(), "--crs", "EPSG:32632", "--scale", "25000",
                     "--frame", "80x60mm", "--snap", "500m", "--extent", extent});
  REQUIRE(r.exit_code == 0);
  p.project = dir / "project.yaml";
  write_text(p.project,
             "title: Batch test sheets\n"
             "crs: EPSG:32632\n"
             "scale: 25000\n"
             "paper:\n  size: A4\n  orientation: landscape\n"
             "extent:\n  centre: [480500, 5197600]\n"
             "style: " +
                 (source_dir() / "styles" / "field.yaml").string() + "\n" +
                 "elevation:\n  dem: " + (demo / "dem.tif").string() + "\n" +
                 "contours:\n  interval: 10m\n"
                 "vector_data: " +
                 (demo / "features.gpkg").string() + "\n" +
                 "tile_index:\n  path: " + p.index.string() +
                 "\n  layer: sheets\n  id_field: sheet_id\n  name_field: name\n"
                 "output:\n  relief_dpi: 150\n");
  return p;
}

}  // namespace sheetmill::test
