#pragma once
// The stamp next to each batch output ("A01.pdf" -> "A01.pdf.stamp"): a small JSON file naming
// the digest of every input the sheet was rendered from. A sheet is up to date when its stamp's
// digest equals the digest of its current inputs AND the output file exists with the size the
// stamp recorded. The stamp is written (atomically) only after the output is in place, and
// removed before a sheet is rendered again, so a stamp never vouches for an output it did not
// see, whenever the batch is killed.

#include <cstdint>
#include <filesystem>
#include <map>
#include <optional>
#include <string>

namespace sheetmill::batch {

struct Stamp {
  std::string sheet_id;
  std::string digest;                        // 64 hex digits
  std::map<std::string, std::string> parts;  // input name -> its own digest
  std::uintmax_t output_bytes = 0;
  double seconds = 0;
  std::string rendered_utc;  // ISO 8601
  std::string program_version;
};

std::filesystem::path stamp_path(const std::filesystem::path& output);

// Atomically replaces the stamp of `output`.
void write_stamp(const std::filesystem::path& output, const Stamp& stamp);
// nullopt when absent or unreadable (a damaged stamp only costs a re-render).
std::optional<Stamp> read_stamp(const std::filesystem::path& output);
// Removes the stamp (if any) and makes the removal durable.
void remove_stamp(const std::filesystem::path& output);

// True when `output` exists, its stamp exists, the digests match and the size matches.
bool is_up_to_date(const std::filesystem::path& output, const std::string& digest);

// Now, as "2026-12-01T22:30:05Z".
std::string utc_now_iso();

}  // namespace sheetmill::batch
