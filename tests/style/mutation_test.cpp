// A short mutation run over the shipped files (styles/*.yaml, demo_area/*.yaml): a few hundred
// damaged copies, each loaded by its reader. Every outcome must be a value (the CLI's exit 0)
// or an input error located in the damaged file (exit 2): never a crash (the test process
// would die), never a hang (ctest's timeout), never another exception or an internal error
// (exit 1). Mutation operators are the usual ones of file-format fuzzing (common practice):
// byte flips, truncation, duplicated and deleted lines, and deep nesting. The seed is fixed,
// so the same mutants run every time.
#include <catch2/catch.hpp>
#include <random>

#include "sheetmill/core/error.hpp"
#include "sheetmill/project/project.hpp"
#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> out;
  std::size_t start = 0;
  while (start < text.size()) {
    std::size_t end = text.find('\n', start);
    if (end == std::string::npos) end = text.size();
    out.push_back(text.substr(start, end - start));
    start = end + 1;
  }
  return out;
}

std::string joined(const std::vector<std::string>& lines) {
  std::string out;
  for (const auto& l : lines) out += l + "\n";
  return out;
}

// One mutant of `text`, by operator `op` with the generator's next draws.
std::string mutate(const std::string& text, int op, std::mt19937& random) {
  auto pick = [&](std::size_t n) { return n == 0 ? 0 : static_cast<std::size_t>(random() % n); };
  std::string m = text;
  std::vector<std::string> lines = lines_of(text);
  switch (op) {
    case 0:  // flip one to four bytes to any value, NUL and high bytes included
      for (std::size_t k = 0, n = 1 + pick(4); k < n; ++k) m[pick(m.size())] = char(random());
      return m;
    case 1:  // truncate anywhere, even inside a character
      return m.substr(0, pick(m.size()));
    case 2: {  // duplicate a line (duplicate keys, repeated list items)
      std::size_t i = pick(lines.size());
      lines.insert(lines.begin() + static_cast<long>(i), lines[i]);
      return joined(lines);
    }
    case 3: {  // delete a line
      lines.erase(lines.begin() + static_cast<long>(pick(lines.size())));
      return joined(lines);
    }
    case 4: {  // nest a value 10 to 200 lists deep
      std::size_t i = pick(lines.size());
      std::size_t colon = lines[i].find(": ");
      std::size_t depth = 10 + pick(191);
      if (colon == std::string::npos) return joined(lines);
      lines[i] = lines[i].substr(0, colon + 2) + std::string(depth, '[') +
                 lines[i].substr(colon + 2) + std::string(depth, ']');
      return joined(lines);
    }
    default: {  // swap two lines (indentation and order)
      std::swap(lines[pick(lines.size())], lines[pick(lines.size())]);
      return joined(lines);
    }
  }
}

struct Outcome {
  int loaded = 0, refused = 0;
};

void run_mutants(const fs::path& original, bool is_style, int count, Outcome& outcome) {
  const std::string text = test::read_text(original);
  test::TempDir tmp("mutants");
  const fs::path path = tmp / original.filename();
  std::mt19937 random(14u + static_cast<unsigned>(text.size()));  // fixed per file
  for (int k = 0; k < count; ++k) {
    const int op = k % 6;
    test::write_text(path, mutate(text, op, random));
    INFO(original.filename().string() << " mutant " << k << " (operator " << op << ")");
    try {
      if (is_style) {
        style::load_style(path);
      } else {
        project::load_project(path);
      }
      ++outcome.loaded;
    } catch (const Error& e) {
      const std::string m = e.what();
      INFO(m);
      CHECK(e.kind() == Error::Kind::input);
      // Located: "FILE:LINE:COL: ..." or "FILE: ..." for the damaged file itself.
      CHECK(m.rfind(path.string() + ":", 0) == 0);
      CHECK(m.find('\n') == std::string::npos);
      ++outcome.refused;
    } catch (const std::exception& e) {
      FAIL("escaped as std::exception (the CLI's exit 1): " << e.what());
    }
  }
}

}  // namespace

TEST_CASE("mutants of the shipped styles and projects load or fail with a located input error",
          "[style][mutation]") {
  const fs::path root = test::source_dir();
  Outcome outcome;
  run_mutants(root / "styles" / "field.yaml", true, 90, outcome);
  run_mutants(root / "styles" / "exhibit.yaml", true, 90, outcome);
  run_mutants(root / "demo_area" / "project.yaml", false, 60, outcome);
  // The exhibit project is read by the exhibit stage; as a sheet project it is refused whole,
  // which still exercises the YAML limits on every mutant.
  run_mutants(root / "demo_area" / "exhibit.yaml", false, 60, outcome);
  CHECK(outcome.loaded + outcome.refused == 300);
  // Both outcomes occur: a run where nothing loads (or nothing fails) would prove little.
  CHECK(outcome.loaded > 10);
  CHECK(outcome.refused > 100);
}
