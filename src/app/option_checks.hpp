#pragma once
// Checks for command-line values, worded the way the rest of sheetmill words its errors:
// "--dpi: expected a resolution from 20 to 1200 dots per inch, got "5"". Each check runs on the
// text before CLI11 converts it, so a value that is not a number gets the same sentence.

#include <CLI/CLI.hpp>
#include <initializer_list>
#include <string>

namespace sheetmill::app {

// A number from lo to hi inclusive; `what` names it with its unit, e.g.
// "a resolution from 20 to 1200 dots per inch" is built from what = "a resolution",
// unit = "dots per inch".
CLI::Validator number_from(double lo, double hi, const std::string& what, const std::string& unit);
// A number greater than zero.
CLI::Validator positive_number(const std::string& what);
// A whole number of at least `lo`.
CLI::Validator whole_number_from(long lo, const std::string& what);
// One of the listed words.
CLI::Validator one_of(std::initializer_list<const char*> words);
// A scale: "1:25000", "1:25 000" or "25000".
CLI::Validator scale_text();

// The one line printed for a command line that cannot be used, in our own words; `command` is
// the subcommand's name (empty for the top level), used to point at its --help.
std::string describe_parse_error(const CLI::ParseError& e, const std::string& command);

}  // namespace sheetmill::app
