#include "sheetmill/batch/option_values.hpp"

#include <charconv>
#include <cmath>
#include <optional>

#include "sheetmill/config/bounds.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/scale_text.hpp"
#include "sheetmill/core/units.hpp"

namespace sheetmill::batch {

namespace {

std::string strip(std::string s) {
  std::string out;
  for (char c : s) {
    if (c != ' ' && c != '\t') out.push_back(c);
  }
  return out;
}

// A number followed by an optional unit; nullopt when it does not start with a number.
std::optional<std::pair<double, std::string>> number_and_unit(const std::string& text) {
  double v = 0;
  const char* begin = text.data();
  const char* end = text.data() + text.size();
  auto [p, ec] = std::from_chars(begin, end, v);
  if (ec != std::errc() || !std::isfinite(v)) return std::nullopt;
  return std::pair<double, std::string>{v, std::string(p, end)};
}

}  // namespace

double parse_scale(const std::string& raw, const std::string& where) {
  auto v = parse_scale_denominator(raw);
  if (!v)
    throw_input_error(where, std::string("expected ") + kScaleExpected + ", got \"" + raw + "\"");
  return *v;
}

double parse_paper_length_mm(const std::string& raw, const std::string& where) {
  auto v = number_and_unit(strip(raw));
  if (v) {
    const std::string& u = v->second;
    double mm = u == "mm" || (u.empty() && v->first == 0) ? v->first
                : u == "cm"                               ? v->first * 10
                : u == "in"                               ? v->first * kMmPerInch
                : u == "pt"                               ? v->first * kMmPerPt
                                                          : std::nan("");
    if (std::abs(mm) <= config::bounds::max_paper_length_mm) return mm;
    if (!std::isnan(mm)) {
      throw_input_error(where,
                        "expected a length on paper of at most 5080mm (200 in, the "
                        "largest PDF page), got \"" +
                            raw + "\"");
    }
  }
  throw_input_error(where, "expected a length on paper such as 5mm, got \"" + raw + "\"");
}

double parse_ground_length_m(const std::string& raw, const std::string& where) {
  auto v = number_and_unit(strip(raw));
  if (v) {
    const std::string& u = v->second;
    double m = u == "m"    ? v->first
               : u == "km" ? v->first * 1000
               : u == "ft" ? v->first * kMetresPerFoot
               : u == "mi" ? v->first * 1609.344  // international mile
                           : std::nan("");
    if (std::abs(m) <= config::bounds::max_ground_length_m) return m;
    if (!std::isnan(m)) {
      throw_input_error(where, "expected a ground length of at most 100000km, got \"" + raw + "\"");
    }
  }
  throw_input_error(where, "expected a ground length such as 1km or 500m, got \"" + raw + "\"");
}

std::pair<double, double> parse_frame_mm(const std::string& raw, const std::string& where) {
  std::string t = strip(raw);
  std::size_t x = t.find('x');
  if (x == std::string::npos) {
    throw_input_error(where, "expected a frame size such as 400x300mm, got \"" + raw + "\"");
  }
  std::string a = t.substr(0, x), b = t.substr(x + 1);
  // A unit given once at the end applies to both sides.
  std::size_t unit_at = b.find_first_not_of("0123456789.");
  if (unit_at != std::string::npos && a.find_first_not_of("0123456789.") == std::string::npos) {
    a += b.substr(unit_at);
  }
  double w = parse_paper_length_mm(a, where), h = parse_paper_length_mm(b, where);
  if (!(w > 0) || !(h > 0)) throw_input_error(where, "the frame must have a positive size");
  return {w, h};
}

std::pair<double, double> parse_minutes(const std::string& raw, const std::string& where) {
  std::string t = strip(raw);
  for (const char* suffix : {"min", "'"}) {
    std::string s(suffix);
    if (t.size() > s.size() && t.ends_with(s)) t.resize(t.size() - s.size());
  }
  std::size_t x = t.find('x');
  std::string a = x == std::string::npos ? t : t.substr(0, x);
  std::string b = x == std::string::npos ? t : t.substr(x + 1);
  auto va = number_and_unit(a), vb = number_and_unit(b);
  if (!va || !vb || !va->second.empty() || !vb->second.empty() || !(va->first > 0) ||
      !(vb->first > 0) || va->first > 360 * 60 || vb->first > 180 * 60) {
    throw_input_error(
        where, "expected a cell size in minutes of arc such as 7.5x7.5, got \"" + raw + "\"");
  }
  return {va->first, vb->first};
}

Box parse_box(const std::string& raw, const std::string& where) {
  std::vector<std::string> parts = split_list(strip(raw));
  std::vector<double> v;
  for (const auto& p : parts) {
    auto n = number_and_unit(p);
    if (!n || !n->second.empty()) break;
    v.push_back(n->first);
  }
  if (v.size() != 4 || !(v[0] < v[2]) || !(v[1] < v[3])) {
    throw_input_error(where, "expected minx,miny,maxx,maxy with min < max, got \"" + raw + "\"");
  }
  for (double c : v) {
    if (std::abs(c) > config::bounds::max_abs_coordinate) {
      throw_input_error(
          where, "expected coordinates of at most 1e9 in the CRS's units, got \"" + raw + "\"");
    }
  }
  return Box::of(v[0], v[1], v[2], v[3]);
}

std::vector<std::string> split_list(const std::string& text) {
  std::vector<std::string> out;
  std::string cur;
  for (char c : text) {
    if (c == ',') {
      if (!cur.empty()) out.push_back(cur);
      cur.clear();
    } else {
      cur.push_back(c);
    }
  }
  if (!cur.empty()) out.push_back(cur);
  return out;
}

}  // namespace sheetmill::batch
