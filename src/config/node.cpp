#include "sheetmill/config/node.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <fstream>

#include "config/yaml_limits.hpp"
#include "sheetmill/config/bounds.hpp"
#include "sheetmill/core/scale_text.hpp"

namespace sheetmill::config {

namespace fs = std::filesystem;

ConfigNode::ConfigNode(YAML::Node node, std::shared_ptr<const std::string> file, std::string path)
    : node_(std::move(node)), file_(std::move(file)), path_(std::move(path)) {}

fs::path ConfigNode::base_dir() const {
  fs::path p(*file_);
  return p.has_parent_path() ? p.parent_path() : fs::path(".");
}

SourceLocation ConfigNode::location() const {
  SourceLocation where{*file_, 0, 0, path_};
  if (node_) {
    YAML::Mark m = node_.Mark();
    if (m.line >= 0) {
      where.line = m.line + 1;
      where.column = m.column + 1;
    }
  }
  return where;
}

void ConfigNode::fail(const std::string& message) const {
  throw_input_error(location(), message);
}

std::string ConfigNode::shown() const {
  if (!node_ || node_.IsNull()) return "nothing";
  if (node_.IsScalar()) return "\"" + node_.Scalar() + "\"";
  if (node_.IsSequence()) return "a list";
  return "a mapping";
}

void ConfigNode::fail_expected(const std::string& what) const {
  fail("expected " + what + ", got " + shown());
}

ConfigNode ConfigNode::child(const YAML::Node& n, std::string path) const {
  return ConfigNode(n, file_, std::move(path));
}

bool ConfigNode::has(std::string_view key) const {
  if (!node_.IsMap()) return false;
  for (const auto& kv : node_) {
    if (kv.first.Scalar() == key) return true;
  }
  return false;
}

std::optional<ConfigNode> ConfigNode::find(std::string_view key) const {
  if (!node_ || node_.IsNull()) return std::nullopt;
  if (!node_.IsMap()) fail_expected("a mapping");
  for (const auto& kv : node_) {
    if (kv.first.Scalar() == key) {
      std::string p = path_.empty() ? std::string(key) : path_ + "." + std::string(key);
      return child(kv.second, p);
    }
  }
  return std::nullopt;
}

ConfigNode ConfigNode::at(std::string_view key) const {
  auto n = find(key);
  if (!n) fail("missing required key '" + std::string(key) + "'");
  return *n;
}

void ConfigNode::expect_keys(const std::vector<std::string>& known) const {
  if (!node_ || node_.IsNull()) return;
  if (!node_.IsMap()) fail_expected("a mapping");
  for (const auto& kv : node_) {
    const std::string& key = kv.first.Scalar();
    if (std::find(known.begin(), known.end(), key) != known.end()) continue;
    std::string p = path_.empty() ? key : path_ + "." + key;
    ConfigNode k = child(kv.first, p);
    std::string near = closest_word(key, known);
    k.fail("unknown key '" + key + "'" + (near.empty() ? "" : "; did you mean '" + near + "'?"));
  }
}

void ConfigNode::expect_keys(std::initializer_list<std::string_view> known) const {
  std::vector<std::string> v(known.begin(), known.end());
  expect_keys(v);
}

std::vector<std::pair<std::string, ConfigNode>> ConfigNode::entries() const {
  std::vector<std::pair<std::string, ConfigNode>> out;
  if (!node_ || node_.IsNull()) return out;
  if (!node_.IsMap()) fail_expected("a mapping");
  for (const auto& kv : node_) {
    std::string key = kv.first.Scalar();
    out.emplace_back(key, child(kv.second, path_.empty() ? key : path_ + "." + key));
  }
  return out;
}

std::vector<ConfigNode> ConfigNode::items() const {
  std::vector<ConfigNode> out;
  if (!node_ || node_.IsNull()) return out;
  if (!node_.IsSequence()) fail_expected("a list");
  for (std::size_t i = 0; i < node_.size(); ++i) {
    out.push_back(child(node_[i], path_ + "[" + std::to_string(i) + "]"));
  }
  return out;
}

std::string ConfigNode::as_string() const {
  if (!node_.IsScalar()) fail_expected("text");
  return node_.Scalar();
}

namespace {
bool parse_double(std::string_view s, double& out) {
  while (!s.empty() && s.front() == ' ') s.remove_prefix(1);
  while (!s.empty() && s.back() == ' ') s.remove_suffix(1);
  if (s.empty()) return false;
  if (s.front() == '+') s.remove_prefix(1);
  auto res = std::from_chars(s.data(), s.data() + s.size(), out);
  return res.ec == std::errc() && res.ptr == s.data() + s.size() && std::isfinite(out);
}

// Splits "0.35mm" into 0.35 and "mm".
bool split_unit(const std::string& text, double& value, std::string& unit) {
  std::size_t i = text.size();
  while (i > 0 && std::isalpha(static_cast<unsigned char>(text[i - 1]))) --i;
  unit = text.substr(i);
  return parse_double(std::string_view(text).substr(0, i), value);
}
}  // namespace

double ConfigNode::as_number() const {
  double v = 0;
  if (!node_.IsScalar() || !parse_double(node_.Scalar(), v)) fail_expected("a number");
  return v;
}

int ConfigNode::as_int() const {
  double v = 0;
  if (!node_.IsScalar() || !parse_double(node_.Scalar(), v) || v != std::floor(v) ||
      std::abs(v) > 2e9) {
    fail_expected("a whole number");
  }
  return static_cast<int>(v);
}

bool ConfigNode::as_bool() const {
  if (node_.IsScalar()) {
    const std::string& s = node_.Scalar();
    if (s == "true" || s == "yes" || s == "on") return true;
    if (s == "false" || s == "no" || s == "off") return false;
  }
  fail_expected("true or false");
}

std::string ConfigNode::as_choice(std::initializer_list<std::string_view> choices) const {
  std::string list;
  for (auto c : choices) list += (list.empty() ? "" : ", ") + std::string(c);
  if (node_.IsScalar()) {
    for (auto c : choices) {
      if (node_.Scalar() == c) return node_.Scalar();
    }
  }
  fail_expected("one of " + list);
}

double ConfigNode::as_length_mm() const {
  double v = 0;
  std::string unit;
  if (node_.IsScalar() && split_unit(node_.Scalar(), v, unit)) {
    double mm = unit == "mm"   ? v
                : unit == "cm" ? v * 10
                : unit == "in" ? v * 25.4
                : unit == "pt" ? v * 25.4 / 72.0
                               : std::nan("");
    if (std::abs(mm) <= bounds::max_paper_length_mm) return mm;
    if (!std::isnan(mm)) {
      fail_expected("a length of at most 5080mm (200 in, the largest PDF page)");
    }
  }
  fail_expected("a length such as 0.35mm (units: mm, cm, in, pt)");
}

double ConfigNode::as_spacing_mm() const {
  double mm = as_length_mm();
  if (!(mm >= bounds::min_repeat_spacing_mm)) {
    fail_expected("a spacing of at least 0.1mm (finer repeats do not print)");
  }
  return mm;
}

double ConfigNode::as_ground_length_m() const {
  double v = 0;
  std::string unit;
  if (node_.IsScalar() && split_unit(node_.Scalar(), v, unit)) {
    double m = unit == "m"    ? v
               : unit == "km" ? v * 1000
               : unit == "ft" ? v * 0.3048
               : unit == "mi" ? v * 1609.344
                              : std::nan("");
    if (std::abs(m) <= bounds::max_ground_length_m) return m;
    if (!std::isnan(m)) fail_expected("a ground distance of at most 100000km");
  }
  fail_expected("a ground distance such as 10m (units: m, km, ft, mi)");
}

double ConfigNode::as_coordinate() const {
  double v = as_number();
  if (std::abs(v) > bounds::max_abs_coordinate) {
    fail_expected("a coordinate of at most 1e9 in the CRS's units");
  }
  return v;
}

double ConfigNode::as_angle_deg() const {
  double v = 0;
  std::string unit;
  if (node_.IsScalar() && split_unit(node_.Scalar(), v, unit) && (unit.empty() || unit == "deg")) {
    return v;
  }
  fail_expected("an angle in degrees such as 315 or 45deg");
}

double ConfigNode::as_scale() const {
  if (node_.IsScalar()) {
    if (auto n = parse_scale_denominator(node_.Scalar())) return *n;
  }
  fail_expected(kScaleExpected);
}

std::vector<double> ConfigNode::as_numbers(std::size_t n) const {
  if (!node_.IsSequence() || node_.size() != n) {
    fail_expected("a list of " + std::to_string(n) + " numbers");
  }
  std::vector<double> out;
  for (const auto& item : items()) out.push_back(item.as_number());
  return out;
}

std::vector<double> ConfigNode::as_coordinates(std::size_t n) const {
  as_numbers(n);
  std::vector<double> out;
  for (const auto& item : items()) out.push_back(item.as_coordinate());
  return out;
}

fs::path ConfigNode::as_path() const {
  fs::path p(as_string());
  if (p.is_absolute()) return p;
  return (base_dir() / p).lexically_normal();
}

std::string ConfigNode::as_data_source() const {
  std::string s = as_string();
  bool connection = s.find(':') != std::string::npos || s.rfind("/vsi", 0) == 0;
  return connection ? s : as_path().string();
}

namespace {
ConfigNode parse(const std::string& text, const std::string& name) {
  auto file = std::make_shared<const std::string>(name);
  detail::check_yaml_limits(text, name);
  YAML::Node root;
  try {
    root = YAML::Load(text);
  } catch (const YAML::ParserException& e) {
    throw_input_error(SourceLocation{name, e.mark.line + 1, e.mark.column + 1, {}},
                      "YAML syntax error: " + e.msg);
  }
  ConfigNode node(root, file, "");
  if (!root.IsMap()) node.fail_expected("a mapping of keys at the top of the document");
  return node;
}
}  // namespace

ConfigNode load_file(const fs::path& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw_input_error(path.string(), "file not found or not readable");
  // A bounded read: one byte past the limit is enough to refuse a huge file or a device that
  // never ends (/dev/zero), and nothing more is read.
  std::string text(detail::max_document_bytes + 1, '\0');
  in.read(text.data(), static_cast<std::streamsize>(text.size()));
  text.resize(static_cast<std::size_t>(in.gcount()));
  return parse(text, path.string());
}

ConfigNode load_string(const std::string& text, const std::string& name) {
  return parse(text, name);
}

std::string closest_word(std::string_view word, const std::vector<std::string>& candidates) {
  // Levenshtein distance; a suggestion is offered within a third of the word's length.
  auto distance = [](std::string_view a, std::string_view b) {
    std::vector<std::size_t> prev(b.size() + 1), cur(b.size() + 1);
    for (std::size_t j = 0; j <= b.size(); ++j) prev[j] = j;
    for (std::size_t i = 1; i <= a.size(); ++i) {
      cur[0] = i;
      for (std::size_t j = 1; j <= b.size(); ++j) {
        std::size_t sub = prev[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1);
        cur[j] = std::min({prev[j] + 1, cur[j - 1] + 1, sub});
      }
      std::swap(prev, cur);
    }
    return prev[b.size()];
  };
  std::string best;
  std::size_t best_d = std::max<std::size_t>(2, word.size() / 3) + 1;
  for (const auto& c : candidates) {
    std::size_t d = distance(word, c);
    if (d < best_d) {
      best_d = d;
      best = c;
    }
  }
  return best;
}

}  // namespace sheetmill::config
