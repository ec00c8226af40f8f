#include "sheetmill/config/node.hpp"

#include <catch2/catch.hpp>

using sheetmill::Error;
using sheetmill::config::load_string;

namespace {
std::string message_of(const std::function<void()>& f) {
  try {
    f();
  } catch (const Error& e) {
    return e.what();
  }
  return "(no error)";
}
}  // namespace

TEST_CASE("lengths carry their unit", "[config]") {
  auto doc = load_string("a: 0.35mm\nb: 2pt\nc: 1in\nd: 1.5cm\ne: thick\nf: 0.35\n", "s.yaml");
  CHECK(doc.at("a").as_length_mm() == Approx(0.35));
  CHECK(doc.at("b").as_length_mm() == Approx(2 * 25.4 / 72));
  CHECK(doc.at("c").as_length_mm() == Approx(25.4));
  CHECK(doc.at("d").as_length_mm() == Approx(15));
  CHECK(message_of([&] { doc.at("e").as_length_mm(); }) ==
        "s.yaml:5:4: e: expected a length such as 0.35mm (units: mm, cm, in, pt), got \"thick\"");
  CHECK(message_of([&] { doc.at("f").as_length_mm(); }).find("got \"0.35\"") != std::string::npos);
}

TEST_CASE("unknown keys name the closest known key", "[config]") {
  auto doc = load_string("title: x\nscael: 25000\n", "p.yaml");
  CHECK(message_of([&] {
          doc.expect_keys({"title", "scale", "paper"});
        }) == "p.yaml:2:1: scael: unknown key 'scael'; did you mean 'scale'?");
}

TEST_CASE("syntax errors give line and column", "[config]") {
  std::string m = message_of([] { load_string("a: [1, 2\nb: 3\n", "bad.yaml"); });
  CHECK(m.rfind("bad.yaml:", 0) == 0);
  CHECK(m.find("YAML syntax error") != std::string::npos);
}

TEST_CASE("key paths run through lists", "[config]") {
  auto doc = load_string("layers:\n  - width: 1mm\n  - width: big\n", "s.yaml");
  auto items = doc.at("layers").items();
  REQUIRE(items.size() == 2);
  CHECK(message_of([&] {
          items[1].at("width").as_length_mm();
        }).rfind("s.yaml:3:12: layers[1].width: expected a length", 0) == 0);
  CHECK(message_of([&] { items[0].at("colour"); }) ==
        "s.yaml:2:5: layers[0]: missing required key 'colour'");
}
