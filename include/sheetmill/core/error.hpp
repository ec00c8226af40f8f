#pragma once
// The one exception type that crosses the CLI boundary.
//
// Kind::input is the user's to fix (a missing file, a bad key, a wrong value): the CLI prints
// what() on one line and exits 2. Kind::internal is a bug or an environment fault: exit 1.
// what() is always one line: "FILE:LINE:COL: KEY.PATH: MESSAGE", with absent parts left out.

#include <stdexcept>
#include <string>

namespace sheetmill {

struct SourceLocation {
  std::string file;      // as the user named it; empty when not from a file
  int line = 0;          // 1-based; 0 when unknown
  int column = 0;        // 1-based; 0 when unknown
  std::string key_path;  // for example "layers[3].line.width"; empty when not from a document
};

class Error : public std::runtime_error {
 public:
  enum class Kind { input, internal };

  Error(Kind kind, SourceLocation where, const std::string& message);

  Kind kind() const noexcept { return kind_; }
  const SourceLocation& where() const noexcept { return where_; }
  // The message without its location prefix.
  const std::string& message() const noexcept { return message_; }
  int exit_code() const noexcept { return kind_ == Kind::input ? 2 : 1; }

 private:
  Kind kind_;
  SourceLocation where_;
  std::string message_;
};

// Shorthands. input_error("dem.tif", "not a raster GDAL can read") -> "dem.tif: not a raster ...".
[[noreturn]] void throw_input_error(const std::string& file, const std::string& message);
[[noreturn]] void throw_input_error(const SourceLocation& where, const std::string& message);
[[noreturn]] void throw_internal_error(const std::string& message);

// Formats a location and message the way what() does.
std::string format_located(const SourceLocation& where, const std::string& message);

}  // namespace sheetmill
