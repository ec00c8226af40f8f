#include "sheetmill/batch/batch_command.hpp"

#include <fmt/format.h>

#include <cstdio>

#include "sheetmill/batch/folder_lock.hpp"
#include "sheetmill/batch/input_digest.hpp"
#include "sheetmill/batch/json_text.hpp"
#include "sheetmill/batch/merge_pdf.hpp"
#include "sheetmill/batch/output_name.hpp"
#include "sheetmill/batch/report.hpp"
#include "sheetmill/batch/stamp.hpp"
#include "sheetmill/batch/tile_index_io.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/geomag/model.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/render/render.hpp"
#include "sheetmill/sheet/tile_index.hpp"
#include "sheetmill/style/style.hpp"
#include "sheetmill/text/font.hpp"

namespace sheetmill::batch {

namespace fs = std::filesystem;

std::string report_stem(const std::optional<Shard>& shard) {
  return shard ? fmt::format("batch-report-{}-of-{}", shard->number(), shard->count)
               : std::string("batch-report");
}

int run_batch_command(const BatchRequest& req) {
  const std::string version = SHEETMILL_VERSION;
  project::Project project = project::load_project(req.project);
  if (!project.tile_index) {
    throw_input_error(SourceLocation{project.file.string(), 0, 0, "tile_index"},
                      "a batch needs a tile_index in the project");
  }
  const project::TileIndex& ti = *project.tile_index;
  // Parsed once here: a bad style fails before any worker starts.
  style::Style style = style::load_style(project.style);

  fs::path out_dir =
      req.output_dir.empty() ? project.file.parent_path() / "sheets" : req.output_dir;
  out_dir = fs::absolute(out_dir).lexically_normal();

  TileIndexContent index = read_tile_index(ti.path, ti.layer, ti.id_field, ti.name_field);
  const std::string where = project.file.string() + ": output.file_names";
  for (SheetJob& j : index.sheets) {
    j.output = out_dir / expand_output_name(project.output.file_template, j, where);
  }
  // Every sheet of the index, not just the selected ones: all shards must agree.
  check_unique_outputs(index.sheets, ti.path);

  std::vector<SheetJob> jobs = select_sheets(index.sheets, req.selection, ti.path);
  std::optional<Shard> shard;
  if (req.shard) {
    shard = parse_shard(*req.shard, "--shard");
    jobs = shard_sheets(jobs, *shard);
  }
  log::info("batch: {} of {} sheets selected{}", jobs.size(), index.sheets.size(),
            shard ? fmt::format(" (shard {} of {})", shard->number(), shard->count) : "");

  DigestInputs digest_inputs = digest_inputs_for(project, style, index.crs_wkt, version);
  if (req.list_only) {
    InputDigester digester(digest_inputs);
    for (const SheetJob& j : jobs) {
      bool fresh = is_up_to_date(j.output, digester.digest(j).hex);
      std::printf("%s\t%s\t%s\n", display_text(j.id).c_str(), fresh ? "up-to-date" : "to-render",
                  j.output.c_str());
    }
    return 0;
  }

  {
    std::error_code ec;
    fs::create_directories(out_dir, ec);
    if (ec) throw_input_error(out_dir.string(), "cannot create the output folder: " + ec.message());
  }
  // Before any sheet: a folder the batch cannot write is found now, not in every sheet.
  check_output_target(out_dir / (report_stem(shard) + ".json"));
  FolderLock lock(out_dir, shard, req.wait_for_lock);
  WorkerSetup setup = [&project, &style, &digest_inputs] {
    // In the worker process: datasets opened here stay open for all its sheets.
    auto digester = std::make_shared<InputDigester>(digest_inputs);
    // The sheet outlines (for the layout and the diagrams) and the fonts, once per worker:
    // with a national index of thousands of sheets, reading it for every sheet made each
    // sheet slower the larger the index (bench/batch/run, variant C).
    auto index = std::make_shared<sheet::TileIndexContents>(
        sheet::read_tile_index(*project.tile_index, project.crs));
    auto fonts = std::make_shared<text::FontCache>();
    // The magnetic model likewise (a stated declination needs none).
    std::shared_ptr<const geomag::Model> model;
    if (!project.magnetic.declination_deg && project.magnetic.model_file)
      model = std::make_shared<geomag::Model>(geomag::Model::load(*project.magnetic.model_file));
    SheetTasks tasks;
    tasks.digest = [digester](const SheetJob& j) { return digester->digest(j); };
    tasks.render = [&project, &style, index, fonts, model](const SheetJob& j) {
      render::RenderOptions options;
      options.sheet_id = j.id;
      options.tile_index = index.get();
      options.fonts = fonts.get();
      options.magnetic_model = model.get();
      return render::render_sheet(project, style, j.output, options);
    };
    return tasks;
  };
  RunOptions options;
  options.workers = req.workers;
  options.force = req.force;
  options.program_version = version;
  options.progress = req.progress;
  BatchResult result = run_batch(jobs, setup, options);

  ReportContext context{project.file.string(), version, shard,
                        static_cast<int>(index.sheets.size())};
  fs::path report = out_dir / report_stem(shard);
  write_report_json(result, context, report.string() + ".json");
  write_report_csv(result, report.string() + ".csv");

  int failed = result.count(SheetStatus::failed);
  log::info(
      "batch: {} rendered, {} up to date, {} failed in {:.1f} s on {} workers; report {}.json",
      result.count(SheetStatus::rendered), result.count(SheetStatus::up_to_date), failed,
      result.seconds, result.workers, report.string());
  for (const auto& o : result.outcomes) {
    if (o.status == SheetStatus::failed) {
      log::warn("sheet {} failed: {}", display_text(o.id), display_text(o.error));
    }
  }
  if (!req.merged_pdf.empty()) {
    if (failed) {
      log::warn("batch: no merged PDF, {} sheets failed", failed);
    } else {
      fs::path merged = req.merged_pdf.is_absolute() ? req.merged_pdf : out_dir / req.merged_pdf;
      std::vector<fs::path> inputs;
      for (const auto& o : result.outcomes) inputs.push_back(o.output);
      merge_pdfs(inputs, merged);
      log::info("batch: {} sheets merged into {}", inputs.size(), merged.string());
    }
  }
  return failed ? kExitSheetsFailed : 0;
}

}  // namespace sheetmill::batch
