// The field style's symbol sheet rasterised by poppler and compared with stored references
// (tests/draw/references/, recorded by scripts/make-symbol-refs), in the manner of Cairo's own
// test suite: draw once, rasterise, compare within a stated tolerance.

#include "sheetmill/draw/symbol_sheet.hpp"

#include <cairo.h>

#include <catch2/catch.hpp>
#include <cstdlib>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/style/style.hpp"
#include "support/raster_compare.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

// Tolerances (our choice, stated here): mean absolute difference per channel at most 1.0 of
// 255, and at most 0.2 % of pixels with any channel off by more than 40. They absorb
// antialiasing and font hinting changes between poppler builds, not a moved or recoloured
// symbol: one swatch of the sheet is about 1.5 % of its pixels.
constexpr double kMaxMeanDiff = 1.0;
constexpr double kMaxChangedFraction = 0.002;
// Compared by test::compare_png (tests/support/raster_compare.hpp), the suites' one diff.
using test::compare_png;
using Diff = test::RasterDiff;

}  // namespace

TEST_CASE("the field style's symbol sheet matches its reference", "[draw][symbol-sheet]") {
  test::TempDir tmp("symbols");
  const style::Style style = style::load_style(test::source_dir() / "styles" / "field.yaml");
  text::FontCache fonts;
  draw::write_symbol_sheet_pdf(tmp / "sheet.pdf", style, fonts);
  auto r = test::run_command({"pdftoppm", "-r", "100", "-png", "-singlefile",
                              (tmp / "sheet.pdf").string(), (tmp / "sheet").string()});
  REQUIRE(r.exit_code == 0);
  const auto reference = test::source_dir() / "tests" / "draw" / "references" / "field_symbols.png";
  if (std::getenv("SHEETMILL_UPDATE_REFS")) {
    std::filesystem::create_directories(reference.parent_path());
    std::filesystem::copy_file(tmp / "sheet.png", reference,
                               std::filesystem::copy_options::overwrite_existing);
    WARN("reference recorded: " << reference);
    return;
  }
  REQUIRE(std::filesystem::exists(reference));  // record with scripts/make-symbol-refs
  Diff d = compare_png(tmp / "sheet.png", reference);
  CHECK(d.mean <= kMaxMeanDiff);
  CHECK(d.changed_fraction <= kMaxChangedFraction);
}

TEST_CASE("the reference comparison notices a changed symbol", "[draw][symbol-sheet]") {
  // A control for the check above: one rule's colour changed must exceed the tolerance.
  test::TempDir tmp("symbols-control");
  const auto reference = test::source_dir() / "tests" / "draw" / "references" / "field_symbols.png";
  if (!std::filesystem::exists(reference)) {
    WARN("no reference yet");
    return;
  }
  style::Style style = style::load_style(test::source_dir() / "styles" / "field.yaml");
  bool changed = false;
  for (auto& layer : style.layers)
    for (auto& rule : layer.rules)
      if (!changed && rule.area && rule.area->fill) {
        rule.area->fill = Colour{1, 0, 1, 1};
        changed = true;
      }
  REQUIRE(changed);
  text::FontCache fonts;
  draw::write_symbol_sheet_pdf(tmp / "sheet.pdf", style, fonts);
  auto r = test::run_command({"pdftoppm", "-r", "100", "-png", "-singlefile",
                              (tmp / "sheet.pdf").string(), (tmp / "sheet").string()});
  REQUIRE(r.exit_code == 0);
  Diff d = compare_png(tmp / "sheet.png", reference);
  CHECK((d.mean > kMaxMeanDiff || d.changed_fraction > kMaxChangedFraction));
}
