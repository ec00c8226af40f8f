#include <algorithm>
#include <cctype>
#include <string>
#include <vector>

#include "sheetmill/core/error.hpp"
#include "sheetmill/project/project.hpp"

namespace sheetmill::project {

namespace {
struct NamedPaper {
  const char* name;
  double width_mm;
  double height_mm;
};

// Portrait dimensions. ISO 216 A series in mm; ANSI (ASME Y14.1) and architectural (ARCH) sizes in
// inches, converted exactly (1 in = 25.4 mm).
constexpr double in = 25.4;
const std::vector<NamedPaper>& table() {
  static const std::vector<NamedPaper> t = {
      {"A0", 841, 1189},
      {"A1", 594, 841},
      {"A2", 420, 594},
      {"A3", 297, 420},
      {"A4", 210, 297},
      {"ANSI A", 8.5 * in, 11 * in},
      {"ANSI B", 11 * in, 17 * in},
      {"ANSI C", 17 * in, 22 * in},
      {"ANSI D", 22 * in, 34 * in},
      {"ANSI E", 34 * in, 44 * in},
      {"ARCH A", 9 * in, 12 * in},
      {"ARCH B", 12 * in, 18 * in},
      {"ARCH C", 18 * in, 24 * in},
      {"ARCH D", 24 * in, 36 * in},
      {"ARCH E", 36 * in, 48 * in},
      {"ARCH E1", 30 * in, 42 * in},
  };
  return t;
}

std::string normalise(const std::string& s) {
  std::string out;
  for (char c : s) {
    if (c == ' ' || c == '-' || c == '_') continue;
    out += static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
  }
  return out;
}
}  // namespace

std::vector<std::string> paper_names() {
  std::vector<std::string> names;
  for (const auto& p : table()) names.emplace_back(p.name);
  return names;
}

Paper paper_by_name(const std::string& name) {
  for (const auto& p : table()) {
    if (normalise(p.name) == normalise(name)) return Paper{p.name, p.width_mm, p.height_mm};
  }
  std::string list;
  for (const auto& p : table()) list += (list.empty() ? "" : ", ") + std::string(p.name);
  throw_input_error(SourceLocation{},
                    "unknown paper size '" + name + "' (known: " + list + ", or width and height)");
}

}  // namespace sheetmill::project
