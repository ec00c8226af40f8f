#include "sheetmill/sheet/sheet_crs.hpp"

#include <proj.h>

#include <cmath>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::sheet {

namespace {

ProjContextPtr quiet_context() {
  ProjContextPtr ctx(proj_context_create());
  if (!ctx) throw_internal_error("PROJ: cannot create a context");
  proj_log_level(ctx.get(), PJ_LOG_NONE);
  return ctx;
}

std::string proj_error(PJ_CONTEXT* ctx) {
  int e = proj_context_errno(ctx);
  const char* s = e ? proj_context_errno_string(ctx, e) : nullptr;
  return s ? s : "unknown PROJ error";
}

std::string text_or_empty(const char* s) {
  return s ? s : "";
}

ProjPtr crs_from(PJ_CONTEXT* ctx, const std::string& definition, const std::string& where) {
  ProjPtr crs(proj_create(ctx, definition.c_str()));
  if (!crs) {
    throw_input_error(SourceLocation{"", 0, 0, where},
                      "PROJ cannot resolve the CRS '" + definition + "' (" + proj_error(ctx) +
                          "); expected e.g. EPSG:32633, WKT, or a PROJ string");
  }
  // A bound CRS (towgs84 attached) is accepted through its source CRS.
  if (proj_get_type(crs.get()) == PJ_TYPE_BOUND_CRS) {
    crs.reset(proj_get_source_crs(ctx, crs.get()));
  }
  return crs;
}

bool is_geographic(PJ* crs) {
  auto t = proj_get_type(crs);
  return t == PJ_TYPE_GEOGRAPHIC_2D_CRS || t == PJ_TYPE_GEOGRAPHIC_3D_CRS ||
         t == PJ_TYPE_GEOGRAPHIC_CRS;
}

// A normalised (x = lon/easting) transformation from `a` to `b`.
ProjPtr transformation(PJ_CONTEXT* ctx, PJ* a, PJ* b) {
  ProjPtr op(proj_create_crs_to_crs_from_pj(ctx, a, b, nullptr, nullptr));
  if (!op) throw_internal_error("PROJ: no transformation between CRSs (" + proj_error(ctx) + ")");
  ProjPtr norm(proj_normalize_for_visualization(ctx, op.get()));
  if (!norm) throw_internal_error("PROJ: cannot normalise axis order (" + proj_error(ctx) + ")");
  return norm;
}

Point run(PJ* op, PJ_DIRECTION dir, Point p) {
  PJ_COORD c = proj_coord(p.x, p.y, 0, 0);
  PJ_COORD r = proj_trans(op, dir, c);
  if (!std::isfinite(r.xy.x) || !std::isfinite(r.xy.y) || r.xy.x == HUGE_VAL) {
    throw_internal_error(
        "PROJ could not transform a point of the sheet (outside the "
        "projection's domain?)");
  }
  return {r.xy.x, r.xy.y};
}

}  // namespace

struct SheetCrs::Impl {
  ProjContextPtr ctx;
  ProjPtr crs;
  ProjPtr to_geog;  // ground -> lon/lat
  std::string wkt2, wkt1, name, datum, projection;
  int epsg = 0;
};

SheetCrs::SheetCrs(std::unique_ptr<Impl> impl) : impl_(std::move(impl)) {}
SheetCrs::SheetCrs(SheetCrs&&) noexcept = default;
SheetCrs& SheetCrs::operator=(SheetCrs&&) noexcept = default;
SheetCrs::~SheetCrs() = default;

