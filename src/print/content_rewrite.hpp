#pragma once
// Private to the print stage: one PDF content stream rewritten for print. Every DeviceRGB
// colour operator (rg, RG, and sc/scn after a DeviceRGB cs/CS) becomes its DeviceCMYK form
// through the mapper; DeviceGray (g, G) becomes black ink. Overprint is set before each
// painting operator (ISO 32000-1 section 8.6.7, ExtGState OP/op with OPM 1): solid black
// (0/0/0/100) text and strokes overprint, everything else knocks out. A soft-mask stream
// (`mask`) becomes DeviceGray instead (its luminosity is what matters) and gets no overprint.

#include <set>
#include <string>

#include "sheetmill/colour/cmyk_mapper.hpp"

namespace sheetmill::print::detail {

struct Rewritten {
  std::string content;
  std::set<std::string> overprint_states;  // ExtGState names used: "/SmOv00" ... "/SmOv11"
  long colours_converted = 0;
};

Rewritten rewrite_content(const std::string& content, const CmykMapper& mapper, bool mask);

// The ExtGState dictionary a name from overprint_states stands for (stroke OP, fill op).
bool overprint_stroke(const std::string& name);
bool overprint_fill(const std::string& name);

}  // namespace sheetmill::print::detail
