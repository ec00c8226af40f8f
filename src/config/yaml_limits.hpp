#pragma once
// Limits on a YAML document checked before it is turned into nodes, so that no file can make
// the readers recurse for ever or do work far beyond its size.
//
// YAML aliases let a few lines stand for an exponential number of nodes ("billion laughs"),
// and an alias inside its own anchor makes a node that contains itself; both are refused here
// with the line:column of the alias. The limits are far above what a project or style needs
// (the shipped styles have under 2,000 nodes and nest 8 deep).

#include <cstddef>
#include <string>

namespace sheetmill::config::detail {

// The largest project or style file read: bigger files (or /dev/zero) are refused unread.
inline constexpr std::size_t max_document_bytes = 4u << 20;
// The deepest nesting of mappings and lists.
inline constexpr int max_nesting_depth = 64;
// The most nodes a document may stand for once every alias is expanded.
inline constexpr std::size_t max_expanded_nodes = 200'000;

// Throws Error(input) "NAME:LINE:COL: ..." when `text` breaks one of the limits above or is not
// text (a NUL byte). A YAML syntax error is left for the parser proper to report.
void check_yaml_limits(const std::string& text, const std::string& name);

}  // namespace sheetmill::config::detail
