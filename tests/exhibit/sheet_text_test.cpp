// Text on the rendered exhibit, read back with poppler's pdftotext -bbox: type sizes follow the
// paper-size rule, and the exaggeration note appears exactly when the exaggeration is not 1.
#include <algorithm>
#include <catch2/catch.hpp>
#include <cmath>

#include "exhibit_fixture.hpp"
#include "sheetmill/exhibit/exhibit_project.hpp"
#include "sheetmill/exhibit/render_exhibit.hpp"
#include "sheetmill/exhibit/type_scale.hpp"
#include "sheetmill/text/font.hpp"
#include "support/pdf_words.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
using namespace sheetmill::exhibit;
namespace fx = sheetmill::exhibit_fixture;

namespace {

std::filesystem::path render_pdf(const sheetmill::test::TempDir& dir, const std::string& paper,
                                 bool landscape, double exaggeration, const std::string& name) {
  if (!std::filesystem::exists(dir / "dem.tif"))
    fx::write_plane_dem(dir / "dem.tif", 100, 0.05, 50);
  sheetmill::test::write_text(
      dir / (name + ".yaml"),
      fx::exhibit_yaml(dir / "dem.tif", paper, landscape, exaggeration, "  dpi: 20\n"));
  render_exhibit(load_exhibit_project(dir / (name + ".yaml")), dir / (name + ".pdf"));
  return dir / (name + ".pdf");
}

const test::PdfWord* find_word(const std::vector<test::PdfWord>& words, const std::string& text) {
  for (const auto& w : words) {
    if (w.text == text) return &w;
  }
  return nullptr;
}

bool has_phrase(const std::vector<test::PdfWord>& words, const std::vector<std::string>& phrase) {
  for (std::size_t i = 0; i + phrase.size() <= words.size(); ++i) {
    bool all = true;
    for (std::size_t k = 0; k < phrase.size() && all; ++k) all = words[i + k].text == phrase[k];
    if (all) return true;
  }
  return false;
}

}  // namespace

TEST_CASE("the type-size rule: ARCH E title at least 48 pt, body at least 18 pt", "[exhibit]") {
  // The rule stated in type_scale.hpp, checked on its own terms: the ARCH E sizes and the
  // proportionality to the diagonal (ISO 216 A0 is 841 x 1189 mm).
  TypeScale e = type_scale_for(36 * 25.4, 48 * 25.4);
  CHECK(e.factor == Approx(1.0));
  CHECK(e.title_pt >= 48);
  CHECK(e.body_pt >= 18);
  CHECK(e.fine_pt >= 18);
  TypeScale a0 = type_scale_for(841, 1189);
  CHECK(a0.body_pt == Approx(20 * std::hypot(841.0, 1189.0) / (60 * 25.4)).margin(0.005));
  TypeScale a0_land = type_scale_for(1189, 841);
  CHECK(a0_land.title_pt == Approx(a0.title_pt));
}

TEST_CASE("title and body sizes on the page follow the rule for each paper", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-type");
  // pdftotext -bbox gives each word the height (ascender + descender) x size, with the
  // ascender and descender from the embedded font; we read them from the same font file.
  text::FontCache fonts;
  const text::Font& regular = fonts.primary({"DejaVu Sans", 400, false});
  const text::Font& bold = fonts.primary({"DejaVu Sans", 700, false});
  const double k_regular = regular.ascender_em() + regular.descender_em();
  const double k_bold = bold.ascender_em() + bold.descender_em();
  struct Case {
    std::string paper;
    bool landscape;
    double w_in, h_in;
  };
  const std::vector<Case> cases = {{"ARCH E", false, 36, 48},
                                   {"ARCH D", true, 36, 24},
                                   {"A0", false, 841 / 25.4, 1189 / 25.4},
                                   {"120x60 in", true, 120, 60}};
  for (const Case& c : cases) {
    INFO(c.paper);
    auto pdf = render_pdf(dir, c.paper, c.landscape, 1, "t" + std::to_string(&c - cases.data()));
    auto words = test::pdf_words(pdf);
    TypeScale expected = type_scale_for(c.w_in * 25.4, c.h_in * 25.4);
    const test::PdfWord* title = find_word(words, "Fenwick");      // the title's first word
    const test::PdfWord* body = find_word(words, "illustration");  // the caution, body text
    REQUIRE(title);
    REQUIRE(body);
    const double title_pt = title->box_pt.height() / k_bold;
    const double body_pt = body->box_pt.height() / k_regular;
    CHECK(title_pt == Approx(expected.title_pt).epsilon(0.02));
    CHECK(body_pt == Approx(expected.body_pt).epsilon(0.02));
    if (c.paper == "ARCH E") {
      CHECK(title_pt >= 48 * 0.98);
      CHECK(body_pt >= 18 * 0.98);
    }
  }
}

TEST_CASE("the exaggeration note appears exactly when the exaggeration is not 1", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-vex");
  for (double vex : {1.0, 2.0, 1.5}) {
    INFO("exaggeration " << vex);
    auto words = test::pdf_words(render_pdf(dir, "ARCH D", false, vex, "v" + std::to_string(vex)));
    const bool shown = has_phrase(words, {"Vertical", "exaggeration"});
    CHECK(shown == (vex != 1.0));
    if (vex == 2.0) CHECK(has_phrase(words, {"Vertical", "exaggeration", "2x"}));
    if (vex == 1.5) CHECK(has_phrase(words, {"Vertical", "exaggeration", "1.5x"}));
  }
}

TEST_CASE("every exhibit carries the caution", "[exhibit]") {
  sheetmill::test::TempDir dir("exhibit-caution");
  auto words = test::pdf_words(render_pdf(dir, "ARCH D", false, 1, "c"));
  CHECK(has_phrase(words, {"not", "a", "survey."}));
  CHECK(has_phrase(words, {"licensed", "surveyor"}));
}
