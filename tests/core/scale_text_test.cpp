// Scales as people write them. The forms are those printed on published sheets and in
// specifications: the representative fraction 1:N, with the thousands spaced ("1:25 000", the
// ISO 80000-1 digit grouping, thin or no-break spaces included) or not, or N alone.
#include "sheetmill/core/scale_text.hpp"

#include <catch2/catch.hpp>

#include "sheetmill/core/plural.hpp"

using sheetmill::counted;
using sheetmill::parse_scale_denominator;

TEST_CASE("a scale reads as a representative fraction or its denominator", "[core]") {
  CHECK(parse_scale_denominator("1:25000") == 25000.0);
  CHECK(parse_scale_denominator("1:25 000") == 25000.0);
  CHECK(parse_scale_denominator("1 : 25 000") == 25000.0);
  CHECK(parse_scale_denominator("25000") == 25000.0);
  CHECK(parse_scale_denominator("1:24000") == 24000.0);
  CHECK(parse_scale_denominator("1:1 000 000") == 1000000.0);
  CHECK(parse_scale_denominator("1:25\xE2\x80\x89"
                                "000") == 25000.0);  // thin space U+2009
  CHECK(parse_scale_denominator("1:25\xC2\xA0"
                                "000") == 25000.0);  // no-break space
  CHECK(parse_scale_denominator("1:2500.5") == 2500.5);
  // Not scales.
  for (const char* bad : {"", "1:", "1:0", "0", "-25000", "1:-25000", "+5", "25000m", "1:25,000",
                          "2:25000", "1:inf", "nan", "1e400", "abc"}) {
    INFO(bad);
    CHECK_FALSE(parse_scale_denominator(bad).has_value());
  }
}

TEST_CASE("counts take the noun in the right number", "[core]") {
  CHECK(counted(1, "label") == "1 label");
  CHECK(counted(0, "label") == "0 labels");
  CHECK(counted(2, "label") == "2 labels");
  CHECK(counted(1, "vertex", "vertices") == "1 vertex");
  CHECK(counted(7, "vertex", "vertices") == "7 vertices");
}
