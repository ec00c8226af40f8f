#pragma once
// Output file names built from untrusted tile-index values.
//
// Guarantees: a name returned by expand_output_name() is a relative path of one or more plain
// components, none of which is empty, ".", "..", a reserved device name (CON, PRN, AUX, NUL,
// COM1-9, LPT1-9, with or without an extension, any case), starts with a dot, ends with a dot or
// space, or holds a control character, a path separator or one of  : * ? " < > |. Invalid
// UTF-8 bytes are replaced. Each component is at most 200 bytes.

#include <filesystem>
#include <map>
#include <string>
#include <string_view>
#include <vector>

#include "sheetmill/batch/sheet_job.hpp"

namespace sheetmill::batch {

// Makes one untrusted value safe as (part of) a single file-name component. Never empty: an
// empty or all-unsafe value becomes "_".
std::string sanitise_component(std::string_view raw);

// Expands a template such as "{id}.pdf" or "{row}/{id}-{name}.pdf": each {field} is replaced
// by the sanitised value of that field ("id" and "name" are the sheet's; others come from the
// feature's attributes). "/" in the template itself separates folders. Throws Error(input)
// naming `where` for an unknown field or a template that is absolute or climbs with "..".
std::filesystem::path expand_output_name(const std::string& file_template, const SheetJob& job,
                                         const std::string& where);

// Throws Error(input) naming both sheets when two jobs have the same output, compared without
// regard to case (so the batch behaves the same on case-insensitive file systems).
void check_unique_outputs(const std::vector<SheetJob>& jobs, const std::string& where);

}  // namespace sheetmill::batch
