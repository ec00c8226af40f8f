#pragma once
// UTF-8 checks and a safe way to show untrusted text (IDs, names, field values) in a message.
//
// A message goes to a terminal: raw control characters could move the cursor or hide text, and
// bidirectional overrides (U+202E) make two different IDs look the same or a harmless one look
// like another. quote_untrusted() shows every such character as an escape, so that what is printed
// is exactly what the data holds, on one line, and nothing in it acts on the terminal.

#include <cstddef>
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>

namespace sheetmill {

// Length of the well-formed UTF-8 sequence at s[i] (RFC 3629: no overlongs, no surrogates,
// nothing above U+10FFFF) with its code point in `cp`, or 0 if it is not one.
std::size_t utf8_sequence(std::string_view s, std::size_t i, std::uint32_t& cp);

// The byte offset of the first byte that does not start a well-formed sequence, if any.
std::optional<std::size_t> first_invalid_utf8(std::string_view s);

// Code points that would hide or reorder text: C1 controls, the bidirectional embeddings,
// overrides, isolates and marks, the line and paragraph separators, and the byte-order mark.
bool hides_or_reorders_text(std::uint32_t cp);

// `raw` in double quotes with \" and \\ escaped, C0/DEL as \n \t \xHH, invalid bytes as \xHH and
// the code points above as \u{HHHH}; longer than `max_bytes` of input, cut with "...".
std::string quote_untrusted(std::string_view raw, std::size_t max_bytes = 120);

}  // namespace sheetmill
