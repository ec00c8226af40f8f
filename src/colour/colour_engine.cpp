#include "sheetmill/colour/colour_engine.hpp"

#include <lcms2.h>

#include <algorithm>
#include <array>
#include <fstream>
#include <iterator>
#include <vector>

#include "sheetmill/core/error.hpp"
#include "sheetmill/core/handles.hpp"

namespace sheetmill::print {

namespace {

using ProfilePtr = std::unique_ptr<void, CDeleter<cmsCloseProfile>>;
using TransformPtr = std::unique_ptr<void, CDeleter<cmsDeleteTransform>>;

cmsUInt32Number lcms_intent(Intent i) {
  switch (i) {
    case Intent::perceptual:
      return INTENT_PERCEPTUAL;
    case Intent::saturation:
      return INTENT_SATURATION;
    case Intent::absolute_colorimetric:
      return INTENT_ABSOLUTE_COLORIMETRIC;
    case Intent::relative_colorimetric:
      break;
  }
  return INTENT_RELATIVE_COLORIMETRIC;
}

std::string read_bytes(const std::filesystem::path& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw_input_error(path.string(), "cannot open the ICC profile");
  return std::string(std::istreambuf_iterator<char>(in), {});
}

TransformPtr make_transform(void* from, cmsUInt32Number from_type, void* to,
                            cmsUInt32Number to_type, cmsUInt32Number intent, cmsUInt32Number flags,
                            const std::string& shown) {
  TransformPtr t(
      cmsCreateTransform(from, from_type, to, to_type, intent, flags | cmsFLAGS_NOCACHE));
  if (!t) throw_input_error(shown, "Little CMS cannot build a transform with this profile");
  return t;
}

}  // namespace

std::filesystem::path default_cmyk_profile() {
  return "/usr/share/color/icc/ghostscript/default_cmyk.icc";
}

const char* intent_name(Intent intent) {
  switch (intent) {
    case Intent::perceptual:
      return "perceptual";
    case Intent::saturation:
      return "saturation";
    case Intent::absolute_colorimetric:
      return "absolute-colorimetric";
    case Intent::relative_colorimetric:
      break;
  }
  return "relative-colorimetric";
}

struct ColourEngine::Impl {
  ColourSetup setup;
  std::string bytes;
  ProfilePtr cmyk, srgb, lab;
  TransformPtr rgb_to_cmyk, cmyk_to_rgb, rgb_to_lab, cmyk_to_lab, rgb8_to_cmyk8;
  std::array<double, 257> k_lightness{};  // L* of black ink alone at i/256
};

ColourEngine::ColourEngine(const ColourSetup& setup) : impl_(std::make_unique<Impl>()) {
  Impl& m = *impl_;
  m.setup = setup;
  if (m.setup.profile.empty()) m.setup.profile = default_cmyk_profile();
  const std::string shown = m.setup.profile.string();
  m.bytes = read_bytes(m.setup.profile);
  m.cmyk.reset(cmsOpenProfileFromMem(m.bytes.data(), static_cast<cmsUInt32Number>(m.bytes.size())));
  if (!m.cmyk) throw_input_error(shown, "not an ICC profile Little CMS can read");
  if (cmsGetColorSpace(m.cmyk.get()) != cmsSigCmykData) {
    throw_input_error(shown, "expected a CMYK output profile, got another colour space");
  }
  if (cmsGetDeviceClass(m.cmyk.get()) != cmsSigOutputClass) {
    throw_input_error(shown, "expected an output (printer) profile for the output intent");
  }
  m.srgb.reset(cmsCreate_sRGBProfile());
  m.lab.reset(cmsCreateLab4Profile(nullptr));
  const cmsUInt32Number intent = lcms_intent(m.setup.intent);
  const cmsUInt32Number bpc =
      m.setup.black_point_compensation ? cmsFLAGS_BLACKPOINTCOMPENSATION : 0;
  m.rgb_to_cmyk =
      make_transform(m.srgb.get(), TYPE_RGB_DBL, m.cmyk.get(), TYPE_CMYK_DBL, intent, bpc, shown);
  m.rgb8_to_cmyk8 =
      make_transform(m.srgb.get(), TYPE_RGB_8, m.cmyk.get(), TYPE_CMYK_8, intent, bpc, shown);
  // Appearance and measurement: relative colorimetric, paper white as the white point.
  m.cmyk_to_rgb = make_transform(m.cmyk.get(), TYPE_CMYK_DBL, m.srgb.get(), TYPE_RGB_DBL,
                                 INTENT_RELATIVE_COLORIMETRIC, 0, shown);
  m.rgb_to_lab = make_transform(m.srgb.get(), TYPE_RGB_DBL, m.lab.get(), TYPE_Lab_DBL,
                                INTENT_RELATIVE_COLORIMETRIC, 0, shown);
  m.cmyk_to_lab = make_transform(m.cmyk.get(), TYPE_CMYK_DBL, m.lab.get(), TYPE_Lab_DBL,
                                 INTENT_RELATIVE_COLORIMETRIC, 0, shown);
  for (std::size_t i = 0; i < m.k_lightness.size(); ++i) {
    m.k_lightness[i] = lab_of(Cmyk{0, 0, 0, static_cast<double>(i) / 256.0}).L;
  }
}

ColourEngine::~ColourEngine() = default;

const ColourSetup& ColourEngine::setup() const {
  return impl_->setup;
}

const std::string& ColourEngine::profile_bytes() const {
  return impl_->bytes;
}

std::string ColourEngine::description() const {
  char buf[256] = {0};
  cmsGetProfileInfoASCII(impl_->cmyk.get(), cmsInfoDescription, "en", "US", buf, sizeof buf);
  return buf;
}

Cmyk ColourEngine::cmyk_of(const Colour& c) const {
  double in[3] = {std::clamp(c.r, 0.0, 1.0), std::clamp(c.g, 0.0, 1.0), std::clamp(c.b, 0.0, 1.0)};
  double out[4] = {0, 0, 0, 0};  // Little CMS's CMYK doubles are ink percentages
  cmsDoTransform(impl_->rgb_to_cmyk.get(), in, out, 1);
  auto unit = [](double v) { return std::clamp(v / 100.0, 0.0, 1.0); };
  Cmyk k{unit(out[0]), unit(out[1]), unit(out[2]), unit(out[3])};
  const ColourSetup& s = impl_->setup;
  if (s.intent == Intent::relative_colorimetric && !s.black_point_compensation) {
    k = refine(k, lab_of(Colour{in[0], in[1], in[2], 1}));
  }
  return k;
}

// The profile's inverse table (B2A) is coarse near the gamut's edge. For the colorimetric
// intent, a few Gauss-Newton steps on three of the four inks (cyan, magenta and yellow first,
// black kept as the profile generated it; when one of those is at its limit, black stands in
// for it) bring the print's CIELAB, through the forward table (A2B), nearer the aim. A step
// is kept only when CIEDE2000 falls, so the result is never worse than the profile's own.
Cmyk ColourEngine::refine(Cmyk start, const Lab& aim) const {
  auto get = [](Cmyk& k, int i) -> double& {
    return i == 0 ? k.c : i == 1 ? k.m : i == 2 ? k.y : k.k;
  };
  Cmyk best_k = start;
  double best = ciede2000(aim, lab_of(start));
  const int sets[4][3] = {{0, 1, 2}, {0, 1, 3}, {0, 2, 3}, {1, 2, 3}};
  for (const auto& vars : sets) {
    Cmyk k = start;
    double here = ciede2000(aim, lab_of(k));
    for (int iter = 0; iter < 10 && here > 0.05; ++iter) {
      const Lab at = lab_of(k);
      double jac[3][3];  // d(L, a, b) / d(the three inks)
      for (int j = 0; j < 3; ++j) {
        Cmyk p = k;
        double& v = get(p, vars[j]);
        const double step = v + 1e-3 <= 1 ? 1e-3 : -1e-3;
        v += step;
        Lab l = lab_of(p);
        jac[0][j] = (l.L - at.L) / step;
        jac[1][j] = (l.a - at.a) / step;
        jac[2][j] = (l.b - at.b) / step;
      }
      const double r[3] = {aim.L - at.L, aim.a - at.a, aim.b - at.b};
      // Cramer's rule; a singular Jacobian ends this set.
      auto det3 = [](const double m[3][3]) {
        return m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) -
               m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) +
               m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
      };
      const double det = det3(jac);
      if (std::abs(det) < 1e-9) break;
      double d[3];
      for (int j = 0; j < 3; ++j) {
        double m[3][3];
        for (int row = 0; row < 3; ++row)
          for (int col = 0; col < 3; ++col) m[row][col] = col == j ? r[row] : jac[row][col];
        d[j] = det3(m) / det;
      }
      bool improved = false;
      for (double scale = 1; scale > 0.05 && !improved; scale /= 2) {
        Cmyk t = k;
        for (int j = 0; j < 3; ++j) {
          double& v = get(t, vars[j]);
          v = std::clamp(v + scale * d[j], 0.0, 1.0);
        }
        double e = ciede2000(aim, lab_of(t));
        if (e < here) {
          here = e;
          k = t;
          improved = true;
        }
      }
      if (!improved) break;
    }
    if (here < best) {
      best = here;
      best_k = k;
    }
  }
  return best_k;
}

