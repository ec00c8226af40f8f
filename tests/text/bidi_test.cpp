// Right-to-left and mixed-direction names: split into runs by the Unicode Bidirectional
// Algorithm (UAX #9, GNU FriBidi), each run shaped by HarfBuzz in its direction, the runs in
// visual order. Read back from the PDF by poppler (pdftotext -bbox), an outside reader: the
// logical text of each word, and the visual order of the runs from their positions.

#include <cairo-pdf.h>

#include <catch2/catch.hpp>

#include "sheetmill/core/handles.hpp"
#include "sheetmill/core/units.hpp"
#include "sheetmill/text/shaping.hpp"
#include "support/pdf_words.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

struct ReadBack {
  std::vector<std::string> text_lines;            // pdftotext, logical order, controls removed
  std::vector<std::vector<test::PdfWord>> words;  // pdftotext -bbox, by line of the page
};

// Removes the bidi controls (UAX #9 explicit formatting characters and marks) that poppler
// writes around right-to-left text, and trailing spaces.
std::string without_controls(const std::string& s) {
  static const std::vector<std::string> controls{"\u202A", "\u202B", "\u202C", "\u202D",
                                                 "\u202E", "\u2066", "\u2067", "\u2068",
                                                 "\u2069", "\u200E", "\u200F"};
  std::string out = s;
  for (const auto& c : controls)
    for (std::size_t at; (at = out.find(c)) != std::string::npos;) out.erase(at, c.size());
  while (!out.empty() && out.back() == ' ') out.pop_back();
  return out;
}

