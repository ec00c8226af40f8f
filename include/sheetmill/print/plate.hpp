#pragma once
// One ink's plate as a greyscale GeoTIFF: 8 bits of ink coverage per pixel (0 = paper,
// 255 = 100 % ink; PhotometricInterpretation MinIsWhite, so viewers show ink as dark), the
// page's georeferencing and resolution tags, and in the paper margin registration marks at the
// middle of each edge and the plate's name. Made from the plate render (an RGB GeoTIFF whose
// grey value is 1 - coverage), strip by strip: memory stays at a few rows of the page.

#include <filesystem>
#include <string>

namespace sheetmill::print {

struct PlateMarks {
  std::string label;      // "Plate 2 of 5: contour_brown"
  double margin_mm = 10;  // paper edge to the collar: where the marks go
  double dpi = 300;
};

void write_plate(const std::filesystem::path& plate_render, const std::filesystem::path& out,
                 const PlateMarks& marks, const std::string& shown_as);

// The mean ink coverage of a plate file, 0..1 (for the plate report).
double mean_coverage(const std::filesystem::path& plate);

}  // namespace sheetmill::print
