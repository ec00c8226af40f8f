#include "app/option_checks.hpp"

#include <fmt/format.h>

#include <charconv>
#include <cmath>

#include "sheetmill/core/scale_text.hpp"

namespace sheetmill::app {

namespace {

bool parse_number(const std::string& s, double& v) {
  const char* b = s.data();
  const char* e = s.data() + s.size();
  if (b != e && *b == '+') ++b;
  auto [p, ec] = std::from_chars(b, e, v);
  return ec == std::errc() && p == e && std::isfinite(v);
}

std::string in_quotes(const std::string& s) {
  return "\"" + s + "\"";
}

// Numbers as people write them: 20, 0.5, 1200 (no trailing zeros).
std::string plain(double v) {
  return fmt::format("{:g}", v);
}

}  // namespace

CLI::Validator number_from(double lo, double hi, const std::string& what, const std::string& unit) {
  const std::string expected =
      fmt::format("{} from {} to {}{}", what, plain(lo), plain(hi), unit.empty() ? "" : " " + unit);
  return CLI::Validator(
      [=](std::string& s) -> std::string {
        double v = 0;
        if (parse_number(s, v) && v >= lo && v <= hi) return {};
        return "expected " + expected + ", got " + in_quotes(s);
      },
      "");
}

CLI::Validator positive_number(const std::string& what) {
  return CLI::Validator(
      [=](std::string& s) -> std::string {
        double v = 0;
        if (parse_number(s, v) && v > 0) return {};
        return "expected " + what + " greater than 0, got " + in_quotes(s);
      },
      "");
}

CLI::Validator whole_number_from(long lo, const std::string& what) {
  return CLI::Validator(
      [=](std::string& s) -> std::string {
        double v = 0;
        if (parse_number(s, v) && v == std::floor(v) && v >= static_cast<double>(lo) && v < 1e9) {
          return {};
        }
        return fmt::format("expected {}, a whole number of at least {}, got {}", what, lo,
                           in_quotes(s));
      },
      "");
}

CLI::Validator one_of(std::initializer_list<const char*> words) {
  std::vector<std::string> list(words.begin(), words.end());
  std::string shown;
  for (std::size_t i = 0; i < list.size(); ++i) {
    shown += (i == 0 ? "" : i + 1 == list.size() ? " or " : ", ") + list[i];
  }
  return CLI::Validator(
      [=](std::string& s) -> std::string {
        for (const auto& w : list) {
          if (s == w) return {};
        }
        return "expected " + shown + ", got " + in_quotes(s);
      },
      "");
}

CLI::Validator scale_text() {
  return CLI::Validator(
      [](std::string& s) -> std::string {
        if (parse_scale_denominator(s)) return {};
        return std::string("expected ") + kScaleExpected + ", got " + in_quotes(s);
      },
      "");
}

std::string describe_parse_error(const CLI::ParseError& e, const std::string& command) {
  const std::string help =
      command.empty() ? "sheetmill --help" : "sheetmill " + command + " --help";
  std::string what = e.what();
  const std::string name = e.get_name();
  if (name == "RequiredError") {
    // CLI11: "--output is required", "A subcommand is required".
    if (what.rfind("A subcommand", 0) == 0) {
      what = "name a command (render, check, batch, ...)";
    } else {
      auto at = what.find(" is required");
      if (at != std::string::npos) what = "missing " + what.substr(0, at);
    }
  } else if (name == "ExtrasError" || what.rfind("The following argument", 0) == 0) {
    auto colon = what.find(": ");
    if (colon != std::string::npos) {
      const std::string rest = what.substr(colon + 2);
      what =
          (rest.find(' ') == std::string::npos ? "unexpected argument " : "unexpected arguments ") +
          in_quotes(rest);
    }
  } else if (name == "ConversionError") {
    what = "a value could not be read: " + what;
  }
  return what + " (see " + help + ")";
}

}  // namespace sheetmill::app
