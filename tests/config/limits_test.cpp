// Documents that would make the readers recurse for ever, expand exponentially or read without
// end are refused with a located message. The alias cases are the YAML 1.2 spec's own
// constructs (section 3.2.2.2, "Anchors and Aliases"); "billion laughs" is the classic
// entity-expansion attack (common practice to test against, here with YAML aliases).
#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <functional>

#include "sheetmill/config/node.hpp"

using sheetmill::Error;
using sheetmill::config::load_file;
using sheetmill::config::load_string;

namespace {
std::string message_of(const std::function<void()>& f) {
  try {
    f();
  } catch (const Error& e) {
    CHECK(e.kind() == Error::Kind::input);
    return e.what();
  }
  return "(no error)";
}

// Nine levels of ten aliases each: 10^9 values from a dozen lines.
std::string billion_laughs() {
  std::string text = "a0: &a0 [lol, lol, lol, lol, lol, lol, lol, lol, lol, lol]\n";
  for (int level = 1; level <= 9; ++level) {
    std::string prev = "*a" + std::to_string(level - 1);
    text += "a" + std::to_string(level) + ": &a" + std::to_string(level) + " [";
    for (int i = 0; i < 10; ++i) text += (i ? ", " : "") + prev;
    text += "]\n";
  }
  return text;
}
}  // namespace

TEST_CASE("an alias inside its own anchor is refused at the alias", "[config][limits]") {
  CHECK(message_of([] { load_string("name: &a [*a]\n", "s.yaml"); }) ==
        "s.yaml:1:11: an alias refers to the anchor it is inside of");
  CHECK(message_of([] { load_string("m: &m\n  k: {x: *m}\n", "s.yaml"); }) ==
        "s.yaml:2:10: an alias refers to the anchor it is inside of");
}

TEST_CASE("aliases that expand exponentially are refused", "[config][limits]") {
  std::string m = message_of([] { load_string(billion_laughs(), "laughs.yaml"); });
  CHECK(m.rfind("laughs.yaml:", 0) == 0);
  CHECK(m.find("aliases expand to more than 200000 values") != std::string::npos);
  // Ordinary reuse of an anchor still reads.
  auto doc = load_string("a: &w 0.3mm\nb: *w\nc: &l [1, 2]\nd: *l\n", "ok.yaml");
  CHECK(doc.at("b").as_length_mm() == Approx(0.3));
  CHECK(doc.at("d").items().size() == 2);
}

TEST_CASE("nesting deeper than the limit is refused", "[config][limits]") {
  std::string deep = "a: " + std::string(100, '[') + std::string(100, ']') + "\n";
  std::string m = message_of([&] { load_string(deep, "deep.yaml"); });
  CHECK(m.rfind("deep.yaml:1:", 0) == 0);
  CHECK(m.find("nest more than 64 deep") != std::string::npos);
  std::string ok = "a: " + std::string(20, '[') + std::string(20, ']') + "\n";
  CHECK_NOTHROW(load_string(ok, "ok.yaml"));
}

TEST_CASE("devices and binary files are read only to the size limit", "[config][limits]") {
  // /dev/zero never ends; /dev/urandom is not text. Both must stop at 4 MiB at most.
  CHECK(message_of([] { load_file("/dev/zero"); }) ==
        "/dev/zero: larger than 4 MiB; a project or style file is a few kilobytes of YAML");
  CHECK(message_of([] { load_file("/dev/urandom"); }).rfind("/dev/urandom: larger than", 0) == 0);
  auto path = std::filesystem::temp_directory_path() / "sheetmill-nul.yaml";
  {
    std::ofstream out(path, std::ios::binary);
    out << "title: x\nscale: 2\0" << std::string(1, '\0') << "5000\n";
  }
  CHECK(message_of([&] { load_file(path); }) ==
        path.string() + ":2:9: a NUL byte: this is not a YAML text file");
  std::filesystem::remove(path);
}
