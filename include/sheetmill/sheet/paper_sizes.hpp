#pragma once
// Paper sizes by name, in millimetres, portrait (width <= height).
//
// Named sizes: ISO 216 A0..A4, ANSI A..E, ARCH A..E and E1. Custom sizes are written
// "WIDTHxHEIGHT mm" or "WIDTHxHEIGHT in" (for example "600x900mm", "24x36 in"). Names are matched
// without regard to case, spaces or hyphens ("arch-e1" = "ARCH E1"). Unknown names throw
// Error(input).

#include <string>
#include <vector>

namespace sheetmill::sheet {

struct PaperSize {
  std::string name;  // canonical name ("A1", "ANSI D", "ARCH E1", "custom")
  double width_mm = 0;
  double height_mm = 0;
};

// The named or custom size, portrait.
PaperSize paper_size(const std::string& name);

// `paper` turned to landscape (width >= height) or portrait (width <= height).
PaperSize oriented(const PaperSize& paper, bool landscape);

// The canonical names of every named size, for messages and docs.
std::vector<std::string> paper_size_names();

}  // namespace sheetmill::sheet
