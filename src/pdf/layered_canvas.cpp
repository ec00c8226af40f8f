#include "sheetmill/pdf/layered_canvas.hpp"

#include <cairo-pdf.h>
// qpdf 11: use std::shared_ptr throughout, no PointerHolder (see qpdf/PointerHolder.hh).
#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif
#include <algorithm>
#include <ctime>
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFExc.hh>
#include <qpdf/QPDFObjectHandle.hh>
#include <qpdf/QPDFPageDocumentHelper.hh>
#include <qpdf/QPDFPageObjectHelper.hh>
#include <qpdf/QPDFWriter.hh>
#include <system_error>

#include "pdf/geo_viewport.hpp"
#include "pdf/raster_export.hpp"
#include "pdf/streamed_raster_pdf.hpp"
#include "sheetmill/core/atomic_file.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/file_writer.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/pdf/checked_output.hpp"

namespace sheetmill::pdf {

// Each group is a Cairo recording surface in page millimetres. Replaying a recording onto the PDF
// surface keeps vectors as vectors and text as text; replaying it onto an image surface gives the
// raster export of the very same composition.
struct LayeredCanvas::Impl {
  struct Group {
    std::string name;
    Blend blend = Blend::normal;
    CairoSurfacePtr recording;                       // or null, for a streamed raster
    std::shared_ptr<const StreamedRaster> streamed;  // or null
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

double LayeredCanvas::width_mm() const {
  return impl_->width_mm;
}
double LayeredCanvas::height_mm() const {
  return impl_->height_mm;
}

std::vector<std::string> LayeredCanvas::group_names() const {
  std::vector<std::string> names;
  for (const auto& g : impl_->groups)
    if (std::find(names.begin(), names.end(), g.name) == names.end()) names.push_back(g.name);
  return names;
}

std::vector<std::string> LayeredCanvas::drawing_order() const {
  std::vector<std::string> names;
  for (const auto& g : impl_->groups) names.push_back(g.name);
  return names;
}

cairo_t* LayeredCanvas::begin_group(const std::string& name, Blend blend) {
  if (impl_->current) throw_internal_error("begin_group(" + name + ") inside another group");
  Impl::Group* group = nullptr;
  if (!impl_->groups.empty() && impl_->groups.back().name == name &&
      impl_->groups.back().blend == blend && impl_->groups.back().recording) {
    group = &impl_->groups.back();
  }
  if (!group) {
    cairo_rectangle_t extents{0, 0, impl_->width_mm, impl_->height_mm};
    impl_->groups.push_back(
        {name, blend,
         CairoSurfacePtr(cairo_recording_surface_create(CAIRO_CONTENT_COLOR_ALPHA, &extents)),
         nullptr});
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

void LayeredCanvas::add_streamed_raster(const std::string& name, Blend blend,
                                        StreamedRaster raster) {
  if (impl_->current) throw_internal_error("add_streamed_raster(" + name + ") inside a group");
  if (!raster.render) throw_internal_error("add_streamed_raster(" + name + ") without a renderer");
  impl_->groups.push_back(
      {name, blend, nullptr, std::make_shared<const StreamedRaster>(std::move(raster))});
}

namespace {

// Composes one drawing onto the raster page with its blend.
void replay(cairo_t* cr, cairo_surface_t* recording, Blend blend = Blend::normal) {
  cairo_save(cr);
  if (blend == Blend::multiply) cairo_set_operator(cr, CAIRO_OPERATOR_MULTIPLY);
  cairo_set_source_surface(cr, recording, 0, 0);
  cairo_paint(cr);
  cairo_restore(cr);
}

// The same for a streamed raster: its strips, painted a band at a time.
void replay_streamed(cairo_t* cr, const StreamedRaster& raster, Blend blend) {
  cairo_save(cr);
  if (blend == Blend::multiply) cairo_set_operator(cr, CAIRO_OPERATOR_MULTIPLY);
  paint_streamed(cr, raster);
  cairo_restore(cr);
}

// "D:YYYYMMDDHHmmSSZ", the PDF date format (ISO 32000-1 section 7.9.4), in UTC.
std::string pdf_date_now() {
  std::time_t t = std::time(nullptr);
  std::tm tm{};
  gmtime_r(&t, &tm);
  char buf[32];
  std::strftime(buf, sizeof buf, "D:%Y%m%d%H%M%SZ", &tm);
  return buf;
}

// A name usable as a PDF name token and an XObject key: letters and digits only.
std::string key_for(const std::string& prefix, std::size_t i) {
  return "/" + prefix + std::to_string(i + 1);
}

std::string shown_name(const std::filesystem::path& path, const std::string& shown_as) {
  return shown_as.empty() ? path.string() : shown_as;
}

}  // namespace

void LayeredCanvas::finish_pdf(const std::filesystem::path& path, const GeoRegistration& geo,
                               const Metadata& meta, const std::string& shown_as) {
  end_group();
  const double w_pt = impl_->width_mm * kPtPerMm, h_pt = impl_->height_mm * kPtPerMm;
  const std::string shown = shown_name(path, shown_as);

  // 1. Cairo: one page per group, so each group's fonts and images are its own resources.
  //    Written through a checked sink: Cairo's own file output does not say why a write failed.
  TempFile pages(sibling_temp_path(path, "groups"), shown);
  {
    FileWriter pages_file(pages.path(), shown);
    CairoSink sink(pages_file);
    CairoSurfacePtr surface(
        cairo_pdf_surface_create_for_stream(&CairoSink::write, &sink, w_pt, h_pt));
    check_cairo(cairo_surface_status(surface.get()), "creating the PDF");
    CairoPtr cr(cairo_create(surface.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    int tag = 0;
    for (const auto& g : impl_->groups) {
      if (g.streamed) {
        tag = paint_placeholders(cr.get(), *g.streamed, tag);
      } else {
        replay(cr.get(), g.recording.get());
      }
      cairo_show_page(cr.get());
    }
    // One more, empty page: the composed page. Reusing a group's own page would make that
    // group's form read the page's replaced contents (qpdf copies page contents lazily).
    cairo_show_page(cr.get());
    sink.rethrow_if_failed();
    check_cairo(cairo_status(cr.get()), "writing the PDF");
    cr.reset();
    cairo_surface_finish(surface.get());
    sink.rethrow_if_failed();
    check_cairo(cairo_surface_status(surface.get()), "finishing the PDF");
    pages_file.close(/*sync=*/false);  // a scratch file, read back at once
  }

  // 2. qpdf: every group page becomes a form XObject shown on the first page inside its
  //    optional content group; the other pages go.
  try {
    QPDF pdf;
    pdf.processFile(pages.path().c_str());
    // Streamed rasters: each placeholder's stream becomes its strip, rendered as it is written.
    std::vector<const StreamedRaster*> streamed;
    for (const auto& g : impl_->groups)
      if (g.streamed) streamed.push_back(g.streamed.get());
    substitute_placeholders(pdf, streamed);
    QPDFPageDocumentHelper doc(pdf);
    std::vector<QPDFPageObjectHelper> all = doc.getAllPages();
    std::size_t n = impl_->groups.size();
    if (all.size() != n + 1) throw_internal_error("PDF page count differs from the groups");

    auto xobjects = QPDFObjectHandle::newDictionary();
    auto properties = QPDFObjectHandle::newDictionary();
    auto ocgs = QPDFObjectHandle::newArray();
    const std::vector<std::string> names = group_names();  // one OCG per name
    for (std::size_t k = 0; k < names.size(); ++k) {
      auto ocg = QPDFObjectHandle::newDictionary();
      ocg.replaceKey("/Type", QPDFObjectHandle::newName("/OCG"));
      ocg.replaceKey("/Name", QPDFObjectHandle::newUnicodeString(names[k]));
      ocg = pdf.makeIndirectObject(ocg);
      ocgs.appendItem(ocg);
      properties.replaceKey(key_for("oc", k), ocg);
    }
    // Multiply as a graphics state parameter (ISO 32000-1 section 11.6.3, /BM in an ExtGState).
    auto ext_gstates = QPDFObjectHandle::newDictionary();
    auto multiply = QPDFObjectHandle::newDictionary();
    multiply.replaceKey("/Type", QPDFObjectHandle::newName("/ExtGState"));
    multiply.replaceKey("/BM", QPDFObjectHandle::newName("/Multiply"));
    bool any_multiply = false;
    std::string content;
    for (std::size_t i = 0; i < n; ++i) {
      const Impl::Group& g = impl_->groups[i];
      std::size_t k =
          static_cast<std::size_t>(std::find(names.begin(), names.end(), g.name) - names.begin());
      std::string fx = key_for("Fx", i), oc = key_for("oc", k);
      xobjects.replaceKey(fx, all[i].getFormXObjectForPage());
      // Marked content tagged /OC with the group's property name (ISO 32000-1 section 8.11.3.2).
      std::string show = "/OC " + oc + " BDC " + fx + " Do EMC";
      if (g.blend == Blend::multiply) {
        any_multiply = true;
        show = "q /GsMultiply gs " + show + " Q";
      }
      content += show + "\n";
    }
    if (any_multiply) ext_gstates.replaceKey("/GsMultiply", multiply);

    QPDFObjectHandle page = all.back().getObjectHandle();
    auto resources = QPDFObjectHandle::newDictionary();
    resources.replaceKey("/XObject", xobjects);
    resources.replaceKey("/Properties", properties);
    if (any_multiply) resources.replaceKey("/ExtGState", ext_gstates);
    page.replaceKey("/Resources", resources);
    page.replaceKey("/Contents", QPDFObjectHandle::newStream(&pdf, content));
    for (std::size_t i = 0; i < n; ++i) doc.removePage(all[i]);

    QPDFObjectHandle root = pdf.getRoot();
    if (n > 0) {
      auto d = QPDFObjectHandle::newDictionary();
      d.replaceKey("/Name", QPDFObjectHandle::newUnicodeString("Sheet layers"));
      d.replaceKey("/BaseState", QPDFObjectHandle::newName("/ON"));
      d.replaceKey("/Order", ocgs);
      d.replaceKey("/ON", ocgs);
      auto props = QPDFObjectHandle::newDictionary();
      props.replaceKey("/OCGs", ocgs);
      props.replaceKey("/D", d);
      root.replaceKey("/OCProperties", props);
      root.replaceKey("/PageMode", QPDFObjectHandle::newName("/UseOC"));
    }
    if (!geo.crs_wkt.empty()) page.replaceKey("/VP", make_viewport_array(pdf, geo, h_pt));

    auto info = QPDFObjectHandle::newDictionary();
    auto text = [&](const char* key, const std::string& v) {
      if (!v.empty()) info.replaceKey(key, QPDFObjectHandle::newUnicodeString(v));
    };
    text("/Title", meta.title);
    text("/Subject", meta.subject);
    text("/Keywords", meta.keywords);
    text("/Author", meta.author);
    text("/Creator", "sheetmill");
    text("/Producer", meta.producer);
    std::string now = pdf_date_now();
    info.replaceKey("/CreationDate", QPDFObjectHandle::newString(now));
    info.replaceKey("/ModDate", QPDFObjectHandle::newString(now));
    pdf.getTrailer().replaceKey("/Info", pdf.makeIndirectObject(info));

    FileWriter out(path, shown);
    QpdfSink sink(out);
    QPDFWriter writer(pdf);
    writer.setOutputPipeline(&sink);
    writer.setObjectStreamMode(qpdf_o_generate);
    writer.setCompressStreams(true);
    // Cairo's streams are already compressed: pass them through instead of inflating and
    // deflating the relief images again.
    writer.setDecodeLevel(qpdf_dl_none);
    writer.setMinimumPDFVersion("1.7");
    writer.write();
    sink.flush();
    out.close();
  } catch (const Error&) {
    throw;
  } catch (const std::exception& e) {
    throw_internal_error(std::string("building the layered PDF with qpdf: ") + e.what());
  }
  // The file on disk, not what we meant to write: it must open and have its one page.
  verify_pdf(path, 1, shown);
}

void LayeredCanvas::finish_png(const std::filesystem::path& path, double dpi,
                               const std::string& shown_as) {
  const std::string shown = shown_name(path, shown_as);
  end_group();
  int w = static_cast<int>(impl_->width_mm / kMmPerInch * dpi + 0.5);
  int h = static_cast<int>(impl_->height_mm / kMmPerInch * dpi + 0.5);
  CairoSurfacePtr surface(cairo_image_surface_create(CAIRO_FORMAT_RGB24, w, h));
  check_cairo(cairo_surface_status(surface.get()), "creating the image");
  CairoPtr cr(cairo_create(surface.get()));
  cairo_set_source_rgb(cr.get(), 1, 1, 1);
  cairo_paint(cr.get());
  cairo_scale(cr.get(), dpi / kMmPerInch, dpi / kMmPerInch);
  for (const auto& g : impl_->groups) {
    if (g.streamed)
      replay_streamed(cr.get(), *g.streamed, g.blend);
    else
      replay(cr.get(), g.recording.get(), g.blend);
  }
  check_cairo(cairo_status(cr.get()), "drawing the image");
  cr.reset();
  FileWriter out(path, shown);
  CairoSink sink(out);
  PngResolutionSink with_dpi(sink, dpi);
  cairo_status_t status =
      cairo_surface_write_to_png_stream(surface.get(), &PngResolutionSink::write, &with_dpi);
  sink.rethrow_if_failed();
  check_cairo(status, "writing the PNG");
  out.close();
  verify_png(path, out.bytes_written(), shown);
}

void LayeredCanvas::finish_geotiff(const std::filesystem::path& path, double dpi,
                                   const GeoRegistration& geo, const std::string& shown_as) {
  end_group();
  if (!(dpi > 0)) throw_input_error(path.string(), "the raster dpi must be positive");
  int w = static_cast<int>(impl_->width_mm / kMmPerInch * dpi + 0.5);
  int h = static_cast<int>(impl_->height_mm / kMmPerInch * dpi + 0.5);
  // The frame is a similarity page <-> ground (no rotation): the ground bounding box of the
  // neatline matches its page bounding box corner to corner.
  Box g;
  for (Point p : geo.neatline_ground) g.add(p);
  const Box& f = geo.frame_page_mm;
  if (g.empty() || f.empty()) throw_internal_error("finish_geotiff: empty map frame");
  double m_per_mm = g.width() / f.width();
  double px_mm = kMmPerInch / dpi;
  std::array<double, 6> gt{g.min_x - f.min_x * m_per_mm,
                           px_mm * m_per_mm,
                           0,
                           g.max_y + f.min_y * m_per_mm,
                           0,
                           -px_mm * m_per_mm};
  write_geotiff_strips(
      path, shown_name(path, shown_as), w, h, gt, geo.crs_wkt,
      [&](cairo_t* cr) {
        cairo_scale(cr, dpi / kMmPerInch, dpi / kMmPerInch);
        for (const auto& grp : impl_->groups) {
          if (grp.streamed)
            replay_streamed(cr, *grp.streamed, grp.blend);
          else
            replay(cr, grp.recording.get(), grp.blend);
        }
      },
      256, dpi);
}

}  // namespace sheetmill::pdf
