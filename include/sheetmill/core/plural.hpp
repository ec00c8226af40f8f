#pragma once
// Counts in messages, with the noun in the right number: counted(1, "label") is "1 label",
// counted(3, "label") is "3 labels", counted(2, "vertex", "vertices") is "2 vertices".

#include <string>
#include <string_view>

namespace sheetmill {

inline std::string counted(long long n, std::string_view one, std::string_view many = {}) {
  std::string out = std::to_string(n) + " ";
  if (n == 1 || n == -1) {
    out += one;
  } else if (many.empty()) {
    out += one;
    out += 's';
  } else {
    out += many;
  }
  return out;
}

}  // namespace sheetmill
