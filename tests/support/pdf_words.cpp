#include "support/pdf_words.hpp"

#include <regex>
#include <stdexcept>

#include "sheetmill/core/units.hpp"
#include "support/test_env.hpp"

namespace sheetmill::test {

Box PdfWord::box_mm() const {
  return Box::of(box_pt.min_x * kMmPerPt, box_pt.min_y * kMmPerPt, box_pt.max_x * kMmPerPt,
                 box_pt.max_y * kMmPerPt);
}

std::vector<PdfWord> pdf_words(const std::filesystem::path& pdf) {
  auto r = run_command({"pdftotext", "-bbox", pdf.string(), "-"});
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

}  // namespace sheetmill::test
