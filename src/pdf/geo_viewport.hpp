#pragma once
// The ISO 32000-2 (section 12.10) geospatial viewport of the map frame, built as qpdf objects
// (private to the pdf stage).

// qpdf 11: use std::shared_ptr throughout, no PointerHolder (see qpdf/PointerHolder.hh).
#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif
#include <qpdf/QPDF.hh>
#include <qpdf/QPDFObjectHandle.hh>

#include "sheetmill/pdf/layered_canvas.hpp"

namespace sheetmill::pdf {

// A /VP array with one /Viewport whose /Measure is of /Subtype /GEO: /BBox in default user space
// (points, y up), /GPTS latitude/longitude of the frame's corners on the CRS's own geographic
// datum, /LPTS the same corners in the viewport's unit square, /Bounds the neatline in that
// square, /GCS with /EPSG and /WKT. `page_height_pt` flips page millimetres (y down) to PDF space.
QPDFObjectHandle make_viewport_array(QPDF& pdf, const GeoRegistration& geo, double page_height_pt);

}  // namespace sheetmill::pdf
