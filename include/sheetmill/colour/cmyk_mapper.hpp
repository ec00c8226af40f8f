#pragma once
// How each sRGB colour Cairo wrote becomes the CMYK the print file carries:
//  1. a palette colour given as CMYK or as an ink tint (its sRGB appearance, within half a step
//     of 8 bits) gets its exact CMYK back, so a 100 % black stays 0/0/0/100, never rich black;
//  2. pure black is solid black ink (0/0/0/100), and a neutral grey (r = g = b) goes on the
//     black ink alone at the coverage whose print has its CIELAB lightness, where black alone
//     reaches it (type, grid and relief shading print on one plate and cannot misregister);
//  3. anything else through the output profile (ColourEngine::cmyk_of).
// Images follow rule 3 pixel by pixel, except neutral pixels: a grey image is the relief
// shade, and it goes on the black ink at coverage 1 - value, as on its plate (plate.hpp). The
// mapper refers to the engine, which must outlive it.

#include <cstddef>
#include <map>
#include <vector>

#include "sheetmill/colour/colour_engine.hpp"
#include "sheetmill/core/colour.hpp"

// The colour stage keeps the print namespace: its types (Cmyk, Intent, ColourEngine) are the
// print stage's vocabulary; the stage is separate only so that it carries no qpdf.
namespace sheetmill::print {

struct ExactColour {
  Colour appearance;  // sRGB as drawn
  Cmyk cmyk;          // what to write instead
};

class CmykMapper {
 public:
  CmykMapper(const ColourEngine& engine, std::vector<ExactColour> exact);
  Cmyk map(double r, double g, double b) const;
  void map_image(const unsigned char* rgb, unsigned char* cmyk, std::size_t pixels) const;

 private:
  const ColourEngine& engine_;
  std::vector<ExactColour> exact_;
  mutable std::map<unsigned, Cmyk> cache_;  // by 24-bit sRGB
};

}  // namespace sheetmill::print
