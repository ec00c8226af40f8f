#pragma once
// The page a sheet is drawn on. Drawing goes into named groups (relief, contours, water, grid,
// names, ...) that become optional content groups in the PDF so a reader can switch them on and
// off. finish() closes Cairo, adds the PDF structure (geospatial registration, optional content,
// metadata) and writes the file at `path`. User space of every group is page millimetres, y down.
//
// Drawing is composed in the order it was begun (the first is at the bottom). A group begun again
// right after itself appends to its drawing; begun again after another group, it starts a new
// drawing higher up in the same optional content group, so one PDF layer (water) can hold drawings
// below and above another (water areas under the contours, water lines over them). The PDF keeps
// vectors as vectors and text as text (extractable); the raster exports rasterise the very same
// recordings, with the same blend.

#include <cairo.h>

#include <filesystem>
#include <memory>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"
#include "sheetmill/pdf/streamed_raster.hpp"

namespace sheetmill::pdf {

// Where the map frame lies on the page and on the ground, for the geospatial viewport.
struct GeoRegistration {
  Box frame_page_mm;                    // the viewport (bounding box of the neatline on the page)
  std::vector<Point> neatline_page_mm;  // the neatline on the page
  std::vector<Point> neatline_ground;   // the same corners in the sheet CRS
  std::string crs_wkt;                  // sheet CRS (WKT)
  int epsg = 0;
};

struct Metadata {
  std::string title;
  std::string subject;
  std::string keywords;
  std::string author;
  std::string producer = "sheetmill";
};

// How a drawing is composed onto what lies under it. `multiply` only darkens (ISO 32000-1
// section 11.3.5, blend mode Multiply; Cairo's CAIRO_OPERATOR_MULTIPLY in the raster exports), so
// relief drawn over area fills keeps their colours.
enum class Blend { normal, multiply };

class LayeredCanvas {
 public:
  LayeredCanvas(double page_width_mm, double page_height_mm);
  ~LayeredCanvas();
  LayeredCanvas(const LayeredCanvas&) = delete;
  LayeredCanvas& operator=(const LayeredCanvas&) = delete;

  // Starts drawing into the named group (see above for when a later call appends). The returned
  // context is valid until end_group(); it is in page millimetres. `blend` applies to this
  // drawing as a whole; appending with another blend than the drawing's starts a new drawing.
  cairo_t* begin_group(const std::string& name, Blend blend = Blend::normal);
  void end_group();
  // Adds a drawing of its own to the named group (like begin_group and end_group around it): a
  // raster rendered strip by strip only while the output is written (streamed_raster.hpp), so
  // the canvas never holds its pixels. The PDF gets one image object per strip; the raster
  // exports paint the strips a band at a time.
  void add_streamed_raster(const std::string& name, Blend blend, StreamedRaster raster);

  double width_mm() const;
  double height_mm() const;
  // The group names in the order they were first begun (each once): the PDF's layer list.
  std::vector<std::string> group_names() const;
  // Every drawing's group name, bottom to top (a name repeats when its group was interleaved).
  std::vector<std::string> drawing_order() const;

  // Writes the PDF to `path` (the caller makes it atomic): one page whose content shows each
  // group as a form XObject inside its optional content group, the map frame registered as an
  // ISO 32000-2 geospatial viewport, and the document information. Written with qpdf after
  // Cairo finishes. Throws Error on a Cairo or PDF fault. An empty `geo.crs_wkt` writes no
  // viewport.
  //
  // Every finish checks every write (a full disk throws Error(input) with "no space left on
  // device"), fsyncs, and reads the file back (the PDF opens with qpdf and has its page; the PNG
  // ends with its last chunk; the GeoTIFF opens with GDAL at its size) before returning, so the
  // caller renames only whole files. `shown_as` names the file in messages (the target the
  // user asked for, when `path` is its temporary); empty = `path`.
  void finish_pdf(const std::filesystem::path& path, const GeoRegistration& geo,
                  const Metadata& meta, const std::string& shown_as = {});
  // Rasterises every group onto a white page at `dpi` and writes a PNG.
  void finish_png(const std::filesystem::path& path, double dpi, const std::string& shown_as = {});
  // The same raster as an RGB GeoTIFF: the map frame's ground transform applied to the page
  // raster (pixel (0,0) is the page's top-left corner), CRS from `geo`. Rendered in strips, so
  // memory stays at a few rows of the page.
  void finish_geotiff(const std::filesystem::path& path, double dpi, const GeoRegistration& geo,
                      const std::string& shown_as = {});

 private:
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace sheetmill::pdf
