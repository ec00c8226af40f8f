#pragma once
// Move-only owners for every C handle the project touches, in the manner of HarfBuzz's
// hb::unique_ptr: one deleter per type, named in one table. A null handle is allowed and
// never destroyed. Raw pointers obtained with .get() never own.

#include <cairo.h>
#include <gdal.h>
#include <gdal_priv.h>
#include <hb.h>
#include <ogrsf_frmts.h>
#include <proj.h>

#include <memory>

namespace sheetmill {

template <auto Destroy>
struct CDeleter {
  template <class T>
  void operator()(T* p) const noexcept {
    if (p) Destroy(p);
  }
};

template <class T, auto Destroy>
using CHandle = std::unique_ptr<T, CDeleter<Destroy>>;

// GDAL (C++ API): GDAL already provides GDALDatasetUniquePtr and OGRFeatureUniquePtr.
using DatasetPtr = GDALDatasetUniquePtr;
using FeaturePtr = OGRFeatureUniquePtr;
using GeometryPtr = std::unique_ptr<OGRGeometry>;
struct OgrCoordinateTransformationDeleter {
  void operator()(OGRCoordinateTransformation* p) const noexcept {
    if (p) OGRCoordinateTransformation::DestroyCT(p);
  }
};
using CoordinateTransformPtr =
    std::unique_ptr<OGRCoordinateTransformation, OgrCoordinateTransformationDeleter>;

// Cairo.
using CairoPtr = CHandle<cairo_t, cairo_destroy>;
using CairoSurfacePtr = CHandle<cairo_surface_t, cairo_surface_destroy>;
using CairoPatternPtr = CHandle<cairo_pattern_t, cairo_pattern_destroy>;
using CairoFontFacePtr = CHandle<cairo_font_face_t, cairo_font_face_destroy>;
using CairoScaledFontPtr = CHandle<cairo_scaled_font_t, cairo_scaled_font_destroy>;
using CairoPathPtr = CHandle<cairo_path_t, cairo_path_destroy>;

// HarfBuzz.
using HbFontPtr = CHandle<hb_font_t, hb_font_destroy>;
using HbFacePtr = CHandle<hb_face_t, hb_face_destroy>;
using HbBlobPtr = CHandle<hb_blob_t, hb_blob_destroy>;
using HbBufferPtr = CHandle<hb_buffer_t, hb_buffer_destroy>;

// PROJ.
using ProjPtr = CHandle<PJ, proj_destroy>;
using ProjContextPtr = CHandle<PJ_CONTEXT, proj_context_destroy>;

// Throws Error(internal) naming `what` when a Cairo object is in an error state.
void check_cairo(cairo_status_t status, const char* what);

}  // namespace sheetmill
