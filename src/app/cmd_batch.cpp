// `sheetmill batch`: render the sheets of a project's tile index (see batch/batch_command.hpp).
#include <memory>

#include "app/commands.hpp"
#include "app/option_checks.hpp"
#include "sheetmill/batch/batch_command.hpp"
#include "sheetmill/batch/option_values.hpp"
#include "sheetmill/core/error.hpp"

namespace sheetmill::app {

namespace {
struct BatchOptions {
  std::string project;
  std::string output_dir;
  int workers = 0;
  std::string sheets;
  std::string where;
  std::string bbox;
  std::string shard;
  std::string single_file;
  std::string progress = "auto";
  bool force = false;
  bool list = false;
  bool wait = false;
};
}  // namespace

void add_batch_command(CLI::App& app, Action& action, const GlobalOptions&) {
  auto opt = std::make_shared<BatchOptions>();
  CLI::App* cmd = app.add_subcommand(
      "batch", "Render every selected sheet of the project's tile index, in parallel; resumable");
  cmd->add_option("project", opt->project, "Project file")->required();
  cmd->add_option("-o,--output-dir", opt->output_dir,
                  "Folder for the sheets, stamps and report (default: sheets/ beside the project)");
  cmd->add_option("-j,--workers", opt->workers, "Worker processes (default: every usable CPU)")
      ->check(whole_number_from(0, "a number of workers"))
      ->type_name("N");
  auto* sheets = cmd->add_option("--sheets", opt->sheets, "Only these sheet IDs: ID,ID,...");
  auto* where = cmd->add_option("--where", opt->where, "Only sheets whose FIELD=VALUE");
  auto* bbox = cmd->add_option("--bbox", opt->bbox,
                               "Only sheets meeting minx,miny,maxx,maxy (tile index CRS)");
  sheets->excludes(where)->excludes(bbox);
  where->excludes(bbox);
  cmd->add_option("--shard", opt->shard,
                  "Render share K of N (0-based), or auto/N to take K from the job array index");
  cmd->add_option("--single-file", opt->single_file,
                  "Also merge the sheets, in index order, into this one multi-page PDF");
  cmd->add_option("--progress", opt->progress, "auto, bar, lines or none")
      ->check(one_of({"auto", "bar", "lines", "none"}))
      ->type_name("HOW")
      ->capture_default_str();
  cmd->add_flag("--force", opt->force, "Render even the sheets that are up to date");
  cmd->add_flag("--wait", opt->wait,
                "When another batch is writing to the output folder, wait for it to end");
  cmd->add_flag("--list", opt->list, "List the selected sheets and whether each is up to date");
  cmd->callback([opt, &action] {
    action = [opt] {
      batch::BatchRequest req;
      req.project = opt->project;
      req.output_dir = opt->output_dir;
      req.workers = opt->workers;
      req.force = opt->force;
      req.list_only = opt->list;
      req.wait_for_lock = opt->wait;
      req.merged_pdf = opt->single_file;
      if (!opt->shard.empty()) req.shard = opt->shard;
      if (!opt->sheets.empty()) req.selection.ids = batch::split_list(opt->sheets);
      if (!opt->where.empty()) {
        auto eq = opt->where.find('=');
        if (eq == std::string::npos || eq == 0) {
          throw_input_error("--where", "expected FIELD=VALUE, got \"" + opt->where + "\"");
        }
        req.selection.field = opt->where.substr(0, eq);
        req.selection.value = opt->where.substr(eq + 1);
      }
      if (!opt->bbox.empty()) req.selection.box = batch::parse_box(opt->bbox, "--bbox");
      req.progress = opt->progress == "bar"     ? batch::ProgressMode::bar
                     : opt->progress == "lines" ? batch::ProgressMode::lines
                     : opt->progress == "none"  ? batch::ProgressMode::none
                                                : batch::ProgressMode::automatic;
      return batch::run_batch_command(req);
    };
  });
}

}  // namespace sheetmill::app
