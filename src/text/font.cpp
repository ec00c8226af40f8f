#include "sheetmill/text/font.hpp"

#include <cairo-ft.h>
#include <fontconfig/fontconfig.h>
#include <ft2build.h>
#include FT_FREETYPE_H

#include <map>
#include <mutex>
#include <tuple>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"

namespace sheetmill::text {

namespace {

using FtLibrary = std::shared_ptr<FT_LibraryRec_>;

// The FT_Face behind a Cairo font face must live as long as Cairo holds the face (recording
// surfaces keep it past the FontCache), and the FT_Library as long as any of its faces: the
// holder below is Cairo user data, destroyed by Cairo with the face.
struct FtFaceHolder {
  FtLibrary library;
  FT_Face face = nullptr;
  ~FtFaceHolder() {
    if (face) FT_Done_Face(face);
  }
};

cairo_user_data_key_t g_holder_key;

class LoadedFont final : public Font {
 public:
  LoadedFont(const FtLibrary& library, const std::string& file, int index) : file_(file) {
    auto holder = std::make_unique<FtFaceHolder>();
    holder->library = library;
    if (FT_New_Face(library.get(), file.c_str(), index, &holder->face) != 0) {
      throw_internal_error("FreeType cannot open font " + file);
    }
    FT_Face face = holder->face;
    // Unhinted outlines, always. Cairo builds a halo's path (cairo_glyph_path) from FreeType's
    // outlines at the device scale of the surface it draws on, and a sheet's groups are
    // recording surfaces in millimetres: hinted there, a 7 pt glyph is grid-fitted to about
    // 2.5 "pixels" per em, which moved and squashed every halo by 0.2-0.5 mm against the glyph
    // the PDF shows from the embedded (unhinted) font. Without hinting, the halo, the fill, the
    // PDF and the raster exports all use one outline (issue #13).
    cairo_.reset(
        cairo_ft_font_face_create_for_ft_face(face, FT_LOAD_NO_HINTING | FT_LOAD_NO_BITMAP));
    check_cairo(cairo_font_face_status(cairo_.get()), "font face");
    if (cairo_font_face_set_user_data(cairo_.get(), &g_holder_key, holder.get(), [](void* p) {
          delete static_cast<FtFaceHolder*>(p);
        }) != CAIRO_STATUS_SUCCESS) {
      throw_internal_error("cairo cannot keep the font face");
    }
    holder.release();

    HbBlobPtr blob(hb_blob_create_from_file(file.c_str()));
    HbFacePtr hbface(hb_face_create(blob.get(), static_cast<unsigned>(index)));
    upem_ = static_cast<int>(hb_face_get_upem(hbface.get()));
    hb_.reset(hb_font_create(hbface.get()));
    hb_font_set_scale(hb_.get(), upem_, upem_);
    hb_font_extents_t ext{};
    hb_font_get_h_extents(hb_.get(), &ext);
    ascender_ = static_cast<double>(ext.ascender) / upem_;
    descender_ = static_cast<double>(-ext.descender) / upem_;
  }

  hb_font_t* hb() const override { return hb_.get(); }
  cairo_font_face_t* cairo_face() const override { return cairo_.get(); }
  int units_per_em() const override { return upem_; }
  bool has_glyph(char32_t cp) const override {
    hb_codepoint_t g = 0;
    return hb_font_get_nominal_glyph(hb_.get(), cp, &g) && g != 0;
  }
  const std::string& file() const override { return file_; }
  double ascender_em() const override { return ascender_; }
  double descender_em() const override { return descender_; }

