#pragma once
// Private to the print stage: the XMP packet a PDF/X-4 file carries (ISO 15930-7 section 6.7.2,
// XMP as ISO 16684-1): the document information repeated, the PDF/X version, and the document
// and version identifiers PDF/X-4 asks for.

#include <ctime>
#include <string>

namespace sheetmill::print::detail {

struct XmpFacts {
  std::string title, subject, keywords, author, creator, producer;
  std::time_t when = 0;
};

std::string xmp_packet(const XmpFacts& facts);

}  // namespace sheetmill::print::detail
