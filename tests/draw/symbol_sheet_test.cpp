// The field style's symbol sheet rasterised by poppler and compared with stored references
// (tests/draw/references/, recorded by scripts/make-symbol-refs), in the manner of Cairo's own
// test suite: draw once, rasterise, compare within a stated tolerance.

#include "sheetmill/draw/symbol_sheet.hpp"

#include <cairo.h>

#include <catch2/catch.hpp>
#include <cstdlib>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

// Tolerances (our choice, stated here): mean absolute difference per channel at most 1.0 of
// 255, and at most 0.2 % of pixels with any channel off by more than 40. They absorb
// antialiasing and font hinting changes between poppler builds, not a moved or recoloured
// symbol: one swatch of the sheet is about 1.5 % of its pixels.
constexpr double kMaxMeanDiff = 1.0;
constexpr double kMaxChangedFraction = 0.002;
constexpr int kChangedThreshold = 40;

struct Diff {
  double mean = 0;
  double changed_fraction = 0;
};

Diff compare_png(const std::filesystem::path& a, const std::filesystem::path& b) {
  CairoSurfacePtr sa(cairo_image_surface_create_from_png(a.c_str()));
  CairoSurfacePtr sb(cairo_image_surface_create_from_png(b.c_str()));
  REQUIRE(cairo_surface_status(sa.get()) == CAIRO_STATUS_SUCCESS);
  REQUIRE(cairo_surface_status(sb.get()) == CAIRO_STATUS_SUCCESS);
  const int w = cairo_image_surface_get_width(sa.get()),
            h = cairo_image_surface_get_height(sa.get());
  REQUIRE(w == cairo_image_surface_get_width(sb.get()));
  REQUIRE(h == cairo_image_surface_get_height(sb.get()));
  const unsigned char* da = cairo_image_surface_get_data(sa.get());
  const unsigned char* db = cairo_image_surface_get_data(sb.get());
  const int stride = cairo_image_surface_get_stride(sa.get());
  double sum = 0;
  long changed = 0;
  for (int y = 0; y < h; ++y)
    for (int x = 0; x < w; ++x) {
      int worst = 0;
      for (int c = 0; c < 3; ++c) {
        int d = std::abs(da[y * stride + 4 * x + c] - db[y * stride + 4 * x + c]);
        sum += d;
        worst = std::max(worst, d);
      }
      changed += worst > kChangedThreshold;
    }
  return {sum / (3.0 * w * h), static_cast<double>(changed) / (static_cast<double>(w) * h)};
}

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
