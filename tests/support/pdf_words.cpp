#include "support/pdf_words.hpp"

#include <algorithm>
#include <cmath>
#include <regex>
#include <stdexcept>

#include "sheetmill/core/units.hpp"
#include "support/test_env.hpp"

namespace sheetmill::test {

Box PdfWord::box_mm() const {
  return Box::of(box_pt.min_x * kMmPerPt, box_pt.min_y * kMmPerPt, box_pt.max_x * kMmPerPt,
                 box_pt.max_y * kMmPerPt);
}

std::vector<PdfWord> pdf_words(const std::filesystem::path& pdf, bool content_order) {
  std::vector<std::string> argv{"pdftotext", "-bbox"};
  if (content_order) argv.push_back("-raw");
  argv.push_back(pdf.string());
  argv.push_back("-");
  auto r = run_command(argv);
  if (r.exit_code != 0) throw std::runtime_error("pdftotext -bbox failed: " + r.err);
  static const std::regex word(
      R"re(<word xMin="([-0-9.]+)" yMin="([-0-9.]+)" xMax="([-0-9.]+)" yMax="([-0-9.]+)">([^<]*)</word>)re");
  std::vector<PdfWord> out;
  for (auto it = std::sregex_iterator(r.out.begin(), r.out.end(), word);
       it != std::sregex_iterator(); ++it) {
    const auto& m = *it;
    out.push_back({m[5].str(), Box::of(std::stod(m[1].str()), std::stod(m[2].str()),
                                       std::stod(m[3].str()), std::stod(m[4].str()))});
  }
  return out;
}

namespace {
// Distance between two boxes (0 when they touch or overlap).
double gap_between(const Box& a, const Box& b) {
  const double dx = std::max({0.0, b.min_x - a.max_x, a.min_x - b.max_x});
  const double dy = std::max({0.0, b.min_y - a.max_y, a.min_y - b.max_y});
  return std::hypot(dx, dy);
}
}  // namespace

std::vector<PdfWord> join_letters(const std::vector<PdfWord>& words, double max_gap_em) {
  std::vector<PdfWord> out;
  Box last;  // the previous piece's own box (not the joined word's)
  for (const PdfWord& w : words) {
    // A letter's size across the line is the smaller side of its box (for text at any angle
    // but the diagonals, where it is larger, which only loosens the test for real gaps).
    const double em = std::max(std::min(last.width(), last.height()),
                               std::min(w.box_pt.width(), w.box_pt.height()));
    if (!out.empty() && gap_between(last, w.box_pt) < max_gap_em * em) {
      out.back().text += w.text;
      out.back().box_pt.add(Point{w.box_pt.min_x, w.box_pt.min_y});
      out.back().box_pt.add(Point{w.box_pt.max_x, w.box_pt.max_y});
    } else {
      out.push_back(w);
    }
    last = w.box_pt;
  }
  return out;
}

}  // namespace sheetmill::test
