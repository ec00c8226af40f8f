#include "render/render_support.hpp"

#include <regex>

namespace sheetmill::test {

std::filesystem::path write_demo_project(const TempDir& dir, const std::string& extra) {
  std::string text = read_text(source_dir() / "demo_area" / "project.yaml");
  std::string area = demo_area().string() + "/";
  text = std::regex_replace(text, std::regex("generated/"), area);
  text = std::regex_replace(text, std::regex("\\.\\./styles/"),
                            (source_dir() / "styles").string() + "/");
  auto path = dir / "project.yaml";
  write_text(path, text + extra);
  return path;
}

}  // namespace sheetmill::test
