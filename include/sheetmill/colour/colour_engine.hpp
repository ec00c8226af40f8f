#pragma once
// Colour management for print output, through Little CMS 2: sRGB (IEC 61966-2-1, the colours
// Cairo draws with) to and from the CMYK of an ICC output profile, and both to CIELAB (D50,
// the ICC profile connection space) for colour differences. A ColourEngine owns its profiles
// and transforms; it is immutable once built and its conversions are const.
//
// Components are 0..1 everywhere (Cmyk 1 = 100 % ink). A profile that does not open, is not an
// output profile or is not CMYK throws Error(input) naming the file.

#include <cstddef>
#include <filesystem>
#include <memory>
#include <string>

#include "sheetmill/core/colour.hpp"

// The colour stage keeps the print namespace: its types (Cmyk, Intent, ColourEngine) are the
// print stage's vocabulary; the stage is separate only so that it carries no qpdf.
namespace sheetmill::print {

struct Cmyk {
  double c = 0, m = 0, y = 0, k = 0;
  bool operator==(const Cmyk&) const = default;
};

struct Lab {
  double L = 0, a = 0, b = 0;
};

// ICC rendering intents (ICC.1:2010 section 6.2.2).
enum class Intent { perceptual, relative_colorimetric, saturation, absolute_colorimetric };

struct ColourSetup {
  std::filesystem::path profile;  // empty: default_cmyk_profile()
  Intent intent = Intent::relative_colorimetric;
  bool black_point_compensation = true;
};

// Debian's libgs-common output profile (a generic offset CMYK), the default when the style
// and the command line name none.
std::filesystem::path default_cmyk_profile();

// "relative-colorimetric" etc.; the spellings the style file uses.
const char* intent_name(Intent intent);

double ciede2000(const Lab& a, const Lab& b);

class ColourEngine {
 public:
  explicit ColourEngine(const ColourSetup& setup = {});
  ~ColourEngine();
  ColourEngine(const ColourEngine&) = delete;
  ColourEngine& operator=(const ColourEngine&) = delete;

  const ColourSetup& setup() const;
  // The profile file's bytes (to embed as the PDF/X output intent) and its description tag.
  const std::string& profile_bytes() const;
  std::string description() const;

  // sRGB -> profile CMYK with the setup's intent (alpha ignored). For relative colorimetric
  // without black-point compensation the result is refined towards the colour's CIELAB.
  Cmyk cmyk_of(const Colour& srgb) const;
  // Profile CMYK -> sRGB (relative colorimetric, so paper white shows as white on screen).
  Colour srgb_of(const Cmyk& cmyk) const;
  // CIELAB (D50) of an sRGB colour and of a CMYK colour printed with the profile.
  Lab lab_of(const Colour& srgb) const;
  Lab lab_of(const Cmyk& cmyk) const;
  // Interleaved 8-bit RGB -> interleaved 8-bit CMYK, `pixels` of them (images).
  void convert_rgb8(const unsigned char* rgb, unsigned char* cmyk, std::size_t pixels) const;
  // The black-ink-only value whose print has the CIELAB lightness of the neutral sRGB grey `v`
  // (0..1), or a negative value when black alone cannot print that dark.
  double k_for_grey(double v) const;

 private:
  Cmyk refine(Cmyk start, const Lab& aim) const;
  struct Impl;
  std::unique_ptr<Impl> impl_;
};

// CIEDE2000 colour difference (Sharma, Wu and Dalal 2005, "The CIEDE2000 colour-difference
// formula: implementation notes, supplementary test data, and mathematical observations",
// Color Research and Application 30(1)), with kL = kC = kH = 1.
double ciede2000(const Lab& a, const Lab& b);

}  // namespace sheetmill::print
