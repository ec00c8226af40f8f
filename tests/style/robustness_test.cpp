// Damaged style files fail cleanly: whatever line is deleted from a shipped style, loading
// either succeeds or throws sheetmill::Error(input); no other exception and no crash. This
// catches YAML-library exceptions leaking past the located errors.
#include <catch2/catch.hpp>
#include <sstream>

#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> out;
  std::istringstream in(text);
  for (std::string l; std::getline(in, l);) out.push_back(l);
  return out;
}

// Loads every variant of `name` with one line removed and, with `colons`, with one line's first
// ':' removed.
void damage_each_line(const std::string& name, bool colons) {
  const auto lines = lines_of(test::read_text(test::source_dir() / "styles" / name));
  test::TempDir tmp("style-damage");
  int failed_cleanly = 0;
  for (std::size_t i = 0; i < lines.size(); ++i) {
    for (int variant = 0; variant < (colons ? 2 : 1); ++variant) {
      std::string text;
      for (std::size_t j = 0; j < lines.size(); ++j) {
        std::string l = lines[j];
        if (j == i && variant == 0) continue;
        if (j == i && variant == 1) {
          auto colon = l.find(':');
          if (colon == std::string::npos) continue;
          l.erase(colon, 1);
        }
        text += l + "\n";
      }
      test::write_text(tmp / name, text);
      INFO(name << " line " << i + 1 << (variant ? " without its colon" : " deleted"));
      try {
        style::load_style(tmp / name);
      } catch (const Error& e) {
        CHECK(e.kind() == Error::Kind::input);
        CHECK(std::string(e.what()).find('\n') == std::string::npos);
        ++failed_cleanly;
      } catch (const std::exception& e) {
        FAIL("escaped as std::exception: " << e.what());
      }
    }
  }
  // Damage to a real style is mostly noticed (a test that never sees an error proves nothing).
  CHECK(failed_cleanly > static_cast<int>(lines.size()) / 4);
}

}  // namespace

TEST_CASE("damaged copies of the field style fail with located input errors", "[style]") {
  damage_each_line("field.yaml", true);
}

TEST_CASE("damaged copies of the exhibit style fail with located input errors", "[style]") {
  damage_each_line("exhibit.yaml", false);  // yaml-cpp takes ~10 ms a file
}
