// A key written twice in one mapping is almost always a mistake (the YAML reader would quietly
// keep one of them), so the style refuses it before reading any value.
#include <map>

#include "style/reader.hpp"

namespace sheetmill::style::detail {

namespace {

void walk(const YAML::Node& node, const std::string& path,
          const std::shared_ptr<const std::string>& file) {
  if (node.IsSequence()) {
    for (std::size_t i = 0; i < node.size(); ++i) {
      walk(node[i], path + "[" + std::to_string(i) + "]", file);
    }
    return;
  }
  if (!node.IsMap()) return;
  std::map<std::string, int> seen;  // key -> line of first use
  for (const auto& kv : node) {
    if (!kv.first.IsScalar()) continue;
    const std::string& key = kv.first.Scalar();
    std::string child = path.empty() ? key : path + "." + key;
    auto [it, fresh] = seen.emplace(key, kv.first.Mark().line + 1);
    if (!fresh) {
      ConfigNode(kv.first, file, child)
          .fail("duplicate key '" + key + "' (first on line " + std::to_string(it->second) + ")");
    }
    walk(kv.second, child, file);
  }
}

}  // namespace

void reject_duplicate_keys(const ConfigNode& root) {
  walk(root.yaml(), root.path(), std::make_shared<const std::string>(root.file()));
}

}  // namespace sheetmill::style::detail
