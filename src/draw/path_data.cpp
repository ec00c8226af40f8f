#include "sheetmill/draw/path_data.hpp"

#include <cctype>
#include <charconv>
#include <string>

#include "sheetmill/core/error.hpp"

namespace sheetmill::draw {

namespace {

class Scanner {
 public:
  explicit Scanner(std::string_view s) : s_(s) {}
  void skip() {
    while (i_ < s_.size() && (std::isspace(static_cast<unsigned char>(s_[i_])) || s_[i_] == ','))
      ++i_;
  }
  bool done() {
    skip();
    return i_ >= s_.size();
  }
  bool at_number() {
    skip();
    if (i_ >= s_.size()) return false;
    char c = s_[i_];
    return std::isdigit(static_cast<unsigned char>(c)) || c == '-' || c == '+' || c == '.';
  }
  char command() {
    skip();
    return s_[i_++];
  }
  double number() {
    if (!at_number()) fail("expected a number");
    const char* begin = s_.data() + i_;
    if (*begin == '+') ++begin;
    double v = 0;
    auto [end, ec] = std::from_chars(begin, s_.data() + s_.size(), v);
    if (ec != std::errc()) fail("expected a number");
    i_ = static_cast<std::size_t>(end - s_.data());
    return v;
  }
  [[noreturn]] void fail(const std::string& what) const {
    throw_input_error(SourceLocation{}, "path data: " + what + " at character " +
                                            std::to_string(i_ + 1) + " of '" + std::string(s_) +
                                            "'");
  }

 private:
  std::string_view s_;
  std::size_t i_ = 0;
};

}  // namespace

std::vector<PathCommand> parse_path_data(std::string_view data) {
  std::vector<PathCommand> out;
  Scanner sc(data);
  Point cur, start;
  bool have_point = false;
  char cmd = 0;
  while (!sc.done()) {
    if (!sc.at_number()) {
      cmd = sc.command();
    } else if (cmd == 0 || cmd == 'Z' || cmd == 'z') {
      sc.fail("coordinates without a command");
    } else if (cmd == 'M') {
      cmd = 'L';  // implicit lineto after the first pair
    } else if (cmd == 'm') {
      cmd = 'l';
    }
    const bool rel = std::islower(static_cast<unsigned char>(cmd));
    const Point base = rel ? cur : Point{0, 0};
    PathCommand c;
    switch (std::toupper(static_cast<unsigned char>(cmd))) {
      case 'M': {
        double x = sc.number(), y = sc.number();
        c.kind = PathCommand::Kind::move;
        c.p[0] = base + Point{x, y};
        start = cur = c.p[0];
        have_point = true;
        break;
      }
      case 'L': {
        double x = sc.number(), y = sc.number();
        c.kind = PathCommand::Kind::line;
        c.p[0] = base + Point{x, y};
        cur = c.p[0];
        break;
      }
      case 'H': {
        double x = sc.number();
        c.kind = PathCommand::Kind::line;
        c.p[0] = {rel ? cur.x + x : x, cur.y};
        cur = c.p[0];
        break;
      }
      case 'V': {
        double y = sc.number();
        c.kind = PathCommand::Kind::line;
        c.p[0] = {cur.x, rel ? cur.y + y : y};
        cur = c.p[0];
        break;
      }
      case 'C': {
        c.kind = PathCommand::Kind::curve;
        for (Point& p : c.p) {
          double x = sc.number(), y = sc.number();
          p = base + Point{x, y};
        }
        cur = c.p[2];
        break;
      }
      case 'Z':
        c.kind = PathCommand::Kind::close;
        cur = start;
        break;
      default:
        sc.fail(std::string("unknown command '") + cmd + "' (expected M L H V C Z)");
    }
    if (!have_point) sc.fail("path must start with M");
    out.push_back(c);
  }
  return out;
}

}  // namespace sheetmill::draw
