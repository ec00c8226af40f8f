#include "config/yaml_limits.hpp"

#include <yaml-cpp/eventhandler.h>
#include <yaml-cpp/exceptions.h>
#include <yaml-cpp/mark.h>
#include <yaml-cpp/parser.h>

#include <sstream>
#include <unordered_map>
#include <vector>

#include "sheetmill/core/error.hpp"

namespace sheetmill::config::detail {

namespace {

// Walks the parser's events once, counting the nodes each anchor stands for. Memory is bounded
// by the number of anchors and the nesting depth, never by the expanded size.
class LimitCounter : public YAML::EventHandler {
 public:
  explicit LimitCounter(std::string name) : name_(std::move(name)) {}

  void OnDocumentStart(const YAML::Mark&) override {}
  void OnDocumentEnd() override {}
  void OnNull(const YAML::Mark& mark, YAML::anchor_t anchor) override { leaf(mark, anchor); }
  void OnScalar(const YAML::Mark& mark, const std::string&, YAML::anchor_t anchor,
                const std::string&) override {
    leaf(mark, anchor);
  }
  void OnAlias(const YAML::Mark& mark, YAML::anchor_t anchor) override {
    for (const Open& o : open_) {
      if (o.anchor == anchor) fail(mark, "an alias refers to the anchor it is inside of");
    }
    auto it = anchored_size_.find(anchor);
    add(mark, it == anchored_size_.end() ? 1 : it->second);
  }
  void OnSequenceStart(const YAML::Mark& mark, const std::string&, YAML::anchor_t anchor,
                       YAML::EmitterStyle::value) override {
    start(mark, anchor);
  }
  void OnSequenceEnd() override { end(); }
  void OnMapStart(const YAML::Mark& mark, const std::string&, YAML::anchor_t anchor,
                  YAML::EmitterStyle::value) override {
    start(mark, anchor);
  }
  void OnMapEnd() override { end(); }

 private:
  struct Open {
    YAML::anchor_t anchor;
    std::size_t total_at_start;
  };

  [[noreturn]] void fail(const YAML::Mark& mark, const std::string& what) const {
    throw_input_error(SourceLocation{name_, mark.line + 1, mark.column + 1, {}}, what);
  }
  void add(const YAML::Mark& mark, std::size_t nodes) {
    total_ += nodes;
    if (total_ > max_expanded_nodes) {
      fail(mark, "the document's aliases expand to more than " +
                     std::to_string(max_expanded_nodes) + " values; write the values out");
    }
  }
  void leaf(const YAML::Mark& mark, YAML::anchor_t anchor) {
    add(mark, 1);
    if (anchor != YAML::NullAnchor) anchored_size_[anchor] = 1;
  }
  void start(const YAML::Mark& mark, YAML::anchor_t anchor) {
    add(mark, 1);
    if (static_cast<int>(open_.size()) >= max_nesting_depth) {
      fail(mark,
           "mappings and lists nest more than " + std::to_string(max_nesting_depth) + " deep");
    }
    open_.push_back({anchor, total_ - 1});
  }
  void end() {
    Open o = open_.back();
    open_.pop_back();
    if (o.anchor != YAML::NullAnchor) anchored_size_[o.anchor] = total_ - o.total_at_start;
  }

  std::string name_;
  std::vector<Open> open_;
  std::unordered_map<YAML::anchor_t, std::size_t> anchored_size_;
  std::size_t total_ = 0;
};

}  // namespace

void check_yaml_limits(const std::string& text, const std::string& name) {
  if (text.size() > max_document_bytes) {
    throw_input_error(name, "larger than " + std::to_string(max_document_bytes >> 20) +
                                " MiB; a project or style file is a few kilobytes of YAML");
  }
  if (auto nul = text.find('\0'); nul != std::string::npos) {
    int line = 1, column = 1;
    for (std::size_t i = 0; i < nul; ++i) {
      column = text[i] == '\n' ? 1 : column + 1;
      line += text[i] == '\n' ? 1 : 0;
    }
    throw_input_error(SourceLocation{name, line, column, {}},
                      "a NUL byte: this is not a YAML text file");
  }
  std::istringstream in(text);
  YAML::Parser parser(in);
  LimitCounter counter(name);
  try {
    while (parser.HandleNextDocument(counter)) {
    }
  } catch (const YAML::ParserException&) {
    // Syntax errors are reported, with their place, by YAML::Load.
  }
}

}  // namespace sheetmill::config::detail
