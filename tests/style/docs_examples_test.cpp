// Every YAML example in docs/style.md loads, so the documentation cannot drift from the parser
// unnoticed. Whole-file examples (starting with a section such as `relief:`) load as they are;
// fragments (a `line:`, a `when:`, a colour) are put inside a minimal layer first, and examples
// separated by blank lines inside one block are tried one by one. As the docs say, examples use
// the palette of styles/field.yaml: it is put in front of every example without `colours:`.
#include <catch2/catch.hpp>
#include <sstream>

#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

// The `colours:` section of styles/field.yaml, as text.
// The field style's palette, with the press section its ink tints refer to.
std::string field_palette() {
  std::istringstream in(test::read_text(test::source_dir() / "styles/field.yaml"));
  std::string line, out;
  bool inside = false;
  while (std::getline(in, line)) {
    if (line.rfind("colours:", 0) == 0 || line.rfind("press:", 0) == 0) {
      inside = true;
    } else if (inside && !line.empty() && line[0] != ' ' && line[0] != '#') {
      break;
    }
    if (inside) out += line + "\n";
  }
  return out;
}

bool starts(const std::string& s, const std::string& prefix) {
  return s.rfind(prefix, 0) == 0;
}

std::string indent(const std::string& text, int n) {
  std::istringstream in(text);
  std::string line, out;
  while (std::getline(in, line)) out += std::string(n, ' ') + line + "\n";
  return out;
}

std::vector<std::string> split(const std::string& text, bool per_line) {
  std::istringstream in(text);
  std::vector<std::string> parts(1);
  for (std::string line; std::getline(in, line);) {
    if (line.empty() || per_line) {
      if (!parts.back().empty()) parts.emplace_back();
      if (line.empty()) continue;
    }
    parts.back() += line + "\n";
  }
  if (parts.back().empty()) parts.pop_back();
  return parts;
}

const char* kLayer = "layers:\n  - id: example\n    source: example\n";

// The example as whole style files; empty when the block is of a kind this test does not know.
std::vector<std::string> as_files(const std::string& block) {
  std::vector<std::string> out;
  for (const char* s : {"name:", "press:", "colours:", "symbols:", "label_styles:", "layers:", "relief:",
                        "contours:", "grid:", "sheet:"}) {
    if (starts(block, s)) return {block};
  }
  if (starts(block, "fill:")) {
    for (const auto& l : split(block, true))
      out.push_back(kLayer + std::string("    area:\n") + indent(l, 6));
  } else if (starts(block, "{")) {
    out.push_back(kLayer + std::string("    line: ") + block);
  } else if (starts(block, "line:") || starts(block, "area:") || starts(block, "point:")) {
    for (const auto& p : split(block, false)) out.push_back(kLayer + indent(p, 4));
  } else if (starts(block, "- id:")) {
    out.push_back("layers:\n" + indent(block, 2));
  } else if (starts(block, "when:")) {
    for (const auto& l : split(block, true)) {
      out.push_back(kLayer + std::string("    rules:\n      - ") + l +
                    "        point: { shape: circle, fill: ink }\n");
    }
  } else if (starts(block, "tint:")) {
    for (const auto& p : split(block, false)) out.push_back("relief:\n" + indent(p, 2));
  }
  return out;
}

}  // namespace

TEST_CASE("every YAML example in docs/style.md loads", "[style]") {
  const std::string palette = field_palette();
  REQUIRE(palette.find("  ink:") != std::string::npos);
  std::istringstream docs(test::read_text(test::source_dir() / "docs/style.md"));
  test::TempDir tmp("style-docs");
  std::string line, block;
  bool in_yaml = false;
  int loaded = 0, line_no = 0, block_start = 0;
  while (std::getline(docs, line)) {
    ++line_no;
    if (!in_yaml && line == "```yaml") {
      in_yaml = true;
      block.clear();
      block_start = line_no + 1;
    } else if (in_yaml && line == "```") {
      in_yaml = false;
      INFO("docs/style.md example starting on line " << block_start << ":\n" << block);
      auto files = as_files(block);
      CHECK_FALSE(files.empty());  // a new kind of example: teach as_files() to wrap it
      for (const auto& f : files) {
        INFO("loaded as:\n" << f);
        bool own_palette = starts(f, "colours:") || starts(f, "press:") ||
                           f.find("\ncolours:") != std::string::npos;
        test::write_text(tmp / "example.yaml", own_palette ? f : palette + f);
        CHECK_NOTHROW(style::load_style(tmp / "example.yaml"));
        ++loaded;
      }
    } else if (in_yaml) {
      block += line + "\n";
    }
  }
  CHECK(loaded >= 25);
}
