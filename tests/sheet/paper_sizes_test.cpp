#include "sheetmill/sheet/paper_sizes.hpp"

#include <catch2/catch.hpp>

#include "sheetmill/core/error.hpp"

using sheetmill::sheet::oriented;
using sheetmill::sheet::paper_size;

// ISO 216:2007, table of A-series trimmed sizes (mm).
TEST_CASE("ISO 216 A series", "[sheet]") {
  struct Row {
    const char* name;
    double w, h;
  };
  const Row iso216[] = {
      {"A0", 841, 1189}, {"A1", 594, 841}, {"A2", 420, 594}, {"A3", 297, 420}, {"A4", 210, 297}};
  for (const auto& r : iso216) {
    auto p = paper_size(r.name);
    CHECK(p.width_mm == r.w);
    CHECK(p.height_mm == r.h);
  }
  // ISO 216's defining property: each size halves the one before (long side / 2, floored to mm).
  CHECK(paper_size("A2").width_mm == std::floor(paper_size("A1").height_mm / 2));
}

// ANSI/ASME Y14.1 sheet sizes (inches) and the architectural series ARCH A-E, E1 (inches), as
// listed in /work/shared/guides/REFERENCES.md; 1 in = 25.4 mm exactly (international inch, 1959).
TEST_CASE("ANSI and ARCH series", "[sheet]") {
  struct Row {
    const char* name;
    double w_in, h_in;
  };
  const Row table[] = {{"ANSI A", 8.5, 11}, {"ANSI B", 11, 17}, {"ANSI C", 17, 22},
                       {"ANSI D", 22, 34},  {"ANSI E", 34, 44}, {"ARCH A", 9, 12},
                       {"ARCH B", 12, 18},  {"ARCH C", 18, 24}, {"ARCH D", 24, 36},
                       {"ARCH E", 36, 48},  {"ARCH E1", 30, 42}};
  for (const auto& r : table) {
    auto p = paper_size(r.name);
    CHECK(p.width_mm == Approx(r.w_in * 25.4).epsilon(1e-12));
    CHECK(p.height_mm == Approx(r.h_in * 25.4).epsilon(1e-12));
  }
  CHECK(paper_size("arch-e1").name == "ARCH E1");
  CHECK(paper_size("ansi d").name == "ANSI D");
}

TEST_CASE("custom sizes and orientation", "[sheet]") {
  auto mm = paper_size("900x600mm");
  CHECK(mm.width_mm == 600);
  CHECK(mm.height_mm == 900);
  auto in = paper_size("24x36 in");
  CHECK(in.width_mm == Approx(609.6));
  CHECK(in.height_mm == Approx(914.4));
  auto land = oriented(paper_size("A1"), true);
  CHECK(land.width_mm == 841);
  CHECK(land.height_mm == 594);
  CHECK(oriented(land, false).width_mm == 594);
  CHECK_THROWS_AS(paper_size("B7"), sheetmill::Error);
  CHECK_THROWS_AS(paper_size("0x5mm"), sheetmill::Error);
}
