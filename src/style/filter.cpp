// Rule filters: `when: {field: F, equals: V}`, `{field: F, one_of: [..]}`,
// `{field: F, at_least: A, less_than: B}` (either end may be left out).
#include "style/reader.hpp"

namespace sheetmill::style {

namespace detail {

Filter read_filter(const ConfigNode& n) {
  Filter f;
  if (n.is_null()) return f;
  if (!n.is_map()) n.fail_expected("a filter such as {field: class, equals: main}");
  n.expect_keys({"field", "equals", "one_of", "at_least", "less_than"});
  f.field = n.at("field").as_string();
  if (f.field.empty()) n.at("field").fail_expected("a field name");
  int forms = (n.has("equals") ? 1 : 0) + (n.has("one_of") ? 1 : 0) +
              (n.has("at_least") || n.has("less_than") ? 1 : 0);
  if (forms != 1) {
    n.fail("expected exactly one test: equals, one_of, or at_least and/or less_than");
  }
  if (auto e = n.find("equals")) {
    f.kind = Filter::Kind::equals;
    f.values.push_back(e->as_string());
  } else if (auto o = n.find("one_of")) {
    f.kind = Filter::Kind::one_of;
    for (const auto& item : o->items()) f.values.push_back(item.as_string());
    if (f.values.empty()) o->fail("expected at least one value, got an empty list");
  } else {
    f.kind = Filter::Kind::range;
    if (auto a = n.find("at_least")) f.min = a->as_number();
    if (auto b = n.find("less_than")) f.max = b->as_number();
    if (f.min && f.max && !(*f.min < *f.max)) {
      n.at("less_than")
          .fail("expected less_than above at_least (" + n.at("at_least").as_string() + ")");
    }
  }
  return f;
}

}  // namespace detail

namespace {
// Values compare as numbers when both read as numbers ("5" equals "5.0"), else as text.
bool same_value(const std::string& a, const std::string& b) {
  if (a == b) return true;
  auto x = detail::parse_number(a), y = detail::parse_number(b);
  return x && y && *x == *y;
}
}  // namespace

bool matches(const Filter& filter, const std::string* value) {
  if (filter.kind == Filter::Kind::always) return true;
  if (!value) return false;
  switch (filter.kind) {
    case Filter::Kind::equals:
    case Filter::Kind::one_of:
      for (const auto& v : filter.values) {
        if (same_value(*value, v)) return true;
      }
      return false;
    case Filter::Kind::range: {
      auto v = detail::parse_number(*value);
      if (!v) return false;
      if (filter.min && !(*v >= *filter.min)) return false;
      if (filter.max && !(*v < *filter.max)) return false;
      return true;
    }
    case Filter::Kind::always:
      break;
  }
  return true;
}

}  // namespace sheetmill::style
