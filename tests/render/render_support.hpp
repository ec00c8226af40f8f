#pragma once
// Shared by the render tests: a copy of the demo project pointing at the test build's demo area.

#include <filesystem>
#include <string>

#include "support/test_env.hpp"

namespace sheetmill::test {

// Writes DIR/project.yaml: demo_area/project.yaml with its data paths pointing at demo_area()
// and its style at the repository's styles/, plus `extra` YAML appended.
std::filesystem::path write_demo_project(const TempDir& dir, const std::string& extra = "");

}  // namespace sheetmill::test
