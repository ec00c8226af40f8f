// `sheetmill check PROJECT|STYLE`: load and validate without rendering (render/check_project.hpp).
// A style file is told from a project file by its keys: a project names a crs and a scale.
#include <cstdio>
#include <memory>

#include "app/commands.hpp"
#include "sheetmill/config/node.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/plural.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/render/check_project.hpp"
#include "sheetmill/style/style.hpp"

namespace sheetmill::app {

namespace {
struct CheckArgs {
  std::string file;
  std::string style;
  std::string sheet;
};

int check_style_file(const std::string& path) {
  style::Style style = style::load_style(path);
  long rules = 0;
  for (const auto& l : style.layers) rules += static_cast<long>(l.rules.size());
  std::printf("style: %s\n", style.name.c_str());
  std::printf("layers: %s, %s\n",
              counted(static_cast<long long>(style.layers.size()), "layer").c_str(),
              counted(rules, "rule").c_str());
  for (const auto& l : style.layers) {
    std::printf("  %-16s source '%s', %s\n", l.id.c_str(), l.source.c_str(),
                counted(static_cast<long long>(l.rules.size()), "rule").c_str());
  }
  std::printf("the style loads; nothing rendered\n");
  return 0;
}
}  // namespace

void add_check_command(CLI::App& app, Action& action, const GlobalOptions&) {
  auto args = std::make_shared<CheckArgs>();
  CLI::App* cmd = app.add_subcommand(
      "check", "Load and validate a project (with its style and data) or a style; render nothing");
  cmd->add_option("file", args->file, "Project file or style file (YAML)")
      ->required()
      ->type_name("FILE");
  cmd->add_option("--style", args->style, "Check the project with this style file instead")
      ->type_name("FILE");
  cmd->add_option("--sheet", args->sheet, "Check this tile-index sheet instead of the extent")
      ->type_name("ID");
  cmd->callback([args, &action] {
    action = [args] {
      config::ConfigNode root = config::load_file(args->file);
      if (!root.has("crs") && !root.has("scale")) return check_style_file(args->file);
      project::Project project = project::load_project(args->file);
      style::Style style = style::load_style(
          args->style.empty() ? project.style : std::filesystem::path(args->style));
      std::optional<std::string> sheet;
      if (!args->sheet.empty()) sheet = args->sheet;
      render::ProjectCheck check = render::check_project(project, style, sheet);
      std::fputs(render::describe_check(check).c_str(), stdout);
      if (check.first_error) throw *check.first_error;
      std::printf("the project is ready to render; nothing rendered\n");
      return 0;
    };
  });
}

}  // namespace sheetmill::app