 private:
  std::string file_;
  CairoFontFacePtr cairo_;
  HbFontPtr hb_;
  int upem_ = 1000;
  double ascender_ = 0.8;
  double descender_ = 0.2;
};

// fontconfig's global configuration is initialised once for the process.
FcConfig* fontconfig() {
  static std::once_flag once;
  std::call_once(once, [] { FcInit(); });
  return FcConfigGetCurrent();
}

struct FcPatternDeleter {
  void operator()(FcPattern* p) const noexcept {
    if (p) FcPatternDestroy(p);
  }
};
using FcPatternPtr = std::unique_ptr<FcPattern, FcPatternDeleter>;

FcPatternPtr make_pattern(const FontKey& key) {
  FcPatternPtr pat(FcPatternCreate());
  FcPatternAddString(pat.get(), FC_FAMILY, reinterpret_cast<const FcChar8*>(key.family.c_str()));
  FcPatternAddInteger(pat.get(), FC_WEIGHT, FcWeightFromOpenType(key.weight));
  FcPatternAddInteger(pat.get(), FC_SLANT, key.italic ? FC_SLANT_ITALIC : FC_SLANT_ROMAN);
  FcPatternAddBool(pat.get(), FC_SCALABLE, FcTrue);
  FcConfigSubstitute(fontconfig(), pat.get(), FcMatchPattern);
  FcDefaultSubstitute(pat.get());
  return pat;
}

bool file_of(FcPattern* p, std::string& file, int& index) {
  FcChar8* f = nullptr;
  if (FcPatternGetString(p, FC_FILE, 0, &f) != FcResultMatch || !f) return false;
  file = reinterpret_cast<const char*>(f);
  index = 0;
  FcPatternGetInteger(p, FC_INDEX, 0, &index);
  return true;
}

using Key = std::tuple<std::string, int, bool>;

struct FcCharSetDeleter {
  void operator()(FcCharSet* c) const noexcept {
    if (c) FcCharSetDestroy(c);
  }
};

// A fallback face not loaded yet: where it is and which characters it has.
struct Candidate {
  std::string file;
  int index = 0;
  std::unique_ptr<FcCharSet, FcCharSetDeleter> charset;
};

}  // namespace

struct FontCache::Impl {
  FtLibrary library;
  std::map<std::pair<std::string, int>, std::unique_ptr<LoadedFont>> by_file;
  std::map<Key, const Font*> primary;
  std::map<Key, std::vector<Candidate>> fallbacks;

  Impl() {
    FT_Library lib = nullptr;
    if (FT_Init_FreeType(&lib) != 0) throw_internal_error("FreeType cannot start");
    library = FtLibrary(lib, [](FT_Library l) { FT_Done_FreeType(l); });
  }

  const Font& load(const std::string& file, int index) {
    auto& slot = by_file[{file, index}];
    if (!slot) slot = std::make_unique<LoadedFont>(library, file, index);
    return *slot;
  }
};

FontCache::FontCache() : impl_(std::make_unique<Impl>()) {}
FontCache::~FontCache() = default;

const Font& FontCache::primary(const FontKey& key) {
  Key k{key.family, key.weight, key.italic};
  auto it = impl_->primary.find(k);
  if (it != impl_->primary.end()) return *it->second;
  FcPatternPtr pat = make_pattern(key);
  FcResult result;
  FcPatternPtr match(FcFontMatch(fontconfig(), pat.get(), &result));
  std::string file;
  int index = 0;
  if (!match || !file_of(match.get(), file, index)) {
    throw_input_error(key.family, "no font found for this family (is fontconfig set up?)");
  }
  FcChar8* fam = nullptr;
  if (FcPatternGetString(match.get(), FC_FAMILY, 0, &fam) == FcResultMatch && fam &&
      key.family != reinterpret_cast<const char*>(fam)) {
    log::warn("font family '{}' not installed; using '{}'", key.family,
              reinterpret_cast<const char*>(fam));
  }
  const Font& font = impl_->load(file, index);
  impl_->primary[k] = &font;
  return font;
}

const Font* FontCache::fallback_for(const FontKey& key, char32_t codepoint) {
  Key k{key.family, key.weight, key.italic};
  auto it = impl_->fallbacks.find(k);
  if (it == impl_->fallbacks.end()) {
    // fontconfig's whole sorted list, with each face's character set; sorting is done once.
    FcPatternPtr pat = make_pattern(key);
    FcResult result;
    FcFontSet* set = FcFontSort(fontconfig(), pat.get(), FcFalse, nullptr, &result);
    std::vector<Candidate> list;
    if (set) {
      for (int i = 0; i < set->nfont; ++i) {
        Candidate c;
        FcCharSet* cs = nullptr;
        if (!file_of(set->fonts[i], c.file, c.index)) continue;
        if (FcPatternGetCharSet(set->fonts[i], FC_CHARSET, 0, &cs) != FcResultMatch) continue;
        c.charset.reset(FcCharSetCopy(cs));
        list.push_back(std::move(c));
      }
      FcFontSetDestroy(set);
    }
    it = impl_->fallbacks.emplace(k, std::move(list)).first;
  }
  for (const Candidate& c : it->second) {
    if (FcCharSetHasChar(c.charset.get(), codepoint)) return &impl_->load(c.file, c.index);
  }
  return nullptr;
}

}  // namespace sheetmill::text
