// The work one feature may cause is capped before it is done (config/bounds.hpp,
// max_symbols_per_feature): the finest spacing a style may give (0.1mm) over a whole A0 sheet
// would otherwise place 10^8 pattern symbols, several gigabytes, for one area.
#include <catch2/catch.hpp>
#include <functional>

#include "sheetmill/core/error.hpp"
#include "sheetmill/draw/area.hpp"
#include "sheetmill/draw/line.hpp"

using namespace sheetmill;
using namespace sheetmill::draw;

namespace {
std::string error_of(const std::function<void()>& f) {
  try {
    f();
  } catch (const Error& e) {
    CHECK(e.exit_code() == 2);
    return e.what();
  }
  return "(no error)";
}
}  // namespace

TEST_CASE("a pattern or hatching beyond the per-feature cap is refused, not generated",
          "[draw][bounds]") {
  const Box a0 = Box::of(0, 0, 841, 1189);  // ISO 216 A0, mm
  style::PatternFill fine;
  fine.spacing_x_mm = fine.spacing_y_mm = 0.1;
  CHECK(error_of([&] { pattern_points(a0, fine); }) ==
        "an area's pattern symbols would need 1e+08, more than the 1000000 one feature may "
        "generate on a sheet; widen the pattern spacing");
  style::PatternFill usual;
  usual.spacing_x_mm = usual.spacing_y_mm = 2.5;
  // Anchor points strictly inside the box, at multiples of the spacing: x = 2.5 k with
  // 0 < x < 841 gives k = 1..336, y = 2.5 k with 0 < y < 1189 gives k = 1..475.
  CHECK(pattern_points(a0, usual).size() == 336u * 475u);
  // Hatching at 0.1mm across a box of 1e6 mm (a feature left unclipped): 1.4e7 lines.
  style::Hatch hatch;
  hatch.spacing_mm = 0.1;
  hatch.angle_deg = 45;
  CHECK(error_of([&] {
          hatch_segments(Box::of(0, 0, 1e6, 1e6), hatch);
        }).find("an area's hatching lines would need 1.41e+07, more than the 1000000") == 0);
  CHECK(hatch_segments(a0, hatch).size() > 10000u);
}
