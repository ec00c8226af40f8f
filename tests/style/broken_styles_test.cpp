// The corpus of broken style files (tests/style/broken/*.yaml): each must fail to load with
// exactly the message recorded in tests/style/broken/expected.txt ("FILE<TAB>MESSAGE", the
// message with the folder left out). To re-record after a deliberate change of wording, run
//   SHEETMILL_RECORD_BROKEN=1 build/test_style "[broken]"
// and review the diff of expected.txt line by line: the review is the test.
#include <catch2/catch.hpp>
#include <cstdlib>
#include <fstream>
#include <map>
#include <set>

#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

fs::path corpus_dir() {
  return test::source_dir() / "tests" / "style" / "broken";
}

// The message load_style() throws for `file`, with the corpus folder removed from it.
std::string failure_of(const fs::path& file) {
  try {
    style::load_style(file);
  } catch (const Error& e) {
    std::string m = e.what();
    std::string prefix = corpus_dir().string() + "/";
    if (m.rfind(prefix, 0) == 0) m = m.substr(prefix.size());
    CHECK(e.kind() == Error::Kind::input);
    return m;
  }
  return "(loaded without error)";
}

std::map<std::string, std::string> read_expected() {
  std::map<std::string, std::string> out;
  std::ifstream in(corpus_dir() / "expected.txt");
  std::string line;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    auto tab = line.find('\t');
    REQUIRE(tab != std::string::npos);
    out[line.substr(0, tab)] = line.substr(tab + 1);
  }
  return out;
}

std::set<std::string> corpus_files() {
  std::set<std::string> out;
  for (const auto& e : fs::directory_iterator(corpus_dir())) {
    if (e.path().extension() == ".yaml") out.insert(e.path().filename().string());
  }
  return out;
}

}  // namespace

TEST_CASE("every broken style fails with its recorded message", "[style][broken]") {
  auto files = corpus_files();
  REQUIRE(files.size() >= 25);
  if (std::getenv("SHEETMILL_RECORD_BROKEN")) {
    std::ofstream out(corpus_dir() / "expected.txt");
    out << "# FILE<TAB>the exact message load_style() gives (see broken_styles_test.cpp)\n";
    for (const auto& f : files) out << f << '\t' << failure_of(corpus_dir() / f) << '\n';
    WARN("recorded " << files.size() << " messages; review the diff of expected.txt");
    return;
  }
  auto expected = read_expected();
  for (const auto& f : files) {
    INFO(f);
    REQUIRE(expected.count(f) == 1);
    CHECK(failure_of(corpus_dir() / f) == expected.at(f));
  }
  // No stale entries: every recorded message belongs to a file in the corpus.
  for (const auto& [f, m] : expected) {
    INFO(f);
    CHECK(files.count(f) == 1);
  }
}

TEST_CASE("a missing style file is an input error naming the file", "[style][broken]") {
  test::TempDir tmp("style");
  fs::path missing = tmp / "nowhere.yaml";
  try {
    style::load_style(missing);
    FAIL("loaded a file that does not exist");
  } catch (const Error& e) {
    CHECK(e.kind() == Error::Kind::input);
    CHECK(std::string(e.what()) == missing.string() + ": file not found or not readable");
  }
}
