#include "pdf/geo_viewport.hpp"

#include <ogr_spatialref.h>

#include <array>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::pdf {

namespace {

QPDFObjectHandle real(double v, int places = 6) {
  return QPDFObjectHandle::newReal(v, places);
}

// Ground -> longitude/latitude on the CRS's own geographic datum: the datum GDAL's PDF reader
// assumes for /GPTS when it projects them back into the /GCS.
struct ToGeographic {
  OGRSpatialReference projected;
  OGRSpatialReference geographic;
  CoordinateTransformPtr ct;
  explicit ToGeographic(const std::string& wkt) {
    if (projected.importFromWkt(wkt.c_str()) != OGRERR_NONE) {
      throw_internal_error("the sheet CRS WKT does not parse for the PDF viewport");
    }
    projected.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
    geographic.CopyGeogCSFrom(&projected);
    geographic.SetAxisMappingStrategy(OAMS_TRADITIONAL_GIS_ORDER);
    ct.reset(OGRCreateCoordinateTransformation(&projected, &geographic));
    if (!ct) throw_internal_error("no transformation from the sheet CRS to its geographic CRS");
  }
  Point lonlat(Point g) const {
    double x = g.x, y = g.y;
    if (!ct->Transform(1, &x, &y)) throw_internal_error("cannot transform a frame corner");
    return {x, y};
  }
};

}  // namespace

QPDFObjectHandle make_viewport_array(QPDF& pdf, const GeoRegistration& geo, double page_height_pt) {
  ToGeographic conv(geo.crs_wkt);
  const Box& f = geo.frame_page_mm;
  // The ground box that the page box covers: the frame is a similarity (no rotation), so the
  // two bounding boxes correspond corner to corner.
  Box g;
  for (Point p : geo.neatline_ground) g.add(p);
  if (g.empty() || f.empty()) throw_internal_error("empty map frame for the PDF viewport");

  double x0 = f.min_x * kPtPerMm, x1 = f.max_x * kPtPerMm;
  double y0 = page_height_pt - f.max_y * kPtPerMm, y1 = page_height_pt - f.min_y * kPtPerMm;

  // Corners in the unit square (0,0 = lower left of the BBox) and on the ground.
  const std::array<Point, 4> unit{Point{0, 0}, Point{0, 1}, Point{1, 1}, Point{1, 0}};
  const std::array<Point, 4> ground{Point{g.min_x, g.min_y}, Point{g.min_x, g.max_y},
                                    Point{g.max_x, g.max_y}, Point{g.max_x, g.min_y}};
  auto gpts = QPDFObjectHandle::newArray();
  auto lpts = QPDFObjectHandle::newArray();
  for (int i = 0; i < 4; ++i) {
    Point ll = conv.lonlat(ground[i]);
    // 1e-10 degree is about 0.01 mm on the ground.
    gpts.appendItem(real(ll.y, 10));
    gpts.appendItem(real(ll.x, 10));
    lpts.appendItem(real(unit[i].x, 1));
    lpts.appendItem(real(unit[i].y, 1));
  }
  auto bounds = QPDFObjectHandle::newArray();
  for (Point p : geo.neatline_page_mm) {
    bounds.appendItem(real((p.x - f.min_x) / f.width(), 6));
    bounds.appendItem(real((f.max_y - p.y) / f.height(), 6));
  }
  if (geo.neatline_page_mm.size() < 3) {
    for (Point u : unit) {
      bounds.appendItem(real(u.x, 1));
      bounds.appendItem(real(u.y, 1));
    }
  }

  auto gcs = QPDFObjectHandle::newDictionary();
  gcs.replaceKey("/Type", QPDFObjectHandle::newName("/PROJCS"));
  if (geo.epsg > 0) gcs.replaceKey("/EPSG", QPDFObjectHandle::newInteger(geo.epsg));
  gcs.replaceKey("/WKT", QPDFObjectHandle::newString(crs_wkt(conv.projected, "WKT1_GDAL")));

  auto measure = QPDFObjectHandle::newDictionary();
  measure.replaceKey("/Type", QPDFObjectHandle::newName("/Measure"));
  measure.replaceKey("/Subtype", QPDFObjectHandle::newName("/GEO"));
  measure.replaceKey("/Bounds", bounds);
  measure.replaceKey("/GPTS", gpts);
  measure.replaceKey("/LPTS", lpts);
  measure.replaceKey("/GCS", pdf.makeIndirectObject(gcs));
  auto pdu = QPDFObjectHandle::newArray();
  pdu.appendItem(QPDFObjectHandle::newName("/M"));
  pdu.appendItem(QPDFObjectHandle::newName("/SQM"));
  pdu.appendItem(QPDFObjectHandle::newName("/DEG"));
  measure.replaceKey("/PDU", pdu);

  auto bbox = QPDFObjectHandle::newArray();
  for (double v : {x0, y0, x1, y1}) bbox.appendItem(real(v, 4));
  auto vp = QPDFObjectHandle::newDictionary();
  vp.replaceKey("/Type", QPDFObjectHandle::newName("/Viewport"));
  vp.replaceKey("/BBox", bbox);
  vp.replaceKey("/Name", QPDFObjectHandle::newUnicodeString("Map frame"));
  vp.replaceKey("/Measure", pdf.makeIndirectObject(measure));
  auto array = QPDFObjectHandle::newArray();
  array.appendItem(vp);
  return array;
}

}  // namespace sheetmill::pdf
