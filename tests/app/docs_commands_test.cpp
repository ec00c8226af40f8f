// The command lines in README.md and docs/ are the ones users copy: every option they name must
// exist, docs/commands.md must document every option of every command, and every example in a
// ```sh block must run against the demo data with the exit status the docs give it (0 unless
// the line's comment says "exits N").
#include <catch2/catch.hpp>
#include <regex>
#include <set>
#include <sstream>

#include "app/docs_text.hpp"
#include "sheetmill/app/app.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;
namespace fs = std::filesystem;

namespace {

const std::set<std::string> kGlobal = {"--help", "-h",      "--version", "--verbose",
                                       "-v",     "--quiet", "-q"};

std::vector<std::string> words(const std::string& text) {
  std::istringstream in(text);
  std::vector<std::string> out;
  for (std::string w; in >> w;) out.push_back(w);
  return out;
}

// Option words of a command line or synopsis: "--dpi", "--sheet=X" -> "--sheet", "[--force]".
std::vector<std::string> option_words(const std::string& text) {
  std::vector<std::string> out;
  // A short option is one letter ("-j2" is -j with its value).
  std::regex opt(R"((^|[\s\[|(])(--[a-z][a-z0-9-]*|-[a-zA-Z]))");
  for (auto it = std::sregex_iterator(text.begin(), text.end(), opt); it != std::sregex_iterator();
       ++it) {
    out.push_back((*it)[2]);
  }
  return out;
}

// The subcommand a command line runs: the first word after "sheetmill" that is not an option.
std::string command_of(const std::string& text) {
  auto w = words(text);
  for (std::size_t i = 1; i < w.size(); ++i) {
    if (w[i][0] != '-') return w[i];
  }
  return "";
}

// Inline `sheetmill ...` spans in prose, besides the code blocks.
std::vector<std::pair<std::string, std::string>> inline_commands(const fs::path& page) {
  std::vector<std::pair<std::string, std::string>> out;
  std::istringstream in(test::read_text(test::source_dir() / page));
  std::regex span("`((build/)?sheetmill [^`]+)`");
  int n = 0;
  for (std::string line; std::getline(in, line);) {
    ++n;
    for (auto it = std::sregex_iterator(line.begin(), line.end(), span);
         it != std::sregex_iterator(); ++it) {
      out.emplace_back(page.string() + ":" + std::to_string(n), (*it)[1]);
    }
  }
  return out;
}

// Every command line and synopsis the documentation shows, with where it stands.
std::vector<std::pair<std::string, std::string>> all_shown_commands() {
  std::vector<std::pair<std::string, std::string>> out;
  for (const fs::path& page : test::documentation_pages()) {
    for (const auto& block : test::code_blocks(page)) {
      if (block.language == "yaml" || block.language == "cpp" || block.language == "python")
        continue;
      for (const auto& c : test::sheetmill_lines(block)) out.emplace_back(c.where, c.text);
    }
    for (auto& c : inline_commands(page)) out.push_back(std::move(c));
  }
  return out;
}

}  // namespace

TEST_CASE("every command and option the docs show exists", "[app][docs]") {
  const auto commands = app::command_options();
  const auto shown = all_shown_commands();
  CHECK(shown.size() >= 30);
  for (const auto& [where, text] : shown) {
    INFO(where << ": " << text);
    const std::string cmd = command_of(text);
    if (cmd.empty()) continue;  // "sheetmill --help"
    auto it = commands.find(cmd);
    CHECK(it != commands.end());
    if (it == commands.end()) continue;
    for (const std::string& o : option_words(text.substr(text.find(cmd)))) {
      INFO("option " << o);
      bool known = kGlobal.count(o) ||
                   std::find(it->second.begin(), it->second.end(), o) != it->second.end();
      CHECK(known);
    }
  }
}

TEST_CASE("docs/commands.md documents every command and every option", "[app][docs]") {
  const auto commands = app::command_options();
  std::istringstream in(test::read_text(test::source_dir() / "docs/commands.md"));
  std::map<std::string, std::string> sections;  // command -> its section's text
  std::string current;
  for (std::string line; std::getline(in, line);) {
    if (line.rfind("## sheetmill ", 0) == 0) {
      current = words(line)[2];
    } else if (line.rfind("## ", 0) == 0) {
      current.clear();
    } else if (!current.empty()) {
      sections[current] += line + "\n";
    }
  }
  for (const auto& [cmd, options] : commands) {
    INFO("sheetmill " << cmd);
    auto s = sections.find(cmd);
    REQUIRE(s != sections.end());
    // Each option appears as `--name` in the section's option table.
    for (const auto& o : options) {
      if (o == "--help" || o == "-h") continue;
      INFO("option " << o);
      CHECK(s->second.find("`" + o) != std::string::npos);
    }
    // And at least one example runs the command.
    CHECK(s->second.find("```sh\nsheetmill " + cmd) != std::string::npos);
  }
  for (const auto& [cmd, text] : sections) {
    INFO("docs/commands.md documents a command the program does not have: " << cmd);
    CHECK(commands.count(cmd) == 1);
  }
}

TEST_CASE("every example command in README.md and docs/ runs on the demo data", "[app][docs]") {
  // A copy of the repository's layout that examples refer to: demo_area/ with its project
  // files and generated data, styles/, build/sheetmill, and the magnetic model.
  test::TempDir tmp("docs-commands");
  const fs::path root = tmp.path();
  fs::create_directories(root / "demo_area");
  fs::create_directories(root / "build");
  fs::create_directories(root / "out");
  for (const char* f : {"project.yaml", "exhibit.yaml"}) {
    fs::copy_file(test::source_dir() / "demo_area" / f, root / "demo_area" / f);
  }
  fs::create_directory_symlink(test::demo_area(), root / "demo_area/generated");
  fs::create_directory_symlink(test::source_dir() / "styles", root / "styles");
  fs::create_symlink(test::sheetmill_exe(), root / "build/sheetmill");
  const fs::path wmm = test::shared_dir() / "data/wmm/WMM2025.COF";
  if (fs::exists(wmm)) fs::create_symlink(wmm, root / "WMM2025.COF");

  int run = 0;
  for (const fs::path& page : test::documentation_pages()) {
    for (const auto& block : test::code_blocks(page)) {
      if (block.language != "sh") continue;
      for (const auto& c : test::sheetmill_lines(block)) {
        if (c.text.find("WMM2025.COF") != std::string::npos && !fs::exists(wmm)) {
          WARN(c.where << ": skipped, no " << wmm.string());
          continue;
        }
        int expected = 0;
        std::smatch m;
        if (std::regex_search(c.comment, m, std::regex(R"(^exits (\d+))")))
          expected = std::stoi(m[1]);
        const std::string script = "cd '" + root.string() + "' && PATH='" +
                                   (root / "build").string() + "':\"$PATH\" timeout 600 " + c.text;
        auto r = test::run_command({"/bin/sh", "-c", script});
        INFO(c.where << ": " << c.text << "\nstdout: " << r.out << "\nstderr: " << r.err);
        CHECK(r.exit_code == expected);
        if (expected == 2) {
          // A documented error is one located line.
          CHECK(std::count(r.err.begin(), r.err.end(), '\n') == 1);
        }
        ++run;
      }
    }
  }
  CHECK(run >= 20);
}
