#pragma once
// Type sizes for viewing across a room, by paper size.
//
// Rule (common practice for wall exhibits and posters, our calibration): viewers stand back
// roughly in proportion to the sheet's diagonal so the whole sheet fills their view, and the
// legible size of type grows linearly with viewing distance. Sizes are therefore fixed on ARCH E
// (36 x 48 in, diagonal 60 in) and scaled with the paper's diagonal:
//   title 64 pt, subtitle 40 pt, heading 28 pt, body 20 pt, fine print 18 pt on ARCH E,
// so on ARCH E the title is at least 48 pt and body text at least 18 pt. No size is set below
// 6 pt, whatever the paper; sizes are rounded to 0.01 pt.

namespace sheetmill::exhibit {

struct TypeScale {
  double factor = 1;  // paper diagonal / ARCH E diagonal
  double title_pt = 64;
  double subtitle_pt = 40;
  double heading_pt = 28;
  double body_pt = 20;
  double fine_pt = 18;
};

inline constexpr double kArchEDiagonalMm = 60.0 * 25.4;

TypeScale type_scale_for(double paper_w_mm, double paper_h_mm);

}  // namespace sheetmill::exhibit
