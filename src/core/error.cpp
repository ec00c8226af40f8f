#include "sheetmill/core/error.hpp"

#include <algorithm>

namespace sheetmill {

namespace {
// Keeps what() to one line whatever a library put in the message.
std::string one_line(std::string s) {
  std::replace(s.begin(), s.end(), '\n', ' ');
  std::replace(s.begin(), s.end(), '\r', ' ');
  while (!s.empty() && s.back() == ' ') s.pop_back();
  return s;
}
}  // namespace

std::string format_located(const SourceLocation& where, const std::string& message) {
  std::string out;
  if (!where.file.empty()) {
    out += where.file;
    if (where.line > 0) {
      out += ":" + std::to_string(where.line);
      if (where.column > 0) out += ":" + std::to_string(where.column);
    }
    out += ": ";
  }
  if (!where.key_path.empty()) out += where.key_path + ": ";
  out += message;
  return one_line(out);
}

Error::Error(Kind kind, SourceLocation where, const std::string& message)
    : std::runtime_error(format_located(where, message)),
      kind_(kind),
      where_(std::move(where)),
      message_(one_line(message)) {}

void throw_input_error(const std::string& file, const std::string& message) {
  throw Error(Error::Kind::input, SourceLocation{file, 0, 0, {}}, message);
}

void throw_input_error(const SourceLocation& where, const std::string& message) {
  throw Error(Error::Kind::input, where, message);
}

void throw_internal_error(const std::string& message) {
  throw Error(Error::Kind::internal, SourceLocation{}, message);
}

}  // namespace sheetmill
