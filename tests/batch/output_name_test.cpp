#include "sheetmill/batch/output_name.hpp"

#include <catch2/catch.hpp>
#include <string>

#include "sheetmill/core/error.hpp"

using sheetmill::batch::check_unique_outputs;
using sheetmill::batch::expand_output_name;
using sheetmill::batch::sanitise_component;
using sheetmill::batch::SheetJob;

namespace {
SheetJob job(std::string id, std::string name = "") {
  SheetJob j;
  j.id = std::move(id);
  j.name = std::move(name);
  j.fields.emplace("row", std::string(1, '3'));
  return j;
}
// The properties output_name.hpp promises for every component of every name.
void check_safe(const std::filesystem::path& p) {
  INFO(p.string());
  CHECK(p.is_relative());
  for (const auto& part : p) {
    std::string c = part.string();
    CHECK(!c.empty());
    CHECK(c != ".");
    CHECK(c != "..");
    CHECK(c.front() != '.');
    CHECK(c.find_first_of(std::string("\\:*?\"<>|\0", 10)) == std::string::npos);
    for (unsigned char ch : c) CHECK((ch >= 0x20 && ch != 0x7f));
  }
}
}  // namespace

TEST_CASE("hostile sheet IDs cannot escape the output folder", "[batch]") {
  // Path traversal, absolute paths, separators of both systems (common attack strings).
  for (std::string id : {"../x", "../../etc/passwd", "/etc/x", "a/../../b", "..\\..\\win", "..",
                         ".", "./x", "~/x", "C:\\x", "x/", "/"}) {
    auto p = expand_output_name("{id}.pdf", job(id), "test");
    check_safe(p);
    CHECK(std::distance(p.begin(), p.end()) == 1);  // one component: no folder from an ID
  }
}

TEST_CASE("control characters, NUL and newlines in IDs are replaced", "[batch]") {
  std::string nul_id("a\0b", 3);
  auto p = expand_output_name("{id}.pdf", job(nul_id), "test");
  check_safe(p);
  CHECK(p.string() == "a_b.pdf");
  p = expand_output_name("{id}-{name}.pdf", job("A1", "North\nrange\r\t"), "test");
  check_safe(p);
  CHECK(p.string() == "A1-North_range__.pdf");
  // Invalid UTF-8 (a lone continuation byte, an overlong slash 0xC0 0xAF) becomes "_";
  // valid UTF-8 stays (the invented place name "Škvára").
  CHECK(sanitise_component("\x80z") == "_z");
  CHECK(sanitise_component("\xc0\xaf") == "__");
  CHECK(sanitise_component("\xc5\xa0kv\xc3\xa1ra") == "\xc5\xa0kv\xc3\xa1ra");
  // A right-to-left override would make "fdp.exe" look like "exe.pdf" in a listing.
  CHECK(sanitise_component("a\xe2\x80\xae"
                           "b") == "a_b");
}

TEST_CASE("reserved device names are never produced, whatever the case or extension", "[batch]") {
  // Reserved names as documented for Windows file systems (from memory: CON PRN AUX NUL
  // COM1-9 LPT1-9, reserved with any extension).
  for (std::string id : {"CON", "con", "Nul", "aux", "PRN", "COM1", "lpt9", "nul.txt"}) {
    auto p = expand_output_name("{id}.pdf", job(id), "test");
    check_safe(p);
    CHECK(p.string().front() == '_');
  }
  // A trailing space (dropped by Windows, making "CON " mean CON) is replaced instead.
  CHECK(expand_output_name("{id}.pdf", job("CON "), "test").string() == "CON_.pdf");
  CHECK(expand_output_name("{id}.pdf", job("COM0"), "test").string() == "COM0.pdf");
  CHECK(expand_output_name("{id}.pdf", job("CONSOLE"), "test").string() == "CONSOLE.pdf");
}

TEST_CASE("the template may make folders but not climb or start at the root", "[batch]") {
  CHECK(expand_output_name("{row}/{id}.pdf", job("B2"), "t").string() == "3/B2.pdf");
  CHECK_THROWS_AS(expand_output_name("../{id}.pdf", job("B2"), "t"), sheetmill::Error);
  CHECK_THROWS_AS(expand_output_name("/tmp/{id}.pdf", job("B2"), "t"), sheetmill::Error);
  CHECK_THROWS_AS(expand_output_name("{nosuch}.pdf", job("B2"), "t"), sheetmill::Error);
  CHECK_THROWS_AS(expand_output_name("{id.pdf", job("B2"), "t"), sheetmill::Error);
}

TEST_CASE("two sheets with one output name are an error naming both", "[batch]") {
  std::vector<SheetJob> jobs = {job("A1"), job("B1"), job("a1")};
  for (auto& j : jobs) j.output = "/out" / expand_output_name("{id}.pdf", j, "t");
  // "A1" and "a1" collide on case-insensitive file systems.
  try {
    check_unique_outputs(jobs, "index.gpkg");
    FAIL("expected a duplicate error");
  } catch (const sheetmill::Error& e) {
    CHECK(e.kind() == sheetmill::Error::Kind::input);
    CHECK(std::string(e.what()).find("A1") != std::string::npos);
    CHECK(std::string(e.what()).find("a1") != std::string::npos);
  }
  // IDs that sanitise to the same name collide too.
  std::vector<SheetJob> tricky = {job("x/y"), job("x_y")};
  for (auto& j : tricky) j.output = "/out" / expand_output_name("{id}.pdf", j, "t");
  CHECK_THROWS_AS(check_unique_outputs(tricky, "t"), sheetmill::Error);
  std::vector<SheetJob> fine = {job("A1"), job("A2")};
  for (auto& j : fine) j.output = "/out" / expand_output_name("{id}.pdf", j, "t");
  CHECK_NOTHROW(check_unique_outputs(fine, "t"));
}
