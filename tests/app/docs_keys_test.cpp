// Key paths named in the prose of README.md and docs/ (`magnetic.declination`,
// `sheet.side_panel`) must be keys the program reads. The known keys are those of the docs' own
// YAML examples, which the other docs tests load with the real readers (including keys shown
// commented out as alternatives), so a renamed key that the prose does not follow fails here.
#include <catch2/catch.hpp>
#include <regex>
#include <set>
#include <sstream>

#include "app/docs_text.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

// Every key path of a YAML example, read by indentation ("a.b.c"); keys in flow maps on a line
// belong under that line's key, and "# key: value" lines count as keys at their indentation.
void collect_paths(const std::string& text, std::set<std::string>& out) {
  std::istringstream in(text);
  std::vector<std::pair<std::size_t, std::string>> stack;  // (indent, key)
  const std::regex key_line(R"(^(\s*)(#\s*)?(- )?([a-z_][a-z0-9_]*):(.*)$)");
  const std::regex flow_key(R"([{,]\s*([a-z_][a-z0-9_]*):)");
  for (std::string line; std::getline(in, line);) {
    std::smatch m;
    if (!std::regex_match(line, m, key_line)) continue;
    std::size_t indent = m[1].length() + m[3].length();
    while (!stack.empty() && stack.back().first >= indent) stack.pop_back();
    std::string path;
    for (const auto& [i, k] : stack) path += k + ".";
    path += m[4].str();
    out.insert(path);
    const std::string rest = m[5];
    for (auto it = std::sregex_iterator(rest.begin(), rest.end(), flow_key);
         it != std::sregex_iterator(); ++it) {
      out.insert(path + "." + (*it)[1].str());
    }
    stack.emplace_back(indent, m[4].str());
  }
}

bool is_file_name(const std::string& s) {
  static const std::regex ext(
      R"(\.(tif|tiff|gpkg|shp|yaml|yml|json|csv|txt|pdf|png|cof|COF|conf|md|cpp|hpp|py|sh|ttf)$)");
  return std::regex_search(s, ext);
}

}  // namespace

TEST_CASE("key paths named in the docs' prose are keys the program reads", "[app][docs]") {
  std::set<std::string> known;
  for (const auto& page : test::documentation_pages()) {
    for (const auto& block : test::code_blocks(page)) {
      if (block.language == "yaml") collect_paths(block.text, known);
    }
  }
  REQUIRE(known.count("magnetic.declination") == 1);  // from docs/project.md's example
  REQUIRE(known.count("sheet.side_panel") == 1);      // from docs/style.md's examples
  const std::regex dotted("`([a-z_][a-z0-9_]*(\\.[a-z_][a-z0-9_]*)+)(:[^`]*)?`");
  int checked = 0;
  for (const auto& page : test::documentation_pages()) {
    std::istringstream in(test::read_text(test::source_dir() / page));
    int n = 0;
    bool in_code = false;
    for (std::string line; std::getline(in, line);) {
      ++n;
      if (line.rfind("```", 0) == 0) in_code = !in_code;
      if (in_code) continue;
      for (auto it = std::sregex_iterator(line.begin(), line.end(), dotted);
           it != std::sregex_iterator(); ++it) {
        const std::string name = (*it)[1];
        if (is_file_name(name)) continue;
        // A path may be named from any depth: `labels.every` under `contours`.
        bool found = std::any_of(known.begin(), known.end(), [&](const std::string& k) {
          return k == name || (k.size() > name.size() &&
                               k.compare(k.size() - name.size(), name.size(), name) == 0 &&
                               k[k.size() - name.size() - 1] == '.');
        });
        INFO(page.string() << ":" << n << ": `" << name
                           << "` is not a key of any documented example");
        CHECK(found);
        ++checked;
      }
    }
  }
  CHECK(checked >= 10);
}
