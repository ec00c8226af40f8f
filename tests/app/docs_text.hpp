#pragma once
// Reading the documentation as the tests check it: the pages, their fenced code blocks, and the
// command lines in them (continuation backslashes joined).

#include <filesystem>
#include <string>
#include <vector>

namespace sheetmill::test {

struct CodeBlock {
  std::filesystem::path page;  // relative to the repository, e.g. "docs/batch.md"
  int first_line = 0;          // 1-based line of the first line inside the fence
  std::string language;        // the word after ```: "sh", "yaml", "" ...
  std::string text;
};

// README.md and every docs/*.md page, in name order.
std::vector<std::filesystem::path> documentation_pages();
// Every fenced block of the page.
std::vector<CodeBlock> code_blocks(const std::filesystem::path& page);

struct CommandLine {
  std::string where;    // "docs/batch.md:14"
  std::string text;     // one command, continuations joined, comment removed
  std::string comment;  // what followed '#', trimmed ("exits 2: ..." marks a documented error)
};
// Lines of `block` that run sheetmill ("sheetmill ..." or "build/sheetmill ...").
std::vector<CommandLine> sheetmill_lines(const CodeBlock& block);

}  // namespace sheetmill::test
