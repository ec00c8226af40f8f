// Curved names keep their letters and word spaces: names laid along wavy and bent lines are
// written to a PDF and read back by poppler (pdftotext -bbox, an outside reader); each must come
// back as its own words, in order. Issue #13: "Zeller Brook" came back with overlapping letters
// and "S 12" as "S1 2" when glyphs were centred on a wiggling line one by one.

#include <cairo-pdf.h>

#include <catch2/catch.hpp>
#include <cmath>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/labels/names.hpp"
#include "sheetmill/text/shaping.hpp"
#include "support/pdf_words.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

style::LabelStyle line_label() {
  style::LabelStyle s;
  s.text_template = "{name}";
  s.size_pt = 8;
  s.offset_mm = 0;
  return s;
}

// A line along x from `x0` with a sine wiggle of `amplitude_mm` and wavelength `wave_mm`,
// running at `angle_deg` (clockwise on the page).
Polyline wavy(Point start, double length_mm, double amplitude_mm, double wave_mm,
              double angle_deg) {
  const double c = std::cos(angle_deg * kDegToRad), s = std::sin(angle_deg * kDegToRad);
  Polyline l;
  for (double x = 0; x <= length_mm; x += 0.5) {
    const double y = amplitude_mm * std::sin(2 * kPi * x / wave_mm);
    l.push_back({start.x + x * c - y * s, start.y + x * s + y * c});
  }
  return l;
}

// The words poppler reads from the names placed (best placement each) along `lines`.
std::vector<std::string> read_back(const std::vector<std::pair<std::string, Polyline>>& lines) {
  test::TempDir dir("curved");
  const auto pdf = dir / "names.pdf";
  {
    text::FontCache fonts;
    CairoSurfacePtr s(cairo_pdf_surface_create(pdf.c_str(), 600, 400));
    CairoPtr cr(cairo_create(s.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    for (const auto& [name, line] : lines) {
      auto cs = labels::line_names(fonts, line_label(), name, line, "water");
      INFO(name);
      REQUIRE(cs.size() == 1);
      REQUIRE_FALSE(cs[0].placements.empty());
      cs[0].placements.front().draw(cr.get());
    }
    cr.reset();
    cairo_surface_finish(s.get());
  }
  std::vector<std::string> out;
  for (const auto& w : test::join_letters(test::pdf_words(pdf, true))) out.push_back(w.text);
  return out;
}

}  // namespace

TEST_CASE("curved names read back as their words", "[labels][curved]") {
  // Wiggles shorter than a letter (the demo's streams), a gentle bend, and steeper lines.
  const auto words = read_back({
      {"Zeller Brook", wavy({10, 20}, 60, 0.6, 3, 0)},
      {"S 12", wavy({10, 50}, 40, 0.4, 2, 15)},
      {"Harrow Beck", wavy({100, 20}, 70, 3, 60, 0)},
      {"Mill Race", wavy({100, 60}, 60, 0.5, 4, -35)},
  });
  INFO("read back: " << [&] {
    std::string all;
    for (const auto& w : words) all += "[" + w + "]";
    return all;
  }());
  const std::vector<std::string> expected{"Zeller", "Brook", "S",    "12",
                                          "Harrow", "Beck",  "Mill", "Race"};
  for (const auto& e : expected) CHECK(std::count(words.begin(), words.end(), e) == 1);
  CHECK(words.size() == expected.size());
}

TEST_CASE("glyphs keep their advances along a bend", "[labels][curved]") {
  // Analytic: on a circle of radius R, consecutive glyph origins are chords of the baseline
  // whose lengths are the shaped advances (the chord-by-chord layout keeps them exactly).
  text::FontCache fonts;
  const auto t = text::shape(fonts, {}, 8, "Zeller Brook");
  Polyline arc;
  for (int i = 0; i <= 400; ++i) {
    const double a = kPi * (1.2 + 0.6 * i / 400.0);
    arc.push_back({100 + 60 * std::cos(a), 100 + 60 * std::sin(a)});
  }
  const auto placed = text::layout_on_path(t, arc, 20, 10, 0);
  REQUIRE(placed.size() == t.runs[0].glyphs.size());
  for (std::size_t i = 0; i + 1 < placed.size(); ++i) {
    const auto& g = t.runs[0].glyphs[i];
    CHECK(distance(placed[i].origin_mm, placed[i + 1].origin_mm) ==
          Approx(g.advance_mm).margin(1e-6));
  }
  // A sharp corner within the text is refused: a right angle between two straight arms (the
  // baseline rounds it over about an em, which still turns more than 20 degrees between two
  // neighbouring glyphs). A 40-degree corner, rounded the same way, reads well and is kept.
  Polyline corner{{0, 0}, {30, 0}, {30, 30}};
  CHECK(text::layout_on_path(t, corner, 30 - t.width_mm / 2, 20, 0).empty());
  CHECK_FALSE(text::layout_on_path(t, corner, 1, 20, 0).empty());  // before the corner: fine
  Polyline bend{
      {0, 0}, {30, 0}, {30 + 30 * std::cos(40 * kDegToRad), 30 * std::sin(40 * kDegToRad)}};
  CHECK_FALSE(text::layout_on_path(t, bend, 30 - t.width_mm / 2, 20, 0).empty());
}
