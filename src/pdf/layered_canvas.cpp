#include "sheetmill/pdf/layered_canvas.hpp"

#include <cairo-pdf.h>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::pdf {

// Each group is a Cairo recording surface in page millimetres. Replaying a recording onto the PDF
// surface keeps vectors as vectors and text as text; replaying it onto an image surface gives the
// raster export of the very same composition.
struct LayeredCanvas::Impl {
  struct Group {
    std::string name;
    CairoSurfacePtr recording;
  };
  double width_mm = 0;
  double height_mm = 0;
  std::vector<Group> groups;
  CairoPtr current;
};

LayeredCanvas::LayeredCanvas(double page_width_mm, double page_height_mm)
    : impl_(std::make_unique<Impl>()) {
  impl_->width_mm = page_width_mm;
  impl_->height_mm = page_height_mm;
}

LayeredCanvas::~LayeredCanvas() = default;

double LayeredCanvas::width_mm() const { return impl_->width_mm; }
double LayeredCanvas::height_mm() const { return impl_->height_mm; }

cairo_t* LayeredCanvas::begin_group(const std::string& name) {
  if (impl_->current) throw_internal_error("begin_group(" + name + ") inside another group");
  Impl::Group* group = nullptr;
  for (auto& g : impl_->groups) {
    if (g.name == name) group = &g;
  }
  if (!group) {
    cairo_rectangle_t extents{0, 0, impl_->width_mm, impl_->height_mm};
    impl_->groups.push_back(
        {name, CairoSurfacePtr(cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, &extents))});
    group = &impl_->groups.back();
  }
  impl_->current.reset(cairo_create(group->recording.get()));
  check_cairo(cairo_status(impl_->current.get()), "begin_group");
  return impl_->current.get();
}

void LayeredCanvas::end_group() {
  if (!impl_->current) return;
  check_cairo(cairo_status(impl_->current.get()), "drawing");
  impl_->current.reset();
}

namespace {
void replay(cairo_t* cr, cairo_surface_t* recording) {
  cairo_save(cr);
  cairo_set_source_surface(cr, recording, 0, 0);
  cairo_paint(cr);
  cairo_restore(cr);
}
}  // namespace

void LayeredCanvas::finish_pdf(const std::filesystem::path& path, const GeoRegistration&,
                               const Metadata& meta) {
  end_group();
  CairoSurfacePtr surface(cairo_pdf_surface_create(path.c_str(), impl_->width_mm * kPtPerMm,
                                                   impl_->height_mm * kPtPerMm));
  check_cairo(cairo_surface_status(surface.get()), "creating the PDF");
  cairo_pdf_surface_set_metadata(surface.get(), CAIRO_PDF_METADATA_TITLE, meta.title.c_str());
  cairo_pdf_surface_set_metadata(surface.get(), CAIRO_PDF_METADATA_SUBJECT, meta.subject.c_str());
  cairo_pdf_surface_set_metadata(surface.get(), CAIRO_PDF_METADATA_KEYWORDS,
                                 meta.keywords.c_str());
  cairo_pdf_surface_set_metadata(surface.get(), CAIRO_PDF_METADATA_CREATOR, meta.producer.c_str());
  CairoPtr cr(cairo_create(surface.get()));
  cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
  for (const auto& g : impl_->groups) replay(cr.get(), g.recording.get());
  check_cairo(cairo_status(cr.get()), "writing the PDF");
  cr.reset();
  cairo_surface_finish(surface.get());
  check_cairo(cairo_surface_status(surface.get()), "finishing the PDF");
}

void LayeredCanvas::finish_png(const std::filesystem::path& path, double dpi) {
  end_group();
  int w = static_cast<int>(impl_->width_mm / kMmPerInch * dpi + 0.5);
  int h = static_cast<int>(impl_->height_mm / kMmPerInch * dpi + 0.5);
  CairoSurfacePtr surface(cairo_image_surface_create(CAIRO_FORMAT_RGB24, w, h));
  check_cairo(cairo_surface_status(surface.get()), "creating the image");
  CairoPtr cr(cairo_create(surface.get()));
  cairo_set_source_rgb(cr.get(), 1, 1, 1);
  cairo_paint(cr.get());
  cairo_scale(cr.get(), dpi / kMmPerInch, dpi / kMmPerInch);
  for (const auto& g : impl_->groups) replay(cr.get(), g.recording.get());
  check_cairo(cairo_status(cr.get()), "drawing the image");
  cr.reset();
  check_cairo(cairo_surface_write_to_png(surface.get(), path.c_str()), "writing the PNG");
}

}  // namespace sheetmill::pdf
