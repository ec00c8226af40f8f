#include "support/raster_compare.hpp"

#include <cairo.h>

#include <catch2/catch.hpp>
#include <cstdlib>

#include "sheetmill/core/handles.hpp"
#include "support/test_env.hpp"

namespace sheetmill::test {

namespace {
constexpr double kMaxMeanDiff = 1.0;
constexpr double kMaxChangedFraction = 0.002;
constexpr int kChangedThreshold = 40;
}  // namespace

RasterDiff compare_png(const std::filesystem::path& a, const std::filesystem::path& b) {
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
  const int sta = cairo_image_surface_get_stride(sa.get());
  const int stb = cairo_image_surface_get_stride(sb.get());
  double sum = 0;
  long changed = 0;
  for (int y = 0; y < h; ++y)
    for (int x = 0; x < w; ++x) {
      int worst = 0;
      for (int c = 0; c < 3; ++c) {
        int d = std::abs(da[y * sta + 4 * x + c] - db[y * stb + 4 * x + c]);
        sum += d;
        worst = std::max(worst, d);
      }
      changed += worst > kChangedThreshold;
    }
  return {sum / (3.0 * w * h), static_cast<double>(changed) / (static_cast<double>(w) * h)};
}

void check_against_reference(const std::filesystem::path& png, const std::string& suite,
                             const std::string& name) {
  const auto reference = source_dir() / "tests" / suite / "references" / (name + ".png");
  if (std::getenv("SHEETMILL_UPDATE_REFS")) {
    std::filesystem::create_directories(reference.parent_path());
    std::filesystem::copy_file(png, reference, std::filesystem::copy_options::overwrite_existing);
    WARN("reference recorded: " << reference);
    return;
  }
  INFO("reference " << reference << " (record with scripts/make-text-refs)");
  REQUIRE(std::filesystem::exists(reference));
  const RasterDiff d = compare_png(png, reference);
  CHECK(d.mean <= kMaxMeanDiff);
  CHECK(d.changed_fraction <= kMaxChangedFraction);
}

}  // namespace sheetmill::test
