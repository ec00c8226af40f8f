#pragma once
// Writing JSON text by hand for the batch's reports and stamps: string escaping that always
// yields valid JSON (control characters escaped, invalid UTF-8 replaced by U+FFFD).

#include <string>
#include <string_view>

namespace sheetmill::batch {

// The value as a quoted JSON string.
std::string json_quote(std::string_view text);

// Untrusted text made safe for one log line: json_quote() without the quotes.
std::string display_text(std::string_view text);

// The value as one CSV field (RFC 4180): quoted when it holds a comma, quote, CR or LF; a
// leading = + - @ is prefixed with ' so spreadsheets do not run it as a formula (common practice
// against CSV injection).
std::string csv_field(std::string_view text);

}  // namespace sheetmill::batch
