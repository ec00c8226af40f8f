// styles/style.schema.json, run by the python jsonschema package (Draft 2020-12 validator) as
// an independent checker: it accepts the shipped styles and rejects broken ones of the kinds a
// schema can see (types, units, enums, unknown keys). Needs python3-yaml and
// python3-jsonschema (scripts/lib.sh installs them).
#include <catch2/catch.hpp>
#include <sstream>

#include "sheetmill/core/error.hpp"
#include "sheetmill/style/style.hpp"
#include "support/test_env.hpp"

using namespace sheetmill;

namespace {

test::CommandResult validate(const std::vector<std::string>& files) {
  std::vector<std::string> argv = {
      "python3", (test::source_dir() / "tests/style/validate_with_schema.py").string(),
      (test::source_dir() / "styles/style.schema.json").string()};
  for (const auto& f : files) argv.push_back((test::source_dir() / f).string());
  auto r = test::run_command(argv);
  INFO(r.err);
  REQUIRE(r.exit_code != 3);  // python3-yaml or python3-jsonschema missing: install them
  return r;
}

int count_of(const std::string& text, const std::string& word) {
  int n = 0;
  for (auto at = text.find(word); at != std::string::npos; at = text.find(word, at + 1)) ++n;
  return n;
}

}  // namespace

TEST_CASE("the schema accepts the shipped styles", "[style][schema]") {
  auto r = validate({"styles/field.yaml", "styles/exhibit.yaml"});
  INFO(r.out << r.err);
  CHECK(r.exit_code == 0);
  CHECK(count_of(r.out, ": valid\n") == 2);
}

TEST_CASE("the schema rejects broken styles it can recognise", "[style][schema]") {
  // One per kind: unknown key, bare number for a length, bad hex, bad enum, wrong type,
  // missing required key, negative width, empty rule, two filter tests, paper unit for ground.
  const std::vector<std::string> broken = {
      "unknown_stroke_key.yaml",  "width_without_unit.yaml", "bad_hex_colour.yaml",
      "bad_enum_placement.yaml",  "bad_bool.yaml",           "missing_source.yaml",
      "negative_width.yaml",      "empty_rule.yaml",         "filter_two_tests.yaml",
      "interval_paper_unit.yaml", "dash_no_unit.yaml",       "tint_ramp_without_over.yaml"};
  std::vector<std::string> paths;
  for (const auto& f : broken) paths.push_back("tests/style/broken/" + f);
  auto r = validate(paths);  // one python process: starting one costs about a second
  INFO(r.out);
  CHECK(r.exit_code == 1);
  for (const auto& f : broken) {
    INFO(f);
    CHECK(count_of(r.out, "/" + f + ": invalid: ") == 1);
  }
}

TEST_CASE("docs/style.md documents every key the schema defines", "[style][schema]") {
  auto r =
      test::run_command({"python3", (test::source_dir() / "tests/style/schema_keys.py").string(),
                         (test::source_dir() / "styles/style.schema.json").string()});
  REQUIRE(r.exit_code == 0);
  std::string docs = test::read_text(test::source_dir() / "docs/style.md");
  std::istringstream keys(r.out);
  std::string key;
  int n = 0;
  while (std::getline(keys, key)) {
    INFO(key);
    // In a table or the text as `key`, or in a YAML example as "key:".
    bool in_text = docs.find("`" + key + "`") != std::string::npos;
    bool in_example = docs.find(" " + key + ":") != std::string::npos ||
                      docs.find("\n" + key + ":") != std::string::npos ||
                      docs.find("{ " + key + ":") != std::string::npos;
    CHECK((in_text || in_example));
    ++n;
  }
  CHECK(n > 50);
}

TEST_CASE("the schema's tint ramps are exactly the built-in ones", "[style][schema]") {
  auto r = test::run_command(
      {"python3", "-c",
       "import json, sys\n"
       "s = json.load(open(sys.argv[1]))\n"
       "print(', '.join(s['$defs']['relief']['properties']['tint']['oneOf'][1]['properties']"
       "['ramp']['enum']))\n",
       (test::source_dir() / "styles/style.schema.json").string()});
  REQUIRE(r.exit_code == 0);
  std::string names = r.out.substr(0, r.out.find('\n'));
  test::TempDir tmp("style");
  test::write_text(tmp / "s.yaml", "relief: { tint: { ramp: none-such, over: [0m, 9m] } }\n");
  try {
    style::load_style(tmp / "s.yaml");
    FAIL("an unknown ramp loaded");
  } catch (const Error& e) {
    // The loader lists its built-in ramps in the message.
    CHECK(e.message() == "expected one of " + names + ", got \"none-such\"");
  }
}