SheetCrs SheetCrs::resolve(const std::string& definition, const std::string& where) {
  auto impl = std::make_unique<Impl>();
  impl->ctx = quiet_context();
  PJ_CONTEXT* ctx = impl->ctx.get();
  impl->crs = crs_from(ctx, definition, where);
  if (proj_get_type(impl->crs.get()) != PJ_TYPE_PROJECTED_CRS) {
    throw_input_error(SourceLocation{"", 0, 0, where},
                      "the sheet CRS '" + definition +
                          "' is not a projected CRS (a sheet is drawn in metres east/north)");
  }
  ProjPtr geog(proj_crs_get_geodetic_crs(ctx, impl->crs.get()));
  if (!geog) throw_internal_error("PROJ: the sheet CRS has no geodetic base");
  impl->to_geog = transformation(ctx, impl->crs.get(), geog.get());

  impl->wkt2 = text_or_empty(proj_as_wkt(ctx, impl->crs.get(), PJ_WKT2_2019, nullptr));
  impl->wkt1 = text_or_empty(proj_as_wkt(ctx, impl->crs.get(), PJ_WKT1_GDAL, nullptr));
  impl->name = text_or_empty(proj_get_name(impl->crs.get()));
  ProjPtr datum(proj_crs_get_datum_forced(ctx, impl->crs.get()));
  if (datum) impl->datum = text_or_empty(proj_get_name(datum.get()));
  ProjPtr conv(proj_crs_get_coordoperation(ctx, impl->crs.get()));
  if (conv) {
    const char* method = nullptr;
    proj_coordoperation_get_method_info(ctx, conv.get(), &method, nullptr, nullptr);
    impl->projection = text_or_empty(method);
  }
  const char* auth = proj_get_id_auth_name(impl->crs.get(), 0);
  const char* code = proj_get_id_code(impl->crs.get(), 0);
  if (auth && code && std::string(auth) == "EPSG") impl->epsg = std::atoi(code);
  return SheetCrs(std::move(impl));
}

const std::string& SheetCrs::wkt2() const {
  return impl_->wkt2;
}
const std::string& SheetCrs::wkt1() const {
  return impl_->wkt1;
}
const std::string& SheetCrs::name() const {
  return impl_->name;
}
const std::string& SheetCrs::datum_name() const {
  return impl_->datum;
}
const std::string& SheetCrs::projection_name() const {
  return impl_->projection;
}
int SheetCrs::epsg() const {
  return impl_->epsg;
}

Point SheetCrs::to_lonlat(Point ground) const {
  return run(impl_->to_geog.get(), PJ_FWD, ground);
}
Point SheetCrs::to_ground(Point lonlat) const {
  return run(impl_->to_geog.get(), PJ_INV, lonlat);
}

PointFactors SheetCrs::factors_at(Point lonlat) const {
  PJ_COORD c = proj_coord(lonlat.x * kDegToRad, lonlat.y * kDegToRad, 0, 0);
  PJ_FACTORS f = proj_factors(impl_->crs.get(), c);
  if (proj_errno(impl_->crs.get())) {
    proj_errno_reset(impl_->crs.get());
    throw_internal_error("PROJ could not compute projection factors at the sheet centre");
  }
  // PROJ's meridian_convergence already has our sign: positive east of a transverse Mercator
  // central meridian in the north (checked against (lon - lon0) sin(lat) in the tests).
  return {f.meridian_convergence * kRadToDeg, f.parallel_scale};
}

struct Reprojector::Impl {
  ProjContextPtr ctx;
  ProjPtr op;
  bool src_geog = false;
  bool dst_geog = false;
};

Reprojector::Reprojector(const std::string& from, const std::string& to)
    : impl_(std::make_unique<Impl>()) {
  impl_->ctx = quiet_context();
  ProjPtr a = crs_from(impl_->ctx.get(), from, "crs");
  ProjPtr b = crs_from(impl_->ctx.get(), to, "crs");
  impl_->src_geog = is_geographic(a.get());
  impl_->dst_geog = is_geographic(b.get());
  impl_->op = transformation(impl_->ctx.get(), a.get(), b.get());
}
Reprojector::Reprojector(Reprojector&&) noexcept = default;
Reprojector::~Reprojector() = default;
Point Reprojector::forward(Point p) const {
  return run(impl_->op.get(), PJ_FWD, p);
}
Point Reprojector::inverse(Point p) const {
  return run(impl_->op.get(), PJ_INV, p);
}
bool Reprojector::target_is_geographic() const {
  return impl_->dst_geog;
}
bool Reprojector::source_is_geographic() const {
  return impl_->src_geog;
}

}  // namespace sheetmill::sheet
