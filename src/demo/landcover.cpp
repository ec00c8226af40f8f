#include "sheetmill/demo/landcover.hpp"

#include <gdal_alg.h>
#include <ogr_geometry.h>
#include <ogrsf_frmts.h>

#include <algorithm>
#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/gdal_env.hpp"
#include "sheetmill/demo/noise.hpp"
#include "sheetmill/demo/settlements.hpp"

namespace sheetmill::demo {

namespace {

enum Cover : std::uint8_t { none = 0, wood = 1, orchard = 2, marsh = 3, scrub = 4 };
const char* const kCoverName[] = {"", "wood", "orchard", "marsh", "scrub"};

std::vector<std::uint8_t> classify(const Scenario& s, const FloatGrid& dem,
                                   const std::vector<char>& wet, const std::vector<Place>& places,
                                   const GridSpec& g) {
  std::vector<std::uint8_t> cover(g.size(), none);
  std::uint64_t k = s.seed * 131 + 7;
  parallel_rows(g.height, [&](int row) {
    for (int col = 0; col < g.width; ++col) {
      Point p = g.centre(col, row);
      double lake = s.lake_shape(p);
      if (lake < 0.01) continue;
      double slope = slope_at(dem, p);
      double n = fbm(k, Scenario::u_of(p.x) / 900, Scenario::v_of(p.y) / 900, 4);
      double n2 = fbm(k + 1, Scenario::u_of(p.x) / 260, Scenario::v_of(p.y) / 260, 3);
      double z = sample(dem, p);
      double floor = s.river_bed_m(p.x);
      double settled = std::numeric_limits<double>::infinity();
      for (const Place& pl : places) {
        if (pl.kind == "village" || pl.kind == "hamlet")
          settled = std::min(settled, distance(pl.at, p));
      }
      // Marsh: wet hollows, the lake's shore, and the lowest, wettest floodplain.
      bool is_wet = wet[dem.index(dem.spec.col_clamped(p.x), dem.spec.row_clamped(p.y))] != 0;
      if ((is_wet && n2 > -0.5) || (lake < 0.22 && z < s.lake_level_m + 2.5 && n2 > -0.3) ||
          (z < floor + 2.4 && n > 0.25 && n2 > 0)) {
        cover[static_cast<std::size_t>(row) * g.width + col] = marsh;
        continue;
      }
      std::uint8_t c = none;
      if (settled > 120 && settled < 650 && slope < 0.12 && n2 > 0.05 && n < 0.3) c = orchard;
      if (settled > 350 && z > floor + 6 && (slope > 0.24 || n > 0.32) && n2 > -0.45) c = wood;
      // Scrub in patches on the steepest faces (woods hold the rest) and at wood edges.
      if ((slope > 0.55 && n2 > 0.05) || (c == wood && n2 < -0.3) ||
          (c == none && slope > 0.18 && n2 > 0.35)) {
        if (settled > 250) c = scrub;
      }
      cover[static_cast<std::size_t>(row) * g.width + col] = c;
    }
  });
  // One 3 x 3 majority pass, for smoother outlines.
  std::vector<std::uint8_t> smooth = cover;
  for (int row = 1; row + 1 < g.height; ++row) {
    for (int col = 1; col + 1 < g.width; ++col) {
      int votes[5] = {0, 0, 0, 0, 0};
      for (int dr = -1; dr <= 1; ++dr)
        for (int dc = -1; dc <= 1; ++dc) ++votes[cover[(row + dr) * g.width + col + dc]];
      int best = cover[row * g.width + col];
      for (int c = 0; c < 5; ++c)
        if (votes[c] >= 5) best = c;
      smooth[row * g.width + col] = static_cast<std::uint8_t>(best);
    }
  }
  return smooth;
}

}  // namespace

std::vector<LandcoverArea> classify_landcover(const Scenario& s, const FloatGrid& dem,
                                              const std::vector<char>& wet,
                                              const std::vector<Place>& places) {
  GridSpec g;
  g.cell_m = std::max(25.0, dem.spec.cell_m);
  Box b = dem.spec.bounds();
  g.x0 = b.min_x;
  g.y_top = b.max_y;
  g.width = static_cast<int>(std::lround(b.width() / g.cell_m));
  g.height = static_cast<int>(std::lround(b.height() / g.cell_m));
  std::vector<std::uint8_t> cover = classify(s, dem, wet, places, g);

  gdal_init();
  GdalErrorScope errors;
  GDALDriver* mem = GetGDALDriverManager()->GetDriverByName("MEM");
  DatasetPtr raster(mem->Create("", g.width, g.height, 1, GDT_Byte, nullptr));
  double gt[6] = {g.x0, g.cell_m, 0, g.y_top, 0, -g.cell_m};
  raster->SetGeoTransform(gt);
  GDALRasterBand* band = raster->GetRasterBand(1);
  if (band->RasterIO(GF_Write, 0, 0, g.width, g.height, cover.data(), g.width, g.height, GDT_Byte,
                     0, 0) != CE_None) {
    throw_internal_error("landcover raster: " + errors.last_failure());
  }
  // GDAL 3.6 keeps in-memory vectors in the separate "Memory" driver.
  GDALDriver* memory = GetGDALDriverManager()->GetDriverByName("Memory");
  if (!mem || !memory) throw_internal_error("GDAL lacks the MEM or Memory driver");
  DatasetPtr vector(memory->Create("", 0, 0, 0, GDT_Unknown, nullptr));
  OGRLayer* layer = vector->CreateLayer("cover", nullptr, wkbPolygon, nullptr);
  OGRFieldDefn field("code", OFTInteger);
  layer->CreateField(&field);
  // The band is its own mask: code 0 (no cover) is left out.
  if (GDALPolygonize(band, band, layer, 0, nullptr, nullptr, nullptr) != CE_None) {
    throw_internal_error("landcover polygonize: " + errors.last_failure());
  }
  std::vector<LandcoverArea> out;
  bool geos = OGRGeometryFactory::haveGEOS();
  layer->ResetReading();
  for (auto& f : *layer) {
    int code = f->GetFieldAsInteger(0);
    if (code < 1 || code > 4) continue;
    GeometryPtr geom(f->GetGeometryRef()->clone());
    if (geos) geom.reset(geom->SimplifyPreserveTopology(g.cell_m * 0.45));
    if (!geom || wkbFlatten(geom->getGeometryType()) != wkbPolygon) continue;
    auto* poly = geom->toPolygon();
    if (poly->get_Area() < 10000) continue;
    LandcoverArea area;
    area.kind = kCoverName[code];
    for (int r = 0; r <= poly->getNumInteriorRings(); ++r) {
      const OGRLinearRing* ring = r == 0 ? poly->getExteriorRing() : poly->getInteriorRing(r - 1);
      Polyline pts;
      for (int i = 0; i + 1 < ring->getNumPoints(); ++i)
        pts.push_back({ring->getX(i), ring->getY(i)});
      if (pts.size() >= 3) area.rings.push_back(std::move(pts));
    }
    if (!area.rings.empty()) out.push_back(std::move(area));
  }
  return out;
}

}  // namespace sheetmill::demo
