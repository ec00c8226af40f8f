#pragma once
// Reading YAML documents (project and style files) with errors that point at the text.
//
// A ConfigNode is a YAML node together with the file it came from and its key path
// ("layers[3].line.width"). Every accessor either returns a value of the asked type or throws
// Error(input) "FILE:LINE:COL: KEY.PATH: expected ..., got ...". expect_keys() rejects unknown
// keys and suggests the closest known one. Nodes are cheap to copy (yaml-cpp nodes are handles).

#include <yaml-cpp/yaml.h>

#include <filesystem>
#include <initializer_list>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "sheetmill/core/error.hpp"

namespace sheetmill::config {

class ConfigNode {
 public:
  ConfigNode(YAML::Node node, std::shared_ptr<const std::string> file, std::string path);

  const std::string& path() const { return path_; }
  const std::string& file() const { return *file_; }
  // The folder relative paths in this document are resolved against.
  std::filesystem::path base_dir() const;
  SourceLocation location() const;
  const YAML::Node& yaml() const { return node_; }

  bool is_map() const { return node_.IsMap(); }
  bool is_sequence() const { return node_.IsSequence(); }
  bool is_scalar() const { return node_.IsScalar(); }
  bool is_null() const { return !node_ || node_.IsNull(); }

  // Map access. at() throws "missing required key"; find() returns nullopt when absent.
  bool has(std::string_view key) const;
  ConfigNode at(std::string_view key) const;
  std::optional<ConfigNode> find(std::string_view key) const;
  // Rejects any key not in `known`, suggesting the closest known key.
  void expect_keys(std::initializer_list<std::string_view> known) const;
  void expect_keys(const std::vector<std::string>& known) const;
  // The entries of a map in document order, and the items of a sequence.
  std::vector<std::pair<std::string, ConfigNode>> entries() const;
  std::vector<ConfigNode> items() const;

  // Scalars.
  std::string as_string() const;
  double as_number() const;
  int as_int() const;
  bool as_bool() const;
  // One of `choices`; otherwise "expected one of a, b, c, got "x"".
  std::string as_choice(std::initializer_list<std::string_view> choices) const;

  // A length with its unit: mm, cm, m (paper metres, rarely), in, pt. Returns millimetres.
  // A bare number is an error: "expected a length such as 0.35mm, got "0.35"".
  // Bounded by bounds::max_paper_length_mm either way.
  double as_length_mm() const;
  // The repeat of marks, hatching or pattern symbols: a length of at least
  // bounds::min_repeat_spacing_mm.
  double as_spacing_mm() const;
  // A number within bounds::max_abs_coordinate of zero, and a list of exactly n of them.
  double as_coordinate() const;
  std::vector<double> as_coordinates(std::size_t n) const;
  // An angle in degrees; a bare number or a "deg" suffix.
  double as_angle_deg() const;
  // A ground distance with its unit: m, km, ft, mi. Returns metres, bounded by
  // bounds::max_ground_length_m.
  double as_ground_length_m() const;
  // A map scale: "1:25000", "1:25 000" or 25000 (core/scale_text.hpp). Returns N of 1:N.
  double as_scale() const;
  // A sequence of exactly n numbers.
  std::vector<double> as_numbers(std::size_t n) const;
  // A path, resolved against the document's folder unless absolute.
  std::filesystem::path as_path() const;
  // A data source for GDAL: a relative path resolved as as_path() does, or a connection string
  // or virtual path ("PG:...", "/vsicurl/...") kept as written.
  std::string as_data_source() const;

  template <class T>
  T get_or(std::string_view key, T fallback) const;

  [[noreturn]] void fail(const std::string& message) const;
  // "expected WHAT, got <the node as text>"
  [[noreturn]] void fail_expected(const std::string& what) const;

 private:
  ConfigNode child(const YAML::Node& n, std::string path) const;
  std::string shown() const;

  YAML::Node node_;
  std::shared_ptr<const std::string> file_;
  std::string path_;
};

// Loads a YAML file. A missing file, a syntax error, or a document that is not a map throws
// Error(input) with the file and line:column.
ConfigNode load_file(const std::filesystem::path& path);
// Parses YAML text (tests, inline documents); `name` stands in for the file name in messages.
ConfigNode load_string(const std::string& text, const std::string& name);

// The closest of `candidates` to `word` by edit distance, or "" when none is close.
std::string closest_word(std::string_view word, const std::vector<std::string>& candidates);

template <>
inline double ConfigNode::get_or<double>(std::string_view key, double fallback) const {
  auto n = find(key);
  return n ? n->as_number() : fallback;
}
template <>
inline int ConfigNode::get_or<int>(std::string_view key, int fallback) const {
  auto n = find(key);
  return n ? n->as_int() : fallback;
}
template <>
inline bool ConfigNode::get_or<bool>(std::string_view key, bool fallback) const {
  auto n = find(key);
  return n ? n->as_bool() : fallback;
}
template <>
inline std::string ConfigNode::get_or<std::string>(std::string_view key,
                                                   std::string fallback) const {
  auto n = find(key);
  return n ? n->as_string() : fallback;
}

}  // namespace sheetmill::config
