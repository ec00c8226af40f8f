#pragma once
// Rendering tests against stored references, in the manner of Cairo's own test suite
// (cairo/test/README): a scene is rasterised, then compared with tests/SUITE/references/NAME.png
// within a stated tolerance. With SHEETMILL_UPDATE_REFS set, the rendering is recorded as the
// new reference instead (scripts/make-text-refs); review new references by eye before committing.

#include <filesystem>
#include <string>

namespace sheetmill::test {

struct RasterDiff {
  double mean = 0;              // mean absolute difference per channel, of 255
  double changed_fraction = 0;  // pixels with any channel off by more than 40
};

// Both PNGs must have the same size (a Catch2 REQUIRE otherwise).
RasterDiff compare_png(const std::filesystem::path& a, const std::filesystem::path& b);

// Compares `png` with its reference (or records it) and CHECKs the tolerance: mean difference at
// most 1.0 of 255 and at most 0.2 % of pixels changed by more than 40 (our choice: it absorbs
// antialiasing differences between poppler builds, not a moved glyph or halo).
void check_against_reference(const std::filesystem::path& png, const std::string& suite,
                             const std::string& name);

}  // namespace sheetmill::test
