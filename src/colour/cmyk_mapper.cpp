#include "sheetmill/colour/cmyk_mapper.hpp"

#include <algorithm>
#include <cmath>

namespace sheetmill::print {

namespace {
constexpr double kHalfStep = 0.5 / 255.0 + 1e-6;
unsigned key8(double r, double g, double b) {
  auto q = [](double v) {
    return static_cast<unsigned>(std::lround(std::clamp(v, 0.0, 1.0) * 255));
  };
  return (q(r) << 16) | (q(g) << 8) | q(b);
}
}  // namespace

CmykMapper::CmykMapper(const ColourEngine& engine, std::vector<ExactColour> exact)
    : engine_(engine), exact_(std::move(exact)) {}

Cmyk CmykMapper::map(double r, double g, double b) const {
  const unsigned key = key8(r, g, b);
  if (auto it = cache_.find(key); it != cache_.end()) return it->second;
  Cmyk out;
  bool found = false;
  for (const ExactColour& e : exact_) {
    const Colour& a = e.appearance;
    if (std::abs(a.r - r) <= kHalfStep && std::abs(a.g - g) <= kHalfStep &&
        std::abs(a.b - b) <= kHalfStep) {
      out = e.cmyk;
      found = true;
      break;
    }
  }
  if (!found) {
    const bool neutral = std::abs(r - g) <= kHalfStep && std::abs(g - b) <= kHalfStep;
    const double k = neutral ? engine_.k_for_grey((r + g + b) / 3) : -1;
    if (neutral && r <= kHalfStep) {
      out = Cmyk{0, 0, 0, 1};  // black type and line work: solid black ink, never rich black
    } else if (k >= 0) {
      out = Cmyk{0, 0, 0, k};
    } else {
      out = engine_.cmyk_of(Colour{r, g, b, 1});
    }
  }
  cache_.emplace(key, out);
  return out;
}

void CmykMapper::map_image(const unsigned char* rgb, unsigned char* cmyk,
                           std::size_t pixels) const {
  engine_.convert_rgb8(rgb, cmyk, pixels);
  for (std::size_t i = 0; i < pixels; ++i) {
    const unsigned char* p = rgb + 3 * i;
    if (p[0] == p[1] && p[1] == p[2]) {
      // A grey image is the relief shade: black ink at the coverage its plate has (1 - value).
      unsigned char* q = cmyk + 4 * i;
      q[0] = q[1] = q[2] = 0;
      q[3] = static_cast<unsigned char>(255 - p[0]);
    }
  }
}

}  // namespace sheetmill::print
