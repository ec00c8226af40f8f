#pragma once
// The page a sheet is drawn on. Drawing goes into named groups (relief, contours, water, grid,
// names, ...) that become optional content groups in the PDF so a reader can switch them on and
// off. finish() closes Cairo, adds the PDF structure (geospatial registration, optional content,
// metadata) and writes the file at `path`. User space of every group is page millimetres, y down.
//
// Groups are composed in the order they were first begun (the first is at the bottom). The PDF
// keeps vectors as vectors and text as text (extractable); the raster exports rasterise the very
// same recordings.

#include <cairo.h>

#include <filesystem>
#include <memory>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

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

class LayeredCanvas {
 public:
  LayeredCanvas(double page_width_mm, double page_height_mm);
  ~LayeredCanvas();
  LayeredCanvas(const LayeredCanvas&) = delete;
  LayeredCanvas& operator=(const LayeredCanvas&) = delete;

  // Starts drawing into the named group (created on first use; later calls append to it).
  // The returned context is valid until end_group(); it is in page millimetres.
  cairo_t* begin_group(const std::string& name);
  void end_group();

  double width_mm() const;
  double height_mm() const;
  // The group names in composition order.
  std::vector<std::string> group_names() const;

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
