#include "sheetmill/exhibit/type_scale.hpp"

#include <algorithm>
#include <cmath>

namespace sheetmill::exhibit {

TypeScale type_scale_for(double paper_w_mm, double paper_h_mm) {
  // The rule and its reasoning are in the header and in docs/exhibit.md (common practice:
  // viewing distance grows with the sheet's diagonal, legible size with viewing distance).
  TypeScale t;
  t.factor = std::hypot(paper_w_mm, paper_h_mm) / kArchEDiagonalMm;
  // Rounded to 0.01 pt so that ARCH E gets its sizes exactly (its diagonal in mm is inexact).
  auto sized = [&](double arch_e_pt) {
    return std::max(6.0, std::round(arch_e_pt * t.factor * 100) / 100);
  };
  t.title_pt = sized(64);
  t.subtitle_pt = sized(40);
  t.heading_pt = sized(28);
  t.body_pt = sized(20);
  t.fine_pt = sized(18);
  return t;
}

}  // namespace sheetmill::exhibit
