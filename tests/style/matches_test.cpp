// matches(): the three filter forms and a feature lacking the field.
#include <catch2/catch.hpp>

#include "sheetmill/style/style.hpp"

using namespace sheetmill::style;

namespace {
Filter equals(std::string field, std::string v) {
  Filter f;
  f.kind = Filter::Kind::equals;
  f.field = std::move(field);
  f.values = {std::move(v)};
  return f;
}
Filter range(std::optional<double> lo, std::optional<double> hi) {
  Filter f;
  f.kind = Filter::Kind::range;
  f.field = "population";
  f.min = lo;
  f.max = hi;
  return f;
}
bool test(const Filter& f, const char* v) {
  std::string s = v;
  return matches(f, &s);
}
}  // namespace

TEST_CASE("an empty filter accepts every feature, with or without the field", "[style]") {
  Filter always;
  CHECK(test(always, "anything"));
  CHECK(matches(always, nullptr));
}

TEST_CASE("equality compares text, and numbers by value", "[style]") {
  Filter f = equals("class", "main");
  CHECK(test(f, "main"));
  CHECK_FALSE(test(f, "Main"));  // case matters: attribute values are data, not keywords
  CHECK_FALSE(test(f, "main "));
  CHECK_FALSE(test(f, ""));
  CHECK_FALSE(matches(f, nullptr));
  Filter n = equals("voltage_kv", "110");
  CHECK(test(n, "110.0"));  // GDAL may write a real field as 110.0 for the file's 110
  CHECK_FALSE(test(n, "11"));
}

TEST_CASE("sets accept any listed value", "[style]") {
  Filter f;
  f.kind = Filter::Kind::one_of;
  f.field = "kind";
  f.values = {"house", "farm"};
  CHECK(test(f, "house"));
  CHECK(test(f, "farm"));
  CHECK_FALSE(test(f, "barn"));
  CHECK_FALSE(matches(f, nullptr));
}

TEST_CASE("ranges include their lower end and exclude their upper end", "[style]") {
  Filter both = range(100, 500);
  CHECK(test(both, "100"));
  CHECK(test(both, "499.99"));
  CHECK_FALSE(test(both, "500"));
  CHECK_FALSE(test(both, "99"));
  CHECK_FALSE(test(both, "many"));  // not a number: no match rather than an error
  CHECK_FALSE(matches(both, nullptr));
  Filter from = range(500, std::nullopt);
  CHECK(test(from, "500"));
  CHECK(test(from, "1e9"));
  CHECK_FALSE(test(from, "-3"));
  Filter below = range(std::nullopt, 0);
  CHECK(test(below, "-0.5"));
  CHECK_FALSE(test(below, "0"));
}
