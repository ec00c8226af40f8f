// Degenerate numbers on the command line are input errors naming the option, before any work:
// before these bounds `index --extent=-1e300,...` overflowed a lattice index, `--scale 1e308`
// said "internal error" and `{row:999999999}` padded every ID to a billion digits.
#include <catch2/catch.hpp>
#include <functional>

#include "sheetmill/batch/index_plan.hpp"
#include "sheetmill/batch/option_values.hpp"
#include "sheetmill/core/error.hpp"

using namespace sheetmill;
using namespace sheetmill::batch;

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

TEST_CASE("command-line scales, lengths and boxes are bounded", "[batch][bounds]") {
  CHECK(error_of([] { parse_scale("1e308", "--scale"); }) ==
        "--scale: expected a scale from 1:1 to 1:100 000 000 such as 1:25000, 1:25 000 or "
        "25000, got \"1e308\"");
  CHECK(parse_scale("1:100000000", "--scale") == 1e8);
  CHECK(error_of([] { parse_box("-1e300,0,1e300,1", "--extent"); }) ==
        "--extent: expected coordinates of at most 1e9 in the CRS's units, got "
        "\"-1e300,0,1e300,1\"");
  CHECK(error_of([] { parse_paper_length_mm("1e300mm", "--overlap"); }) ==
        "--overlap: expected a length on paper of at most 5080mm (200 in, the largest PDF page), "
        "got \"1e300mm\"");
  CHECK(parse_paper_length_mm("200in", "--overlap") == Approx(5080));
  CHECK(error_of([] { parse_ground_length_m("1e300km", "--snap"); }) ==
        "--snap: expected a ground length of at most 100000km, got \"1e300km\"");
}

TEST_CASE("an ID template's padding and a lattice beyond a cell number are refused",
          "[batch][bounds]") {
  IndexSpec s;
  s.crs = "EPSG:32633";
  s.scale_denominator = 25000;
  s.frame_width_mm = 400;
  s.frame_height_mm = 280;
  s.snap_m = 1000;
  s.area = Box::of(500300, 4200200, 519700, 4214900);
  s.id_template = "{row:999999999}";
  CHECK(error_of([&] { plan_tile_index(s); }) ==
        "--id-template: expected a WIDTH from 0 to 16 in {field:WIDTH}, got \"{row:999999999}\"");
  // One sheet 1e9 m east: 1e5 frames from the origin, allowed; the lattice index is in range.
  s.id_template = "{row}{col}";
  s.area = Box::of(1e9 - 5000, 0, 1e9 - 4000, 1000);
  CHECK(plan_tile_index(s).sheets.size() == 1);
  // At 1:1 with a 1 mm snap the frames are 0.4 m wide: a 10 cm area there is 2.5e9 frames out.
  s.scale_denominator = 1;
  s.snap_m = 0.001;
  s.area = Box::of(1e9 - 5000, 0, 1e9 - 4999.9, 0.1);
  CHECK(error_of([&] { plan_tile_index(s); }) ==
        "--extent: the area lies more than a billion sheets from the CRS's origin at this scale");
}
