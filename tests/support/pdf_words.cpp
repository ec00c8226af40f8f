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

std::vector<std::size_t> letter_groups(const std::vector<PdfWord>& words, double max_gap_em) {
  std::vector<std::size_t> group(words.size(), 0);
  for (std::size_t i = 1; i < words.size(); ++i) {
    const Box& last = words[i - 1].box_pt;
    const Box& w = words[i].box_pt;
    // A letter's size across the line is the smaller side of its box (for text at any angle
    // but the diagonals, where it is larger, which only loosens the test for real gaps).
    const double em =
        std::max(std::min(last.width(), last.height()), std::min(w.width(), w.height()));
    group[i] = gap_between(last, w) < max_gap_em * em ? group[i - 1] : group[i - 1] + 1;
  }
  return group;
}

std::vector<PdfWord> join_letters(const std::vector<PdfWord>& words, double max_gap_em) {
  const std::vector<std::size_t> group = letter_groups(words, max_gap_em);
  std::vector<PdfWord> out;
  for (std::size_t i = 0; i < words.size(); ++i) {
    const PdfWord& w = words[i];
    if (i > 0 && group[i] == group[i - 1]) {
      out.back().text += w.text;
      out.back().box_pt.add(Point{w.box_pt.min_x, w.box_pt.min_y});
      out.back().box_pt.add(Point{w.box_pt.max_x, w.box_pt.max_y});
    } else {
      out.push_back(w);
    }
  }
  return out;
}

std::vector<std::pair<PdfWord, PdfWord>> overlapping_words(const std::vector<PdfWord>& words,
                                                           double shrink_pt) {
  const std::vector<std::size_t> group = letter_groups(words);
  std::vector<std::pair<PdfWord, PdfWord>> out;
  for (std::size_t i = 0; i < words.size(); ++i)
    for (std::size_t j = i + 1; j < words.size(); ++j) {
      if (group[i] == group[j]) continue;
      if (words[i].box_pt.expanded(-shrink_pt).intersects(words[j].box_pt.expanded(-shrink_pt)))
        out.push_back({words[i], words[j]});
    }
  return out;
}

}  // namespace sheetmill::test
