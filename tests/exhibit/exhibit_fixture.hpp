#pragma once
// Synthetic inputs for the exhibit tests: analytic DEMs written with GDAL (so every elevation is
// known exactly), small GeoJSON layers, exhibit project text, and readers for the oracles the
// tests use (poppler's pdftoppm and pdftotext -bbox).

#include <filesystem>
#include <string>
#include <vector>

namespace sheetmill::exhibit_fixture {

// The ground every synthetic exhibit shows (EPSG:32632, inside the demo area's square).
inline constexpr double kE0 = 470000, kN0 = 5190000, kWidthM = 12000, kHeightM = 9000;

// A GeoTIFF plane z = z0 + slope * (E - kE0) over [kE0 - 10 km, kE0 + kWidthM + 10 km] x
// [kN0 - 10 km, kN0 + kHeightM + 10 km] at `cell_m`, Float32, EPSG:32632 (wider than any test
// frame).
void write_plane_dem(const std::filesystem::path& path, double z0, double slope, double cell_m);

// Exhibit project text for `dem` on `paper`; `extra` is appended verbatim (more top-level keys),
// `relief_extra` inside the relief section (indented by the caller with 2 spaces).
std::string exhibit_yaml(const std::filesystem::path& dem, const std::string& paper, bool landscape,
                         double exaggeration, const std::string& relief_extra = "",
                         const std::string& extra = "");

struct Rgb {
  int r = 0, g = 0, b = 0;
};

// A rasterised page from `pdftoppm -r DPI` (PPM, P6).
struct Raster {
  int width = 0, height = 0;
  std::vector<unsigned char> rgb;
  Rgb at(int x, int y) const;
};
Raster rasterise(const std::filesystem::path& pdf, double dpi, const std::filesystem::path& dir);

}  // namespace sheetmill::exhibit_fixture
