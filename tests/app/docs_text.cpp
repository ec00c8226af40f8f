#include "app/docs_text.hpp"

#include <algorithm>
#include <sstream>

#include "support/test_env.hpp"

namespace sheetmill::test {

namespace fs = std::filesystem;

std::vector<fs::path> documentation_pages() {
  std::vector<fs::path> pages{"README.md"};
  std::vector<fs::path> docs;
  for (const auto& e : fs::directory_iterator(source_dir() / "docs")) {
    if (e.path().extension() == ".md") docs.push_back(fs::path("docs") / e.path().filename());
  }
  std::sort(docs.begin(), docs.end());
  pages.insert(pages.end(), docs.begin(), docs.end());
  return pages;
}

std::vector<CodeBlock> code_blocks(const fs::path& page) {
  std::istringstream in(read_text(source_dir() / page));
  std::vector<CodeBlock> out;
  std::string line;
  int n = 0;
  bool inside = false;
  while (std::getline(in, line)) {
    ++n;
    if (line.rfind("```", 0) == 0) {
      if (!inside) {
        out.push_back({page, n + 1, line.substr(3), ""});
      }
      inside = !inside;
    } else if (inside) {
      out.back().text += line + "\n";
    }
  }
  return out;
}

namespace {
std::string trim(std::string s) {
  while (!s.empty() && (s.back() == ' ' || s.back() == '\t')) s.pop_back();
  std::size_t b = s.find_first_not_of(" \t");
  return b == std::string::npos ? "" : s.substr(b);
}
}  // namespace

std::vector<CommandLine> sheetmill_lines(const CodeBlock& block) {
  std::istringstream in(block.text);
  std::vector<CommandLine> out;
  std::string line, joined;
  int n = block.first_line - 1, start = 0;
  while (std::getline(in, line)) {
    ++n;
    if (joined.empty()) start = n;
    if (!line.empty() && line.back() == '\\') {
      joined += line.substr(0, line.size() - 1) + " ";
      continue;
    }
    joined += line;
    std::string text = trim(joined);
    joined.clear();
    if (text.rfind("sheetmill ", 0) != 0 && text.rfind("build/sheetmill ", 0) != 0) continue;
    CommandLine c;
    c.where = block.page.string() + ":" + std::to_string(start);
    // A comment starts at " #" (never inside the examples' quoted values).
    std::size_t hash = text.find(" #");
    if (hash != std::string::npos) {
      c.comment = trim(text.substr(hash + 2));
      text = trim(text.substr(0, hash));
    }
    c.text = text;
    out.push_back(c);
  }
  return out;
}

}  // namespace sheetmill::test
