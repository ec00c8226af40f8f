#pragma once
// Path data for point symbols: a small subset of the usual vector path notation, in millimetres
// around the symbol's anchor (y down). Commands M L H V C Z, upper case absolute and lower case
// relative; numbers separated by spaces or commas; coordinates after a command repeat it (after
// M they continue as L). The result is absolute, with curves kept as cubic Beziers.

#include <string_view>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::draw {

struct PathCommand {
  enum class Kind { move, line, curve, close };
  Kind kind = Kind::move;
  Point p[3];  // move/line: p[0]; curve: control 1, control 2, end
};

// Throws Error(input) "path data: ..." naming the offending position.
std::vector<PathCommand> parse_path_data(std::string_view data);

}  // namespace sheetmill::draw
