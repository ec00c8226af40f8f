// Phase 5, finish: the canvas to PDF, PNG or GeoTIFF, whole or not at all (render/phases.hpp).

#include "render/print_options.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/pdf/registration.hpp"
#include "sheetmill/render/phases.hpp"

namespace sheetmill::render {

void finish(pdf::LayeredCanvas& canvas, const project::Project& project, const style::Style& style,
            const MapFrame& frame, const std::filesystem::path& output,
            const RenderOptions& options) {
  const LinkPolicy links =
      options.write_through_link ? LinkPolicy::write_through : LinkPolicy::refuse;
  AtomicOutput out(output, links);
  const std::string shown = output.string();
  if (options.format == OutputFormat::png) {
    canvas.finish_png(out.temp_path(), options.raster_dpi, shown);
  } else if (options.format == OutputFormat::geotiff) {
    canvas.finish_geotiff(out.temp_path(), options.raster_dpi, pdf::registration_of(frame), shown);
  } else {
    pdf::Metadata meta;
    meta.title = project.title;
    meta.subject = project.subtitle.empty() ? "Topographic sheet" : project.subtitle;
    meta.keywords = "topographic map; contours; " + frame.crs_name;
    meta.author = project.producer;
    if (options.print_profile) {
      // PDF/X-4: Cairo's screen PDF beside the target, then converted to the output profile.
      TempFile screen(sibling_temp_path(output, "screen"), shown);
      canvas.finish_pdf(screen.path(), pdf::registration_of(frame), meta, shown);
      print::write_pdfx(screen.path(), out.temp_path(), pdfx_options(style, *options.print_profile),
                        shown);
    } else {
      canvas.finish_pdf(out.temp_path(), pdf::registration_of(frame), meta, shown);
    }
  }
  out.commit();
}

}  // namespace sheetmill::render
