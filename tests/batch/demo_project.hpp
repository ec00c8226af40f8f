#pragma once
// A small batch project on the generated demo area: A4 sheets with 80 x 60 mm frames from our
// own `sheetmill index`, so real renders take a second or two each.

#include <filesystem>
#include <string>

namespace sheetmill::test {

struct DemoProject {
  std::filesystem::path project;  // project.yaml
  std::filesystem::path index;    // tiles.gpkg
};

// Writes project.yaml and tiles.gpkg into `dir`; `extent` is the index's area (UTM 32N).
// Returns an empty project path when the demo area cannot be generated.
DemoProject make_demo_project(const std::filesystem::path& dir,
                              const std::string& extent = "476000,5194000,484000,5197000");

}  // namespace sheetmill::test