Colour ColourEngine::srgb_of(const Cmyk& k) const {
  double in[4] = {k.c * 100, k.m * 100, k.y * 100, k.k * 100};
  double out[3] = {0, 0, 0};
  cmsDoTransform(impl_->cmyk_to_rgb.get(), in, out, 1);
  return {std::clamp(out[0], 0.0, 1.0), std::clamp(out[1], 0.0, 1.0), std::clamp(out[2], 0.0, 1.0),
          1};
}

Lab ColourEngine::lab_of(const Colour& c) const {
  double in[3] = {c.r, c.g, c.b};
  cmsCIELab out{};
  cmsDoTransform(impl_->rgb_to_lab.get(), in, &out, 1);
  return {out.L, out.a, out.b};
}

Lab ColourEngine::lab_of(const Cmyk& k) const {
  double in[4] = {k.c * 100, k.m * 100, k.y * 100, k.k * 100};
  cmsCIELab out{};
  cmsDoTransform(impl_->cmyk_to_lab.get(), in, &out, 1);
  return {out.L, out.a, out.b};
}

void ColourEngine::convert_rgb8(const unsigned char* rgb, unsigned char* cmyk,
                                std::size_t pixels) const {
  constexpr std::size_t kChunk = 1 << 16;
  for (std::size_t i = 0; i < pixels; i += kChunk) {
    auto n = static_cast<cmsUInt32Number>(std::min(kChunk, pixels - i));
    cmsDoTransform(impl_->rgb8_to_cmyk8.get(), rgb + 3 * i, cmyk + 4 * i, n);
  }
}

double ColourEngine::k_for_grey(double v) const {
  const double target = lab_of(Colour{v, v, v, 1}).L;
  const auto& L = impl_->k_lightness;  // falls as k rises
  if (target >= L.front()) return 0;
  if (target < L.back() - 0.5) return -1;
  for (std::size_t i = 1; i < L.size(); ++i) {
    if (L[i] <= target) {
      double t = (L[i - 1] - target) / std::max(1e-9, L[i - 1] - L[i]);
      return (static_cast<double>(i - 1) + t) / 256.0;
    }
  }
  return 1;
}

}  // namespace sheetmill::print
