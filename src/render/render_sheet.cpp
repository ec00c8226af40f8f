// render_sheet: the five phases of render/phases.hpp in sequence, with the report's timings.

#include <chrono>

#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/render/phases.hpp"
#include "sheetmill/render/render.hpp"

namespace sheetmill::render {

namespace {

using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point t0) {
  return std::chrono::duration<double>(Clock::now() - t0).count();
}

}  // namespace

RenderReport render_sheet(const project::Project& project, const style::Style& style,
                          const std::filesystem::path& output, const RenderOptions& options) {
  const auto t_start = Clock::now();
  // Before any data is read: a missing or read-only folder, or a device at the target, is
  // found in milliseconds, not after the whole sheet.
  check_output_target(output,
                      options.write_through_link ? LinkPolicy::write_through : LinkPolicy::refuse);
  RenderReport report;
  report.output = output;
  log::WarningCollector warnings;

  const SheetInputs inputs = read_inputs(project, style, options);
  PreparedSheet sheet = prepare(inputs);
  report.layers = sheet.features.reports;
  report.seconds_features = sheet.seconds_features;
  report.seconds_contours = sheet.seconds_contours;

  auto t0 = Clock::now();
  const Placement placement = place(sheet);
  for (auto& layer : report.layers) {
    auto it = placement.counts.find(layer.layer);
    if (it == placement.counts.end()) continue;
    layer.labels_placed = it->second.placed;
    layer.labels_dropped = it->second.dropped;
  }
  report.seconds_labels = seconds_since(t0);

  pdf::LayeredCanvas canvas(sheet.layout.page_w_mm, sheet.layout.page_h_mm);
  const DrawReport drawn = draw(canvas, inputs, sheet, placement);
  if (!drawn.relief_drawn) report.warnings.push_back("no relief under the map frame");
  report.seconds_relief = drawn.seconds_relief;

  t0 = Clock::now();
  finish(canvas, project, style, sheet.layout.frame, output, options);
  // The relief strips are read, warped and shaded while the output is written.
  report.seconds_finish = seconds_since(t0) - *drawn.strip_seconds;
  report.seconds_relief += *drawn.strip_seconds;
  report.seconds_total = seconds_since(t_start);
  report.warnings.insert(report.warnings.end(), warnings.warnings().begin(),
                         warnings.warnings().end());
  return report;
}

}  // namespace sheetmill::render