// Each name drawn on its own line of a page, 20 mm apart, then read back by poppler.
ReadBack draw_and_read(const std::vector<std::string>& names) {
  test::TempDir dir("bidi");
  const auto pdf = dir / "bidi.pdf";
  {
    text::FontCache fonts;
    CairoSurfacePtr s(cairo_pdf_surface_create(pdf.c_str(), 500, 60.0 * names.size() + 40));
    CairoPtr cr(cairo_create(s.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    for (std::size_t i = 0; i < names.size(); ++i) {
      const auto t = text::shape(fonts, {"DejaVu Sans", 400, false}, 14, names[i]);
      text::draw_text(cr.get(), t, {10, 15 + 20.0 * i}, 0, {});
    }
    cr.reset();
    cairo_surface_finish(s.get());
    REQUIRE(cairo_surface_status(s.get()) == CAIRO_STATUS_SUCCESS);
  }
  ReadBack r;
  auto txt = test::run_command({"pdftotext", pdf.string(), "-"});
  REQUIRE(txt.exit_code == 0);
  std::size_t at = 0;
  for (std::size_t nl; (nl = txt.out.find('\n', at)) != std::string::npos; at = nl + 1) {
    std::string line = without_controls(txt.out.substr(at, nl - at));
    if (!line.empty() && line != "\f") r.text_lines.push_back(line);
  }
  r.words.resize(names.size());
  for (const auto& w : test::pdf_words(pdf)) {
    const auto line = static_cast<std::size_t>((w.box_mm().centre().y - 5) / 20);
    if (line < names.size()) r.words[line].push_back(w);
  }
  return r;
}

// The box of the words on a line made only of the characters of `letters` (poppler reports
// right-to-left letters one per word).
Box box_of(const std::vector<test::PdfWord>& words, const std::string& letters) {
  Box b;
  for (const auto& w : words) {
    bool all = !w.text.empty();
    for (std::size_t i = 0; i < w.text.size() && all;) {
      std::size_t len = 1;
      const auto c = static_cast<unsigned char>(w.text[i]);
      if (c >= 0xF0)
        len = 4;
      else if (c >= 0xE0)
        len = 3;
      else if (c >= 0xC0)
        len = 2;
      all = letters.find(w.text.substr(i, len)) != std::string::npos;
      i += len;
    }
    if (all) {
      b.add({w.box_pt.min_x, w.box_pt.min_y});
      b.add({w.box_pt.max_x, w.box_pt.max_y});
    }
  }
  return b;
}

}  // namespace

TEST_CASE("right-to-left and mixed names shape, order and read back", "[text][bidi]") {
  const std::vector<std::string> names{
      // Hebrew paragraph with a Latin word and digits: visually "Zeller 12" sits left of the
      // Hebrew (UAX #9: an LTR run embedded in an RTL paragraph), digits stay left to right.
      "נחל Zeller 12",
      // Latin paragraph with two Arabic words: the Arabic run is reversed as a whole, so its
      // first logical word stands to the right of its second.
      "Wadi وادي رم",
      // Bidi controls (RLE ... PDF, LRM) and an emoji (no colour-emoji face is installed: a
      // fallback or an empty box, never an error).
      "\u202Bשלום\u202C Kalvo \u200E🏔",
      // An override: RLO forces the Latin word right to left; it must still draw.
      "\u202EAbc\u202C",
  };
  const ReadBack r = draw_and_read(names);
  REQUIRE(r.text_lines.size() >= 2);
  // Logical text, as poppler recovers it from the PDF's text (cairo's clusters).
  CHECK(r.text_lines[0] == "Zeller 12 נחל");  // poppler writes the RTL run after, in logical order
  CHECK(r.text_lines[1] == "Wadi وادي رم");

  // Visual order of the runs, from the glyph boxes.
  const Box hebrew = box_of(r.words[0], "נחל");
  const Box zeller = box_of(r.words[0], "Zeller"), twelve = box_of(r.words[0], "12");
  REQUIRE_FALSE(hebrew.empty());
  REQUIRE_FALSE(zeller.empty());
  REQUIRE_FALSE(twelve.empty());
  CHECK(zeller.max_x <= twelve.min_x + 0.5);  // "Zeller 12" reads left to right
  CHECK(twelve.max_x <= hebrew.min_x + 0.5);  // and stands left of the Hebrew
  const Box wadi = box_of(r.words[1], "Wadi");
  const Box first_ar = box_of(r.words[1], "وادي"), second_ar = box_of(r.words[1], "رم");
  REQUIRE_FALSE(wadi.empty());
  REQUIRE_FALSE(first_ar.empty());
  REQUIRE_FALSE(second_ar.empty());
  CHECK(wadi.max_x <= second_ar.min_x + 0.5);
  CHECK(second_ar.max_x <= first_ar.min_x + 0.5);

  // With controls and an emoji: the words are there, the Hebrew right of the Latin (the
  // paragraph is right to left from its first strong letter).
  const Box shalom = box_of(r.words[2], "שלום"), kalvo_l = box_of(r.words[2], "Kalvo🏔");
  REQUIRE_FALSE(shalom.empty());
  REQUIRE_FALSE(kalvo_l.empty());
  CHECK(kalvo_l.max_x <= shalom.min_x + 0.5);
  CHECK_FALSE(r.words[3].empty());
}

TEST_CASE("a right-to-left run keeps its clusters for the PDF's text", "[text][bidi]") {
  // HarfBuzz lays an RTL run's glyphs out left to right with clusters falling; the shaped text
  // must say so (the run's first glyph holds the last character), and the Arabic letters join
  // (shaped forms differ from the isolated ones: fewer or different glyphs than code points
  // would be shown isolated; here only that every glyph exists in the face).
  text::FontCache fonts;
  const auto t = text::shape(fonts, {"DejaVu Sans", 400, false}, 10, "وادي");
  REQUIRE(t.runs.size() == 1);
  const auto& g = t.runs[0].glyphs;
  REQUIRE(g.size() >= 2);
  CHECK(g.front().cluster > g.back().cluster);
  for (const auto& x : g) CHECK(x.glyph_id != 0);
  CHECK(t.width_mm > 0);
}

TEST_CASE("ill-formed UTF-8 is told apart and never reaches the PDF", "[text][utf8]") {
  // RFC 3629 section 3 and its examples: shortest forms only, no surrogates, at most U+10FFFF.
  CHECK(text::is_valid_utf8("Zeller Brook"));
  CHECK(text::is_valid_utf8("\xE2\x82\xAC"));            // U+20AC, the RFC's example
  CHECK(text::is_valid_utf8("\xEF\xBF\xBD"));            // U+FFFD itself is a character
  CHECK(text::is_valid_utf8("\xF0\x9F\x8F\x94"));        // U+1F3D4
  CHECK_FALSE(text::is_valid_utf8("\xC0\xAF"));          // overlong "/"
  CHECK_FALSE(text::is_valid_utf8("\xED\xA0\x80"));      // a surrogate, U+D800
  CHECK_FALSE(text::is_valid_utf8("\xF4\x90\x80\x80"));  // U+110000
  CHECK_FALSE(text::is_valid_utf8("\xE2\x82"));          // truncated
  CHECK_FALSE(text::is_valid_utf8("Caf\xE9"));           // Latin-1, not UTF-8
  // Shaped anyway (with U+FFFD) and drawn: cairo accepts the text, poppler reads the rest.
  test::TempDir dir("utf8");
  const auto pdf = dir / "bad.pdf";
  {
    text::FontCache fonts;
    const auto t = text::shape(fonts, {}, 12, "Caf\xE9 Kalvo");
    CHECK(text::is_valid_utf8(t.utf8));
    CairoSurfacePtr s(cairo_pdf_surface_create(pdf.c_str(), 300, 100));
    CairoPtr cr(cairo_create(s.get()));
    cairo_scale(cr.get(), kPtPerMm, kPtPerMm);
    text::draw_text(cr.get(), t, {10, 20}, 0, {});
    CHECK(cairo_status(cr.get()) == CAIRO_STATUS_SUCCESS);
    cr.reset();
    cairo_surface_finish(s.get());
  }
  auto txt = test::run_command({"pdftotext", pdf.string(), "-"});
  CHECK(txt.out.find("Kalvo") != std::string::npos);
}
