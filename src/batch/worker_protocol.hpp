#pragma once
// Private to the batch runner: the byte format of the messages between the batch process and
// its workers (a 4-byte length, then the fields), and blocking reads and writes on pipes.

#include <cstdint>
#include <optional>
#include <string>

#include "sheetmill/batch/runner.hpp"

namespace sheetmill::batch::detail {

std::string encode_outcome(const SheetOutcome& o);
// Throws Error(internal) on a malformed message.
SheetOutcome decode_outcome(const std::string& payload);

// Writes all of `bytes`; false on a broken pipe.
bool write_all(int fd, const std::string& bytes);
// A 4-byte little-endian length followed by the payload.
std::string frame(const std::string& payload);
// Reads exactly n bytes; false on end of file.
bool read_exact(int fd, void* buf, std::size_t n);

}  // namespace sheetmill::batch::detail
